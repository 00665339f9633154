// With more than one app process, a timer started on one process must still ring if that process
// goes: every process reads the shoots that have not ended from the database again every few seconds
// (engine.loadLive), so its ticker watches timers it did not see started. Marking a timer due reads
// the shoot's row under lock (SELECT … FOR UPDATE on PostgreSQL, store-postgres.ts) and only marks
// what is still running, so two processes' tickers never ring the same timer twice.
import type { ShootEngine } from './engine'
import { repeatWithoutOverlap } from './ticker'

/** How often each process reads the live shoots again (NUXT_SHOOT_RELOAD_MS, default 2 s, at least 100 ms). */
export function reloadEveryMs(value: unknown): number {
  const n = Number(value)
  return Number.isFinite(n) && n >= 100 ? n : 2000
}

export function watchLiveShoots(engine: Pick<ShootEngine, 'loadLive'>, everyMs = 2000) {
  const reloads = repeatWithoutOverlap(() => engine.loadLive(), everyMs, 'could not read the live shoots again')
  reloads.timer.unref()
  return { stop: reloads.stop }
}
