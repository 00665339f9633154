// Vitest global setup for the server and browser layers: build the app once per test run.
// HOBLINE_TEST_NO_BUILD=1 reuses an existing .output (handy while iterating on tests only).
import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { resolve } from 'node:path'

export const rootDir = resolve(import.meta.dirname, '../..')

export default function setup() {
  if (process.env.HOBLINE_TEST_BUILT === '1') return
  const reuse = process.env.HOBLINE_TEST_NO_BUILD === '1' && existsSync(resolve(rootDir, '.output/server/index.mjs'))
  if (!reuse) {
    console.log('[tests] building the app once for the server and browser tests…')
    execFileSync('npx', ['nuxt', 'build'], { cwd: rootDir, stdio: ['ignore', 'ignore', 'inherit'] })
  }
  // The projects' global setups run in this one process, so the second project sees the flag.
  process.env.HOBLINE_TEST_BUILT = '1'
}
