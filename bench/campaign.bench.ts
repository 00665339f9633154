// The generated-input campaign at a larger size than CI runs it: tests/server/campaign.test.ts with
// 3,000 payloads for every mutating route and socket command (CI: 1,000). The figure is the longest
// stretch the server's event loop was held over the whole campaign (tests/support/loop-probe.mjs),
// bound 100 ms; the baseline is the same measure while the server sits idle for 2 s before it.
import { spawnSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { resolve } from 'node:path'
import type { Benchmark } from './types'

const rootDir = resolve(import.meta.dirname, '..')
const RUNS = 3000

export const campaign: Benchmark = {
  name: `generated-input campaign, ${RUNS} payloads per route and socket command: longest hold of the event loop`,
  group: 'campaign',
  async run() {
    if (!existsSync(resolve(rootDir, '.output/server/index.mjs'))) spawnSync('npx', ['nuxt', 'build'], { cwd: rootDir, stdio: 'inherit' })
    const result = spawnSync('npx', ['vitest', 'run', 'tests/server/campaign.test.ts'], {
      cwd: rootDir, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024,
      env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0', HOBLINE_TEST_NO_BUILD: '1', HOBLINE_CAMPAIGN_RUNS: String(RUNS) },
    })
    const out = `${result.stdout}\n${result.stderr}`
    const total = /total (\d+) payloads, longest hold of the event loop ([\d.]+) ms, worst delay ([\d.]+) ms/.exec(out)
    const idle = /idle: loop held ([\d.]+) ms/.exec(out)
    if (!total) throw new Error(`the campaign printed no totals:\n${out.slice(-2000)}`)
    const failed = /Tests\s+.*?(\d+) failed/.exec(out)
    if (failed) throw new Error(`${failed[1]} campaign checks failed:\n${out.slice(-3000)}`)
    return {
      figure: Number(total[2]), unit: 'ms', baseline: idle ? Number(idle[1]) : undefined, bound: 100,
      note: `${total[1]} payloads, every one refused with a 4xx, tables unchanged; worst event-loop delay ${total[3]} ms`,
    }
  },
}
