// Start the built app for one test file: its own temporary database, its own port.
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import type { ChildProcess } from 'node:child_process'
import { $fetch, setup, useTestContext } from '@nuxt/test-utils/e2e'
import { checkPort } from 'get-port-please'
import { afterEach, beforeAll } from 'vitest'
import { chromiumLaunchOptions } from './chromium'

export const rootDir = resolve(import.meta.dirname, '../..')

export interface AppOptions {
  browser?: boolean
  seed?: 'always' | 'never'
  env?: Record<string, string>
}

export function tempDatabasePath(label = 'test'): string {
  return join(mkdtempSync(join(tmpdir(), `hobline-${label}-`)), 'hobline.sqlite')
}

/**
 * A free port below Linux's ephemeral range (32768–60999). A random port inside that range can be
 * taken by another test file's outgoing connection between the check and the server's listen
 * (seen once in CI as EADDRINUSE). Each vitest worker draws from its own slice of 500 ports, so two
 * files running at once never race for the same port (two random draws from one range collided in
 * CI); within a worker the draws move forward, so a port freed a moment ago is not taken again.
 */
let nextInSlice = Math.floor(Math.random() * 500)
export async function serverPort(): Promise<number> {
  const worker = Number(process.env.VITEST_POOL_ID ?? process.env.VITEST_WORKER_ID ?? 0) % 24
  const sliceStart = 20000 + worker * 500
  for (let i = 0; i < 500; i++) {
    const port = sliceStart + (nextInSlice++ % 500)
    if (await checkPort(port, '127.0.0.1')) return port
  }
  throw new Error(`no free port between ${sliceStart} and ${sliceStart + 499} for the test server`)
}

/** Registers the suite's beforeAll/afterAll. Returns the database path the server uses. */
export async function useBuiltApp(options: AppOptions = {}): Promise<{ databasePath: string }> {
  const databasePath = tempDatabasePath()
  // nuxt-auth-utils refuses to seal sessions without a 32+ character password.
  process.env.NUXT_SESSION_PASSWORD ||= 'test-session-password-of-at-least-32-characters'
  const port = await serverPort()
  await setup({
    rootDir,
    build: false,
    server: true,
    port,
    browser: options.browser ?? false,
    browserOptions: { type: 'chromium', launch: chromiumLaunchOptions() },
    nuxtConfig: { nitro: { output: { dir: resolve(rootDir, '.output') } } },
    setupTimeout: 120_000,
    env: {
      NUXT_DATABASE_PATH: databasePath,
      NUXT_DATABASE_SEED: options.seed ?? 'always',
      // The built server refuses to start without its public address (server/plugins/00.site-url.ts).
      NUXT_PUBLIC_SITE_URL: `http://127.0.0.1:${port}`,
      // Every test client comes from 127.0.0.1: the per-address limits on new accounts and reset
      // requests are set high here, and tested at their size in throttle.test.ts.
      NUXT_AUTH_SIGNUP_PER_ADDRESS: '10000',
      NUXT_AUTH_RESET_PER_ADDRESS: '10000',
      ...options.env,
    },
  })
  // Nitro listens before the database plugin has finished migrating: wait for it.
  beforeAll(async () => {
    for (let i = 0; i < 300; i++) {
      const health = await $fetch<{ status: string }>('/api/health').catch(() => null)
      if (health?.status === 'ok') return
      await new Promise((r) => setTimeout(r, 50))
    }
    throw new Error('the built app never reported a healthy database')
  })
  // A server under test that died is named, with its exit and last log lines, instead of leaving
  // the next test to fail with "connection refused".
  afterEach(() => {
    const ctx = useTestContext()
    const child = (ctx.serverProcess as unknown as { process?: ChildProcess } | undefined)?.process
    if (child && (child.exitCode !== null || child.signalCode !== null)) {
      throw new Error(`the built app under test exited (${child.exitCode ?? child.signalCode}); its last log lines:\n${ctx.serverLogs.slice(-40).join('\n')}`)
    }
  })
  return { databasePath }
}
