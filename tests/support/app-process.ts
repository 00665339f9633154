// Built app processes started side by side on one database and one Redis (tests/server/scale-out.test.ts),
// each on a port of the worker's slice, each reached directly by its own address: an HTTP client with
// a cookie jar and socket.io connections over WebSocket (a load balancer would keep each screen on one
// process; here the test picks the process).
import { spawn, type ChildProcess } from 'node:child_process'
import { resolve } from 'node:path'
import { io } from 'socket.io-client'
import { rootDir, serverPort, tempDatabasePath } from './app'
import type { Json, Reply } from './client'
import type { TestSocket } from './sockets'

export interface AppProcess {
  base: string
  child: ChildProcess
  log: () => string
  exited: Promise<number | null>
  stop: () => Promise<void>
}

export async function startAppProcess(env: Record<string, string>): Promise<AppProcess> {
  const port = await serverPort()
  const base = `http://127.0.0.1:${port}`
  const child = spawn(process.execPath, [resolve(rootDir, '.output/server/index.mjs')], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      NUXT_DATABASE_PATH: tempDatabasePath('unused'),
      NUXT_DATABASE_SEED: 'never',
      NUXT_SESSION_PASSWORD: 'test-session-password-of-at-least-32-characters',
      NUXT_PUBLIC_SITE_URL: base,
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let log = ''
  child.stdout!.on('data', (c) => (log += c))
  child.stderr!.on('data', (c) => (log += c))
  const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)))
  const app: AppProcess = {
    base,
    child,
    log: () => log,
    exited,
    async stop() {
      if (child.exitCode !== null || child.signalCode !== null) return
      child.kill('SIGTERM')
      const timer = setTimeout(() => child.kill('SIGKILL'), 10_000)
      await exited
      clearTimeout(timer)
    },
  }
  for (let i = 0; ; i++) {
    const body = await fetch(`${base}/api/health`).then((r) => r.json()).catch(() => null)
    if (body?.status === 'ok') return app
    if (i > 1200 || child.exitCode !== null) throw new Error(`the app process on ${base} did not become healthy:\n${log}`)
    await new Promise((r) => setTimeout(r, 50))
  }
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
  socket.received = []
  socket.presences = []
  socket.on('shoot:event', (m) => socket.received.push(m))
  socket.on('shoot:presence', (m) => socket.presences.push(m))
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket))
    socket.once('connect_error', reject)
  })
}
