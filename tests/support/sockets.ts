// Real socket.io-client connections to the built app, with the cookie of an HTTP client.
import { url } from '@nuxt/test-utils/e2e'
import { io, type Socket } from 'socket.io-client'
import type { ClientToServerEvents, ServerToClientEvents, ShootEventMessage } from '../../shared/types/socket-events'
import { appOrigin, type Client, type Json } from './client'

export type TestSocket = Socket<ServerToClientEvents, ClientToServerEvents> & { received: ShootEventMessage[] }

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
  socket.received = []
  socket.on('shoot:event', (m) => socket.received.push(m))
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket))
    socket.once('connect_error', reject)
  })
}

export function emitAck<T = Json>(socket: TestSocket, event: string, payload: unknown): Promise<T> {
  return new Promise((resolve) => (socket as unknown as { emit: (e: string, p: unknown, cb: (r: T) => void) => void }).emit(event, payload, resolve))
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
