// Real socket.io-client connections to the built app, with the cookie of an HTTP client.
import { url } from '@nuxt/test-utils/e2e'
import { io, type Socket } from 'socket.io-client'
import type { ShootState } from '../../shared/types/shoot'
import type { ClientToServerEvents, ServerToClientEvents, ShootEventMessage } from '../../shared/types/socket-events'
import { applyShootMessage } from '../../shared/utils/shoot-wire'
import { appOrigin, type Client, type Json } from './client'

/** A message as received, with the state a screen holds once it is applied (null: it did not apply to the state held, a screen would ask for a snapshot). */
export type ReceivedMessage = ShootEventMessage & { state: ShootState }

/** `held`: the state of each shoot as a screen builds it, from the last join or snapshot answered through emitAck and the patches since. */
export type TestSocket = Socket<ServerToClientEvents, ClientToServerEvents> & { received: ReceivedMessage[]; held: Map<number, ShootState> }

/** Keeps `received` and `held` on a new socket as a screen does: each event's patch applied to the state held. */
export function heldFromEvents(socket: TestSocket) {
  socket.received = []
  socket.held = new Map()
  socket.on('shoot:event', (m) => {
    const state = applyShootMessage(socket.held.get(m.shootId) ?? null, m)
    if (state) socket.held.set(m.shootId, state)
    socket.received.push({ ...m, state: state as ShootState })
  })
}

/** A socket of `client` (to its server: the file's built app, or the one at client.base). */
export function connect(client: Client | null, transport: 'websocket' | 'polling' = 'websocket'): Promise<TestSocket> {
  const socket = io(client?.url('/') ?? url('/'), {
    path: '/socket.io',
    transports: [transport],
    // The app's own Origin, as a browser sends on the handshake (server/utils/same-origin.ts).
    extraHeaders: { origin: client?.origin() ?? appOrigin(), ...(client?.cookie ? { cookie: client.cookie } : {}) },
    reconnection: false,
    forceNew: true,
  }) as TestSocket
  heldFromEvents(socket)
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket))
    socket.once('connect_error', reject)
  })
}

export function emitAck<T = Json>(socket: TestSocket, event: string, payload: unknown): Promise<T> {
  return new Promise((resolve) => (socket as unknown as { emit: (e: string, p: unknown, cb: (r: T) => void) => void }).emit(event, payload, (reply) => {
    const snapshot = reply as { ok?: boolean; shoot?: { id: number }; state?: ShootState }
    const held = snapshot.shoot ? socket.held?.get(snapshot.shoot.id) : undefined
    if (snapshot.ok && snapshot.shoot && snapshot.state && !(held && held.seq > snapshot.state.seq)) socket.held?.set(snapshot.shoot.id, snapshot.state)
    resolve(reply)
  }))
}

export async function waitFor<T>(check: () => T | undefined | false, ms = 3000): Promise<T> {
  const start = Date.now()
  for (;;) {
    const v = check()
    if (v) return v
    if (Date.now() - start > ms) throw new Error('waited too long')
    await new Promise((r) => setTimeout(r, 10))
  }
}
