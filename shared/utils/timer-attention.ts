// Which timer a one-key action means when several are live: "done" and "+1 min" on the host's
// keys and voice. Done acknowledges every timer ringing on this screen's clock, or, with none
// ringing, the timer at its "check it" moment that is nearest its end; +1 min goes to the timer
// ringing longest, else to the running or paused one with the least kitchen time left.
import type { ShootTimer } from '../types/shoot'
import { dueTimersAt } from './alarm-policy'
import { isShootTimerLive, timerChecking, timerRemainingMs } from './shoot-timers'

/** The timers "done" acknowledges now: those ringing; else the checked one nearest its end. */
export function timersToCallDone(timers: readonly ShootTimer[], nowServerMs: number): ShootTimer[] {
  const due = dueTimersAt(timers, nowServerMs)
  if (due.length) return due
  const checking = timers.filter((t) => timerChecking(t, nowServerMs))
  const nearest = soonest(checking, nowServerMs)
  return nearest ? [nearest] : []
}

/** The timer "+1 min" goes to: the one ringing longest, else the live one with least time left; null for none. */
export function timerForMoreTime(timers: readonly ShootTimer[], nowServerMs: number): ShootTimer | null {
  const due = dueTimersAt(timers, nowServerMs)
  if (due.length) return due.toSorted((a, b) => (a.dueAtServerMs ?? 0) - (b.dueAtServerMs ?? 0) || a.slot - b.slot)[0]!
  return soonest(timers.filter(isShootTimerLive), nowServerMs)
}

function soonest(timers: readonly ShootTimer[], nowServerMs: number): ShootTimer | null {
  return timers.toSorted((a, b) => timerRemainingMs(a, nowServerMs) - timerRemainingMs(b, nowServerMs) || a.slot - b.slot)[0] ?? null
}
