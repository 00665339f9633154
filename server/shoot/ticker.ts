// The due-timer tick. Timers are deadlines, so nothing counts down here: every quarter second
// the engine looks for running timers whose deadline has passed (also those that fell due while
// the server was down, loaded first) and marks them due. A tick never overlaps the one before.
import type { ShootEngine } from './engine'

export const TICK_MS = 250

export function startTicker(engine: Pick<ShootEngine, 'tick' | 'loadLive'>, everyMs = TICK_MS) {
  let ticking = false
  const tick = async () => {
    if (ticking) return
    ticking = true
    try {
      await engine.tick()
    } catch (error) {
      console.error('[hobline] due-timer tick failed:', error)
    } finally {
      ticking = false
    }
  }
  const started = engine.loadLive().then(tick).catch((error) => console.error('[hobline] could not load live shoots:', error))
  const timer = setInterval(tick, everyMs)
  return {
    started,
    stop() {
      clearInterval(timer)
    },
  }
}
