// The socket.io event map, shared by the server plugin and the client store.
import type { ShootCommandError, ShootEvent, ShootState } from './shoot'

export interface ShootInfo {
  id: number
  studioId: number
  episodeId: number | null
  title: string
  mode: 'rehearsal' | 'take'
}

/** Everything a screen needs to draw a shoot from scratch. */
export interface ShootSnapshot {
  shoot: ShootInfo
  state: ShootState
  /** The server clock when the snapshot was made (a first guess at the offset until clock:ping samples). */
  serverNow: number
  /** Who is asking, in the role the shoot knows them by. */
  you: { kind: 'member' | 'device'; role: string; actorId: string }
  /** Step texts and cues for the run order, by step id. */
  steps: Record<string, { recipeId: number; recipeTitle: string; position: number; text: string; handsOn: boolean; durationMin: number | null; durationMax: number | null; cameraShot: string | null; cameraNote: string | null; cautions: string[]; script: string[] }>
}

/** Broadcast to a shoot's room for every accepted command and every timer that falls due. */
export interface ShootEventMessage {
  shootId: number
  seq: number
  /** The command type, or 'timer.due' for the server's own tick. */
  type: string
  by: { role: string; id: string; name?: string } | null
  events: ShootEvent[]
  state: ShootState
  serverNow: number
  /** Wall-clock ms (sub-millisecond) when the server handed the message to socket.io. */
  sentAt?: number
}

export type SocketAck<T> = ({ ok: true } & T) | { ok: false; error: ShootCommandError | { code: string; message: string } }

export interface ClientToServerEvents {
  'shoot:join': (payload: { shootId: number }, ack: (reply: SocketAck<ShootSnapshot>) => void) => void
  'shoot:leave': (payload: { shootId: number }) => void
  'shoot:snapshot': (payload: { shootId: number }, ack: (reply: SocketAck<ShootSnapshot>) => void) => void
  'shoot:command': (payload: { shootId: number; type: string; [field: string]: unknown }, ack: (reply: SocketAck<{ seq: number }>) => void) => void
  'clock:ping': (payload: { t1: number }, ack: (reply: { t1: number; t2: number; t3: number }) => void) => void
}

export interface ServerToClientEvents {
  'shoot:event': (message: ShootEventMessage) => void
}
