// The due-timer tick. Timers are deadlines, so nothing counts down here: every quarter second
// the engine looks for running timers whose deadline has passed (also those that fell due while
// the server was down, loaded first) and marks them due. A tick never overlaps the one before.
import type { ShootEngine } from './engine'

export const TICK_MS = 250

/**
 * `work` every `everyMs`, a turn skipped while the one before still runs; a failure is logged with
 * `failed` and the next turn comes as usual. `run` is one turn now (skipped too if one is under way).
 */
export function repeatWithoutOverlap(work: () => Promise<unknown>, everyMs: number, failed: string) {
  let running = false
  const run = async () => {
    if (running) return
    running = true
    try {
      await work()
    } catch (error) {
      console.error(`[hobline] ${failed}:`, error)
    } finally {
      running = false
    }
  }
  const timer = setInterval(run, everyMs)
  return { run, timer, stop: () => clearInterval(timer) }
}

export function startTicker(engine: Pick<ShootEngine, 'tick' | 'loadLive'>, everyMs = TICK_MS) {
  const ticks = repeatWithoutOverlap(() => engine.tick(), everyMs, 'due-timer tick failed')
  const started = engine.loadLive().then(ticks.run).catch((error) => console.error('[hobline] could not load live shoots:', error))
  return { started, stop: ticks.stop }
}
