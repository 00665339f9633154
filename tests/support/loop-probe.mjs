// Loaded into the server under test with NODE_OPTIONS=--import (tests/server/campaign.test.ts): how
// long the server's event loop was held. Two measures, both since the last reading:
// - maxMs: the largest event-loop delay by Node's perf_hooks.monitorEventLoopDelay (10 ms resolution).
//   It also grows when the process merely waits for a CPU (a busy machine), not only when code runs.
// - heldMs: the longest stretch the loop was busy running code: a 10 ms ticker measures each gap
//   between its ticks and the part of that gap the loop was active (performance.eventLoopUtilization;
//   time waiting for a CPU while idle counts as idle). A gap is held for min(gap, active).
// On SIGUSR2 it writes { seq, maxMs, p99Ms, heldMs } to HOBLINE_LOOP_PROBE_FILE (whole, by rename) and
// starts over; `seq` tells a reader the reading is new.
import { renameSync, writeFileSync } from 'node:fs'
import { monitorEventLoopDelay, performance } from 'node:perf_hooks'

const file = process.env.HOBLINE_LOOP_PROBE_FILE
if (file) {
  const histogram = monitorEventLoopDelay({ resolution: 10 })
  histogram.enable()
  let seq = 0
  let heldMs = 0
  let last = performance.now()
  let lastElu = performance.eventLoopUtilization()
  setInterval(() => {
    const now = performance.now()
    const elu = performance.eventLoopUtilization()
    const active = performance.eventLoopUtilization(elu, lastElu).active
    heldMs = Math.max(heldMs, Math.min(now - last, active))
    last = now
    lastElu = elu
  }, 10).unref()
  const write = (reading) => {
    writeFileSync(`${file}.tmp`, JSON.stringify(reading))
    renameSync(`${file}.tmp`, file)
  }
  write({ pid: process.pid, seq })
  process.on('SIGUSR2', () => {
    write({ pid: process.pid, seq: ++seq, maxMs: histogram.max / 1e6, p99Ms: histogram.percentile(99) / 1e6, heldMs })
    histogram.reset()
    heldMs = 0
  })
}
