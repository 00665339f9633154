// Starts the built app for a benchmark: its own temporary database, a free port, demo data.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { getRandomPort } from 'get-port-please'

export const rootDir = resolve(import.meta.dirname, '..')

export async function startBuiltApp(): Promise<{ url: string; databasePath: string; pid: number; stop: () => Promise<void> }> {
  if (!existsSync(resolve(rootDir, '.output/server/index.mjs'))) {
    const build = spawnSync('npx', ['nuxt', 'build'], { cwd: rootDir, stdio: ['ignore', 'ignore', 'inherit'] })
    if (build.status !== 0) throw new Error('the app did not build')
  }
  const databasePath = join(mkdtempSync(join(tmpdir(), 'hobline-bench-')), 'hobline.sqlite')
  const port = await getRandomPort('127.0.0.1')
  const child: ChildProcess = spawn(process.execPath, [...(process.env.HOBLINE_BENCH_NODE_ARGS?.split(' ').filter(Boolean) ?? []), resolve(rootDir, '.output/server/index.mjs')], {
    env: {
      ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DATABASE_PATH: databasePath, NUXT_DATABASE_SEED: 'always', NUXT_PUBLIC_SITE_URL: `http://127.0.0.1:${port}`,
      NUXT_SESSION_PASSWORD: 'bench-session-password-of-at-least-32-characters', NUXT_PHOTOS_DIR: join(databasePath, '..', 'photos'),
      // The shoot benchmarks send commands back to back on one socket to measure the server, not the
      // per-socket limit a screen has (server/utils/socket-session.ts).
      HOBLINE_SOCKET_COMMANDS_PER_SECOND: '1000000', HOBLINE_SOCKET_COMMAND_BURST: '1000000',
    },
    stdio: 'ignore',
  })
  // run.ts ends with process.exit, and a benchmark that throws never reaches its stop(): the server
  // goes with this process either way.
  const killOnExit = () => child.kill('SIGTERM')
  process.once('exit', killOnExit)
  const url = `http://127.0.0.1:${port}`
  for (let i = 0; i < 400; i++) {
    const health = await fetch(`${url}/api/health`).then((r) => r.json()).catch(() => null)
    if (health?.status === 'ok') break
    await new Promise((r) => setTimeout(r, 50))
  }
  return {
    url,
    databasePath,
    pid: child.pid!,
    stop: () => new Promise((done) => {
      process.off('exit', killOnExit)
      if (child.exitCode !== null || child.signalCode !== null) return done()
      child.once('exit', () => done())
      child.kill('SIGTERM')
    }),
  }
}

export async function signIn(url: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))
  if (!cookie) throw new Error(`sign-in failed: ${res.status}`)
  return cookie.split(';')[0]!
}
