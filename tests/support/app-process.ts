// Built app processes started side by side on one database and one Redis (tests/server/scale-out.test.ts),
// each on a port of the worker's slice, each reached directly by its own address: an HTTP client with
// a cookie jar and socket.io connections over WebSocket (a load balancer would keep each screen on one
// process; here the test picks the process).
import { io } from 'socket.io-client'
import { serverPort } from './app'
import type { Json, Reply } from './client'
import { heldFromEvents, type TestSocket } from './sockets'
import { spawnBuiltApp, waitForHealth, type SpawnedApp } from './spawned'

export type AppProcess = SpawnedApp

/** A built app process on a port of the worker's slice, once its health says ok (migrated). */
export async function startAppProcess(env: Record<string, string>): Promise<AppProcess> {
  const app = await spawnBuiltApp({ NUXT_DATABASE_SEED: 'never', ...env }, { port: await serverPort() })
  await waitForHealth(app, (status, body) => status === 200 && body.status === 'ok')
  return app
}

/** One person's cookie jar, talking to one process at a time (the cookie is valid on every process). */
export class ProcessClient {
  cookie = ''

  async call<T = Json>(app: AppProcess, method: string, path: string, body?: unknown): Promise<Reply<T>> {
    const res = await fetch(`${app.base}${path}`, {
      method,
      headers: {
        'accept': 'application/json',
        'origin': app.base,
        ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      redirect: 'manual',
    })
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))
    if (setCookie) this.cookie = setCookie.split(';')[0]!
    const text = await res.text()
    return { status: res.status, body: (text ? JSON.parse(text) : null) as T, headers: res.headers }
  }
}

/** A screen on one process: socket.io over WebSocket, with the person's cookie. */
export function connectTo(app: AppProcess, client: ProcessClient): Promise<TestSocket & { presences: Json[] }> {
  const socket = io(app.base, {
    path: '/socket.io',
    transports: ['websocket'],
    extraHeaders: { origin: app.base, ...(client.cookie ? { cookie: client.cookie } : {}) },
    reconnection: false,
    forceNew: true,
  }) as TestSocket & { presences: Json[] }
  heldFromEvents(socket)
  socket.presences = []
  socket.on('shoot:presence', (m) => socket.presences.push(m))
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket))
    socket.once('connect_error', reject)
  })
}
