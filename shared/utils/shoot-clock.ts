// The shoot clock. It runs at `speed` × the server clock: 1× in a take, 1–8× in a rehearsal, and
// stops while the shoot is paused. It is stored as an anchor (a server time and the shoot time at
// that moment) plus the speed, so any screen reads it from the server time alone.
//
// Rehearsal speed and timers: a timer's duration is kitchen time, on the shoot clock. At speed s
// its deadline on the server clock is now + remaining / s, so a 10-minute timer at 4× is due after
// 2.5 real minutes; changing the speed re-anchors the clock and rescales every running deadline,
// keeping the kitchen time left. In a rehearsal, timers follow the shoot clock and are held while it
// is stopped; in a take the food keeps cooking, so pausing the shoot does not pause its timers.
import type { ShootClock, ShootState } from '../types/shoot'

/** Shoot time on a clock at a server time; never runs backwards past its anchor. */
export function shootClockAt(clock: ShootClock, nowServerMs: number): number {
  if (!clock.running) return clock.anchorShootMs
  return clock.anchorShootMs + Math.max(0, nowServerMs - clock.anchorServerMs) * clock.speed
}

/** Shoot time now, in ms from the start of the shoot (speed applied, stopped while paused). */
export function shootClockNow(state: Pick<ShootState, 'clock'>, nowServerMs: number): number {
  return shootClockAt(state.clock, nowServerMs)
}

/** The clock stopped at a server time, keeping the shoot time it reached. */
export function shootClockStopped(clock: ShootClock, nowServerMs: number): ShootClock {
  return { ...clock, anchorServerMs: nowServerMs, anchorShootMs: shootClockAt(clock, nowServerMs), running: false }
}

/** The clock running from a server time on, from the shoot time it shows. */
export function shootClockStarted(clock: ShootClock, nowServerMs: number): ShootClock {
  return { ...clock, anchorServerMs: nowServerMs, anchorShootMs: shootClockAt(clock, nowServerMs), running: true }
}

/** The clock at a new speed from a server time on, with no jump in shoot time. */
export function shootClockAtSpeed(clock: ShootClock, nowServerMs: number, speed: number): ShootClock {
  return { ...clock, anchorServerMs: nowServerMs, anchorShootMs: shootClockAt(clock, nowServerMs), speed }
}
