// The built server killed with SIGKILL while it migrates and seeds a new database: the file must
// stay sound, and the next start must finish the job.
import { spawn } from 'node:child_process'
import { resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { rootDir, tempDatabasePath } from '../support/app'
import { integrityCheck, queryFile } from '../support/sqlite'
import { getRandomPort } from 'get-port-please'

function startServer(databasePath: string, port: number) {
  return spawn(process.execPath, [resolve(rootDir, '.output/server/index.mjs')], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      NUXT_DATABASE_PATH: databasePath,
      NUXT_DATABASE_SEED: 'always',
      NUXT_SESSION_PASSWORD: 'test-session-password-of-at-least-32-characters',
      NUXT_PUBLIC_SITE_URL: `http://127.0.0.1:${port}`,
    },
    stdio: 'ignore',
  })
}

async function waitForHealthy(port: number) {
  for (let i = 0; i < 200; i++) {
    const body = await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.json()).catch(() => null)
    if (body?.status === 'ok') return body
    await new Promise((r) => setTimeout(r, 50))
  }
  throw new Error('server did not become healthy')
}

describe('server killed during start-up', () => {
  it('leaves a sound database and recovers on the next start, at every kill moment tried', async () => {
    for (const delay of [80, 200, 350, 500, 700]) {
      const path = tempDatabasePath(`restart-${delay}`)
      const port = await getRandomPort('127.0.0.1')
      const first = startServer(path, port)
      await new Promise((r) => setTimeout(r, delay))
      first.kill('SIGKILL')
      await new Promise((r) => first.once('exit', r))
      try {
        expect(await integrityCheck(path)).toBe('ok')
      } catch (error) {
        // Killed before SQLite created the file: nothing to check yet.
        expect(String(error)).toMatch(/SQLITE_CANTOPEN/)
      }
      const second = startServer(path, port)
      try {
        const health = await waitForHealthy(port)
        expect(health.migrations.pending).toEqual([])
        const studios = await queryFile<{ n: number }>(path, 'SELECT COUNT(*) AS n FROM studios')
        expect(studios[0]!.n).toBe(1)
        expect(await integrityCheck(path)).toBe('ok')
      } finally {
        second.kill('SIGTERM')
        await new Promise((r) => second.once('exit', r))
      }
    }
  }, 120_000)
})
