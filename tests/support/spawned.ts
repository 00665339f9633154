// A built server in a process of its own, for tests that start it in a way useBuiltApp does not:
// without a setting, with a broken database, without a library, under a file-size limit or a faked
// clock (`wrap`: a command the node process is started through, e.g. prlimit), killed with SIGKILL
// and started again on the same file, or as one of several processes on one server database.
// Its log is kept; stop() waits for exit.
import { spawn, type ChildProcess } from 'node:child_process'
import { resolve } from 'node:path'
import { rootDir, serverPort, tempDatabasePath } from './app'

export interface SpawnedApp {
  base: string
  child: ChildProcess
  log: () => string
  exited: Promise<number | null>
  stop: () => Promise<void>
  /** Sends a signal (SIGKILL: no clean-up at all) and waits for the process to end. */
  kill: (signal: NodeJS.Signals) => Promise<void>
}

export interface SpawnOptions {
  nodeArgs?: string[]
  /** The port to listen on (default: a free one from this worker's slice, app.ts). */
  port?: number
  /** A command and its arguments that start node, e.g. ['prlimit', '--fsize=1000000', '--']. */
  wrap?: string[]
}

export async function spawnBuiltApp(env: Record<string, string | undefined>, options: SpawnOptions = {}): Promise<SpawnedApp> {
  const port = options.port ?? await serverPort()
  const base = `http://127.0.0.1:${port}`
  const [command, ...args] = [...(options.wrap ?? []), process.execPath, ...(options.nodeArgs ?? []), resolve(rootDir, '.output/server/index.mjs')]
  const child = spawn(command!, args, {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      NUXT_DATABASE_PATH: tempDatabasePath('spawned'),
      NUXT_DATABASE_SEED: 'always',
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
  return {
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
    async kill(signal) {
      if (child.exitCode !== null || child.signalCode !== null) return
      child.kill(signal)
      await exited
    },
  }
}

/** Polls /api/health until `ready` says yes; its last answer. */
export async function waitForHealth(app: SpawnedApp, ready: (status: number, body: { status?: string }) => boolean) {
  for (let i = 0; i < 600; i++) {
    const res = await fetch(`${app.base}/api/health`).catch(() => null)
    if (res) {
      const body = await res.json().catch(() => ({}))
      if (ready(res.status, body)) return { status: res.status, body }
    }
    await new Promise((r) => setTimeout(r, 50))
  }
  throw new Error(`the spawned app never answered as expected:\n${app.log()}`)
}
