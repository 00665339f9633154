// The socket.io event map, shared by the server plugin and the client store.
import type { ShootEvent, ShootState } from './shoot'
import type { ShootPatchOperation } from '../utils/shoot-wire'
import type { Refusal } from '../utils/domain-error'
import type { StepTextSegment } from '../utils/step-text'
import type { RenderedScript } from '../utils/live-fields'
import type { SegmentKind } from '../utils/show-segments'

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
  steps: Record<string, ShootStepDetails>
  /** The unit system amounts are shown in (the studio's). */
  units: 'metric' | 'us'
  /** The cook plan's length in ms, or null when the episode cannot be planned. */
  makespanMs: number | null
  /** Screens on the shoot now, for quiet on set: how many ring aloud while the camera rolls. */
  presence: ShootPresence
  /** The episode as a show, its live fields written from the data now; null for a shoot without an episode. */
  show: ShootShow | null
}

/** A segment of the show as the screens read it. */
export interface ShootShowSegment {
  kind: SegmentKind
  title: string
  recipeId: number | null
  /** The opening words (a recipe segment's are said at its first step; see ShootShow.atSteps). */
  script: RenderedScript
  closing: RenderedScript | null
  /** What the camera frames for a segment without steps. */
  shot: string
  /** Claims in plain words the data does not bear out: false, or not checkable. */
  claims: Array<{ text: string; verdict: 'false' | 'unknown'; detail: string }>
  missing: string[]
  plannedMs: number
}

/** A recipe segment's opening or closing words, at the step where they are said. */
export interface ShootShowLines { segmentId: string; title: string; script: RenderedScript }

export interface ShootShow {
  /** By the shoot's segment id (`segment-<id>`). */
  segments: Record<string, ShootShowSegment>
  /** A recipe's lines at the steps where the host says them, by step id: its opening at its first step in the run order, its closing at its last. */
  atSteps: Record<string, { opening?: ShootShowLines; closing?: ShootShowLines }>
  /** Planned time of each of the shoot's segments (the cooking side by side: its recipes' sum), by segment id. */
  plannedMs: Record<string, number>
  runtime: { totalMs: number; targetMs: number | null; overMs: number | null }
  wpm: number
  /** Lines that need a look: missing data and false claims. */
  flags: number
}

export interface ShootStepDetails {
  recipeId: number
  recipeTitle: string
  position: number
  /** As written, with raw {{key}} tokens. */
  text: string
  /** The text with amounts scaled in the shoot's units; an amount's segment names its ingredient. */
  segments: StepTextSegment[]
  /** The ingredients the step's text uses, with their scaled amounts. */
  ingredients: Array<{ key: string; item: string; amount: string }>
  /** EU allergen groups (Regulation (EU) No 1169/2011 Annex II) of those ingredients. */
  allergens: string[]
  /** The US major food allergens of those ingredients (FALCPA, FASTER Act), in the order the step uses them, when the studio works in US units; else empty. */
  allergensUs?: string[]
  /** Those ingredients whose allergens nobody has checked (suggested from the name, or none declared). */
  allergensUnchecked?: string[]
  handsOn: boolean
  durationMin: number | null
  durationMax: number | null
  cameraShot: string | null
  cameraNote: string | null
  cautions: string[]
  /** The cautions' texts (shared/utils/cautions.ts), so a screen shows them without that table. */
  cautionNotes: Array<{ id: string; label: string; text: string }>
  /** The lines to say, amounts written for the shoot (plain text). */
  script: string[]
  /** The same lines as segments, so a screen can mark the amounts in them. */
  scriptSegments?: StepTextSegment[][]
  /** Where the shoot's first plan put the step, in ms on the shoot clock; null when unplanned (the live plan is state.plan.live). */
  plannedStartMs: number | null
  plannedEndMs: number | null
  /** The step's short name ("Pasta water"), for its timer and cues; null when it has none. */
  name: string | null
  /** The step's photo (thumbnail and full size), shown small beside the script; null when it has none. */
  photo: { url: string; thumbUrl: string } | null
  /** At a recipe's last step: the recipe's photo, the plating reference. */
  plating: { url: string; thumbUrl: string } | null
}

export interface ShootPresence {
  screens: Array<{ role: string; audibleWhileRolling: boolean }>
}

/** Broadcast to a shoot's room for every accepted command and every timer that falls due: the change, not the whole state. */
export interface ShootEventMessage {
  shootId: number
  seq: number
  /** The command type, or 'timer.due' for the server's own tick. */
  type: string
  by: { role: string; id: string; name?: string } | null
  events: ShootEvent[]
  /** The sequence number of the state `patch` applies to (seq − 1): a screen holding another asks for a snapshot. */
  baseSeq: number
  /** JSON Patch (RFC 6902) from the state at baseSeq to the state at seq (shared/utils/shoot-wire.ts). */
  patch: ShootPatchOperation[]
  serverNow: number
  /** Wall-clock ms (sub-millisecond) when the server handed the message to socket.io. */
  sentAt?: number
}

/** Every acknowledgement: the answer, or a refusal in the one shape (shared/utils/domain-error.ts). */
export type SocketAck<T> = ({ ok: true } & T) | Refusal

export interface ClientToServerEvents {
  'shoot:join': (payload: { shootId: number }, ack: (reply: SocketAck<ShootSnapshot>) => void) => void
  'shoot:leave': (payload: { shootId: number }) => void
  'shoot:snapshot': (payload: { shootId: number }, ack: (reply: SocketAck<ShootSnapshot>) => void) => void
  'shoot:command': (payload: { shootId: number; type: string; [field: string]: unknown }, ack: (reply: SocketAck<{ seq: number }>) => void) => void
  'clock:ping': (payload: { t1: number }, ack: (reply: { t1: number; t2: number; t3: number }) => void) => void
  /** This screen's alarm setting, so the others know whether anyone rings while rolling. */
  'screen:alarm': (payload: { shootId: number; audibleWhileRolling: boolean }) => void
}

export interface ServerToClientEvents {
  'shoot:event': (message: ShootEventMessage) => void
  /** The script changed under an open shoot (a price, a recipe, the episode): the new one. */
  'shoot:script': (message: { shootId: number } & Pick<ShootSnapshot, 'steps' | 'units' | 'makespanMs' | 'show'>) => void
  'shoot:presence': (message: { shootId: number } & ShootPresence) => void
}
