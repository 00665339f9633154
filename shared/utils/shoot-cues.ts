// What the screens read from the live plan (shoot-live-plan.ts): the waits coming up with their
// countdown ("in 0:30: lentils into the pot"), the step the host is on against its planned end, and
// the projected finish against the first plan's. All times are on the shoot clock (kitchen ms), so a
// 16× rehearsal counts down sixteen times as fast as a take.
import type { ShootCollision, ShootState } from '../types/shoot'
import { shootClockAt } from './shoot-clock'
import { shootCursorRef } from './shoot'
import { isTimedWait, stepTimerOf } from './shoot-waits'

export interface ShootUpcomingWait {
  stepId: string
  /** The step's short name, else its text. */
  label: string
  recipeTitle: string
  /** When the live plan starts it, on the shoot clock. */
  atMs: number
  /** Kitchen ms until then; zero or less once it is due (it waits on the host). */
  inMs: number
  /** The hands-on step the host is meant to be on then, if any (its id). */
  during: string | null
}

/** The waits not yet started, soonest first, from the live plan; none without one. */
export function upcomingWaits(state: ShootState, nowServerMs: number, limit = 3): ShootUpcomingWait[] {
  const live = state.plan?.live
  if (!state.plan || !live || state.status === 'ended') return []
  const now = shootClockAt(state.clock, nowServerMs)
  const during = new Map(live.cues.map((c) => [c.stepId, c.during]))
  return state.plan.steps
    .filter((s) => isTimedWait(s) && !stepTimerOf(state, s.id) && live.steps[s.id]?.state === 'pending')
    .map((s) => {
      const atMs = live.steps[s.id]!.startMs
      return { stepId: s.id, label: s.name ?? s.label ?? s.id, recipeTitle: s.recipeTitle, atMs, inMs: atMs - now, during: during.get(s.id) ?? null }
    })
    .sort((a, b) => a.atMs - b.atMs || a.stepId.localeCompare(b.stepId))
    .slice(0, limit)
}

/** The step the host is on, against the live plan: its planned end and the kitchen time left to it. */
export function currentStepTiming(state: ShootState, nowServerMs: number): { stepId: string; endMs: number; leftMs: number } | null {
  const live = state.plan?.live
  if (!live || state.status === 'ready' || state.status === 'ended') return null
  const stepId = shootCursorRef(state).stepId
  const planned = stepId === null ? undefined : live.steps[stepId]
  if (stepId === null || !planned) return null
  return { stepId, endMs: planned.endMs, leftMs: planned.endMs - shootClockAt(state.clock, nowServerMs) }
}

/** The projected finish against the planned one (ms on the shoot clock); null without a plan. */
export function shootProjection(state: ShootState): { plannedMs: number; projectedMs: number; lateMs: number } | null {
  const first = state.plan?.first
  const live = state.plan?.live
  if (!first || !live) return null
  return { plannedMs: first.makespanMs, projectedMs: live.makespanMs, lateMs: live.makespanMs - first.makespanMs }
}

/** Collisions still ahead: a hands-on step that will wait because the cook's hands are held. */
export function comingCollisions(state: ShootState, nowServerMs: number): ShootCollision[] {
  const live = state.plan?.live
  if (!live) return []
  const now = shootClockAt(state.clock, nowServerMs)
  return live.collisions.filter((c) => c.startMs >= now && live.steps[c.stepId]?.state === 'pending')
}
