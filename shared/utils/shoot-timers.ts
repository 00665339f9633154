// Shoot timers as deadlines. A running timer is a deadline on the server clock and the speed it
// runs at (kitchen ms per server ms, see shoot-clock.ts); what is left is always drawn from the
// deadline, never counted down. A paused timer keeps its kitchen time left.
import type { ShootActor, ShootState, ShootTimer } from '../types/shoot'
import { shootClockAt } from './shoot-clock'

/** Running, paused or due: a timer that still holds its slot and needs someone's attention. */
export function isShootTimerLive(timer: ShootTimer): boolean {
  return timer.state === 'running' || timer.state === 'paused' || timer.state === 'due'
}

/**
 * Kitchen time left on a timer at a server time, in ms: (deadline − now) × speed while running,
 * the stored remainder while paused, 0 once due, acknowledged or cancelled. On a screen pass
 * serverNow(local now, offset) as the time.
 */
export function timerRemainingMs(timer: ShootTimer, nowServerMs: number): number {
  if (timer.state === 'running' && timer.deadlineServerMs !== null) {
    return Math.max(0, (timer.deadlineServerMs - nowServerMs) * timer.speed)
  }
  if (timer.state === 'paused') return timer.remainingMs ?? 0
  return 0
}

/** How long a due timer has been ringing, in server ms (0 for any other timer). */
export function timerOverdueMs(timer: ShootTimer, nowServerMs: number): number {
  if (timer.state !== 'due' || timer.dueAtServerMs === null) return 0
  return Math.max(0, nowServerMs - timer.dueAtServerMs)
}

/**
 * Which ring of a repeating alarm a due timer is on: 0 when it falls due, 1 after repeatEveryMs,
 * and so on until acknowledged; null when it is not due. Every screen derives the same number from
 * the server time, so repeats ring together and a reloaded screen picks up where the others are.
 */
export function timerAlarmRound(timer: ShootTimer, nowServerMs: number, repeatEveryMs: number): number | null {
  if (!(repeatEveryMs > 0)) throw new RangeError(`an alarm repeats after a positive time (got ${repeatEveryMs} ms)`)
  if (timer.state !== 'due') return null
  return Math.floor(timerOverdueMs(timer, nowServerMs) / repeatEveryMs)
}

/** A timer paused at a server time, keeping its kitchen time left (rounded up to the ms, so a timer
 * that has not rung never keeps 0 left). */
export function shootTimerPausedAt(timer: ShootTimer, nowServerMs: number, heldByShoot = false): ShootTimer {
  return {
    ...timer,
    state: 'paused',
    remainingMs: Math.ceil(timerRemainingMs(timer, nowServerMs)),
    deadlineServerMs: null,
    heldByShoot,
  }
}

/** A timer running from a server time with a kitchen time left, at a clock speed. */
export function shootTimerRunningFrom(timer: ShootTimer, nowServerMs: number, remainingMs: number, speed: number): ShootTimer {
  return {
    ...timer,
    state: 'running',
    deadlineServerMs: nowServerMs + remainingMs / speed,
    remainingMs: null,
    speed,
    heldByShoot: false,
    dueAtServerMs: null,
    acknowledgedBy: null,
    acknowledgedAtServerMs: null,
  }
}

/** A timer due at a server time (its deadline, or now when time was taken off). */
export function shootTimerDueAt(timer: ShootTimer, dueAtServerMs: number): ShootTimer {
  return { ...timer, state: 'due', deadlineServerMs: dueAtServerMs, remainingMs: null, heldByShoot: false, dueAtServerMs }
}

/**
 * Marks every running timer whose deadline has passed as due, at its deadline (so a timer that
 * expired while the server was down is due from when it expired). Returns the same state object
 * when nothing fell due; otherwise a new state with seq raised by one, and the newly due timers.
 */
export function markDueTimers(state: ShootState, nowServerMs: number): { state: ShootState; due: ShootTimer[] } {
  const due: ShootTimer[] = []
  const timers = state.timers.map((t) => {
    if (t.state !== 'running' || t.deadlineServerMs === null || t.deadlineServerMs > nowServerMs) return t
    const marked = shootTimerDueAt(t, t.deadlineServerMs)
    due.push(marked)
    return marked
  })
  if (due.length === 0) return { state, due }
  return { state: { ...state, timers, seq: state.seq + 1 }, due }
}

/** What a new timer is given; the rest follows from the moment it starts. */
export type NewShootTimer = Pick<ShootTimer, 'id' | 'slot' | 'label' | 'sound' | 'stepRef' | 'durationMs'> & {
  origin: 'step' | 'free'
  checkLeftMs: number | null
}

/** A timer started now: running, or held when a rehearsal's clock is stopped (it runs when the rehearsal does). */
export function newShootTimer(s: ShootState, spec: NewShootTimer, startedBy: ShootActor, nowServerMs: number): ShootTimer {
  const base: ShootTimer = {
    ...spec, deadlineServerMs: null, remainingMs: null, speed: s.clock.speed, state: 'running', heldByShoot: false,
    startedAtServerMs: nowServerMs, startedBy, dueAtServerMs: null, acknowledgedBy: null,
    acknowledgedAtServerMs: null, cancelledAtServerMs: null,
    startedAtShootMs: shootClockAt(s.clock, nowServerMs), closedAtShootMs: null,
  }
  if (s.mode === 'rehearsal' && !s.clock.running) return { ...base, state: 'paused', remainingMs: spec.durationMs, heldByShoot: true }
  return shootTimerRunningFrom(base, nowServerMs, spec.durationMs, s.clock.speed)
}

/** Whether a running timer has reached its "check it" moment (the short end of its step's range). */
export function timerChecking(timer: ShootTimer, nowServerMs: number): boolean {
  if (timer.state !== 'running' && timer.state !== 'paused') return false
  if (timer.checkLeftMs === null || timer.checkLeftMs === undefined) return false
  return timerRemainingMs(timer, nowServerMs) <= timer.checkLeftMs
}
