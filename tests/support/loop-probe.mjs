// Loaded into the server under test with NODE_OPTIONS=--import (tests/server/campaign.test.ts): the
// server's own event-loop delay, by Node's perf_hooks.monitorEventLoopDelay (10 ms resolution).
// On SIGUSR2 it writes the largest delay since the last signal, in ms, to HOBLINE_LOOP_PROBE_FILE
// and starts over, so a test can read the worst delay of each batch of requests it sends.
import { writeFileSync } from 'node:fs'
import { monitorEventLoopDelay } from 'node:perf_hooks'

const file = process.env.HOBLINE_LOOP_PROBE_FILE
if (file) {
  const histogram = monitorEventLoopDelay({ resolution: 10 })
  histogram.enable()
  writeFileSync(file, JSON.stringify({ pid: process.pid, maxMs: 0 }))
  process.on('SIGUSR2', () => {
    writeFileSync(file, JSON.stringify({ pid: process.pid, maxMs: histogram.max / 1e6, p99Ms: histogram.percentile(99) / 1e6 }))
    histogram.reset()
  })
}
