// The cook plan following the shoot. After every change (a step left late or early, time added, a
// timer confirmed, a pause) the shoot's progress is read from its state and the rest of the plan is
// computed again from the present with replanCook (plan-replan.ts): hands-on steps are done once the
// host has moved past them and running while the host is on them; a wait runs from its timer's start
// to its deadline and is done once its timer is confirmed or cancelled. The plan's clock is the shoot
// clock (0 when the shoot starts); the planner counts seconds, the shoot milliseconds.
import type { ShootLivePlan, ShootPlan, ShootState } from '../types/shoot'
import { replanCook } from './plan-replan'
import { PlanError, type PlanProgress, type ReplanResult } from './plan-types'
import { shootPositions } from './shoot'
import { shootClockAt } from './shoot-clock'
import { timerRemainingMs } from './shoot-timers'
import { stepTimerOf } from './shoot-waits'

type Span = { start: number; end: number }
const sec = (ms: number) => Math.max(0, ms) / 1000

/** The shoot's progress in the planner's terms (seconds on the shoot clock). */
export function shootPlanProgress(s: ShootState, nowServerMs: number): PlanProgress {
  const now = shootClockAt(s.clock, nowServerMs)
  const done: Record<string, Span> = {}
  const running: Record<string, Span> = {}
  if (!s.plan || s.status === 'ready') return { now: sec(now), done, running }

  const order = shootPositions(s.runOrder)
  const indexOf = new Map<string, number>()
  order.forEach((p, i) => { if (p.stepId !== null && !indexOf.has(p.stepId)) indexOf.set(p.stepId, i) })
  const cursorIndex = order.findIndex((p) => p.segment === s.cursor.segment && p.step === s.cursor.step)
  // Each visit lasts until the next one starts; the one the cursor is on lasts until now.
  const visits = s.visits.map((v, i) => ({
    index: indexOf.get(v.stepRef.stepId ?? '') ?? -1,
    from: v.enteredShootMs,
    to: s.visits[i + 1]?.enteredShootMs ?? now,
  }))
  const passedAt = (index: number) => visits.find((v) => v.index > index)?.from ?? now

  for (const step of s.plan.steps) {
    const index = indexOf.get(step.id) ?? -1
    const seen = visits.filter((v) => v.index === index)
    if (!step.handsOn) {
      const timer = stepTimerOf(s, step.id)
      if (timer) {
        const start = Math.min(now, timer.startedAtShootMs ?? now)
        if (timer.state === 'acknowledged' || timer.state === 'cancelled') {
          done[step.id] = { start: sec(start), end: sec(Math.max(start, Math.min(now, timer.closedAtShootMs ?? now))) }
        } else {
          running[step.id] = { start: sec(start), end: sec(now + timerRemainingMs(timer, nowServerMs)) }
        }
      } else if (seen.length) {
        // A wait without a written time runs for its planned moment from when the host met it.
        const start = seen[0]!.from
        running[step.id] = { start: sec(start), end: sec(start) + step.duration }
      }
      continue
    }
    if (index === cursorIndex) {
      const start = seen.length ? seen[0]!.from : now
      running[step.id] = { start: sec(start), end: sec(start) + step.duration }
    } else if (index >= 0 && index < cursorIndex) {
      // Behind the cursor: done when the host last left it, or, skipped over, when the cursor went past it.
      const at = Math.min(now, passedAt(index))
      done[step.id] = seen.length ? { start: sec(seen[0]!.from), end: sec(seen.at(-1)!.to) } : { start: sec(at), end: sec(at) }
    }
    // Ahead of the cursor (never reached, or the host went back before it) it is still to do.
  }
  return { now: sec(now), done, running }
}

/** The live plan in the shoot's shape (ms). */
function livePlanOf(r: ReplanResult, atShootMs: number): ShootLivePlan {
  const ms = (x: number) => Math.round(x * 1000)
  return {
    atShootMs,
    makespanMs: ms(r.makespan),
    steps: Object.fromEntries(r.steps.map((p) => [p.id, {
      startMs: ms(p.start), endMs: ms(p.end), lane: p.lane, handsLane: p.handsLane, state: p.state, movedMs: p.moved === null ? null : ms(p.moved),
    }])),
    lanes: r.lanes,
    cues: r.cues.map((c) => ({ stepId: c.stepId, atMs: ms(c.at), endsAtMs: ms(c.endsAt), during: c.during, text: c.text })),
    collisions: r.collisions.map((c) => ({
      stepId: c.stepId, afterId: c.afterId, heldBy: c.heldBy, dueMs: ms(c.due), startMs: ms(c.start), waitMs: ms(c.wait), text: c.text,
    })),
    overdue: r.overdue,
  }
}

/** The plan input of a shoot's plan. */
export function shootPlanInput(plan: Pick<ShootPlan, 'steps' | 'kitchen'>) {
  return { steps: plan.steps, kitchen: plan.kitchen }
}

/**
 * The state with its live plan computed again from the present. A shoot without a cook plan (made
 * before plans ran live, or one the planner refused) is returned as it is.
 */
export function withLivePlan(s: ShootState, nowServerMs: number): ShootState {
  if (!s.plan || s.plan.source.kind !== 'plan') return s
  const progress = shootPlanProgress(s, nowServerMs)
  const previous = s.plan.live ? { steps: Object.entries(s.plan.live.steps).map(([id, p]) => ({ id, start: p.startMs / 1000 })) } : null
  try {
    const r = replanCook(shootPlanInput(s.plan), { ...progress, previous })
    return { ...s, plan: { ...s.plan, live: livePlanOf(r, Math.round(progress.now * 1000)) } }
  } catch (error) {
    // The first plan was made from the same input, so only progress the planner cannot read lands
    // here; the shoot goes on with the plan it had.
    if (error instanceof PlanError) return s
    throw error
  }
}

/** The live plan of a first plan, before anything has happened. */
export function firstLivePlan(r: ReplanResult): ShootLivePlan {
  return livePlanOf(r, 0)
}
