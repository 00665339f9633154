// Waits of the cook plan on the live shoot. A wait (simmer, rest, bake, boil: a step that runs by
// itself) with a written time gets its timer when the host reaches its beat in the script, or when
// the host confirms its cue earlier ("start it now"): one timer per step, named after the step and its
// recipe, set to the long end of the step's range and checked at the short end. Nobody types it.
import {
  SHOOT_TIMER_LABEL_MAX, SHOOT_TIMER_SLOTS,
  type ShootActor, type ShootEvent, type ShootPlanStep, type ShootState, type ShootStepRef, type ShootTimer,
} from '../types/shoot'
import { isShootTimerLive, newShootTimer } from './shoot-timers'
import { shootPositions } from './shoot'
import { stepTimerLabel } from './key-map'

/** The plan's step with this id, or null (a shoot without a plan, or a step the plan does not have). */
export function shootPlanStep(s: Pick<ShootState, 'plan'>, stepId: string | null): ShootPlanStep | null {
  if (stepId === null || !s.plan) return null
  return s.plan.steps.find((p) => p.id === stepId) ?? null
}

/** A wait with a written time: it gets a timer of its own. */
export function isTimedWait(step: ShootPlanStep | null): step is ShootPlanStep {
  return !!step && !step.handsOn && (step.maxMs ?? step.minMs) !== null
}

/** The timer a step's wait was given, if it has been started. */
export function stepTimerOf(s: Pick<ShootState, 'timers'>, stepId: string): ShootTimer | null {
  for (let i = s.timers.length - 1; i >= 0; i--) {
    const t = s.timers[i]!
    if (t.origin === 'step' && t.stepRef.stepId === stepId) return t
  }
  return null
}

/** "Pasta water · Weeknight ragù": the step's short name (else its text, cut at a word) and its recipe. */
export function waitTimerLabel(step: Pick<ShootPlanStep, 'name' | 'label' | 'id' | 'recipeTitle'>): string {
  const name = step.name?.trim() || stepTimerLabel(step.label ?? step.id, 44) || step.id
  const recipe = step.recipeTitle.trim()
  return recipe ? `${name} · ${stepTimerLabel(recipe, SHOOT_TIMER_LABEL_MAX - name.length - 3)}` : name
}

/** The timer's length and check signal for a timed wait: the long end, checked at the short end. */
export function waitTimerTimes(step: ShootPlanStep): { durationMs: number; checkLeftMs: number | null } {
  const durationMs = (step.maxMs ?? step.minMs)!
  const short = step.minMs
  return { durationMs, checkLeftMs: short !== null && short < durationMs ? durationMs - short : null }
}

/** Where the step's beat is in the run order. */
export function stepRefOf(s: Pick<ShootState, 'runOrder'>, stepId: string): ShootStepRef | null {
  return shootPositions(s.runOrder).find((p) => p.stepId === stepId) ?? null
}

/**
 * Starts the timer of a timed wait that has none yet; returns the state unchanged when the step is no
 * timed wait, already has its timer, or every timer slot is taken (the cue stays up, and the desk can
 * start it once a slot is free).
 */
export function startWait(s: ShootState, stepId: string | null, by: ShootActor, now: number): { state: ShootState; events: ShootEvent[] } {
  const step = shootPlanStep(s, stepId)
  if (!isTimedWait(step) || stepTimerOf(s, step.id)) return { state: s, events: [] }
  const live = s.timers.filter(isShootTimerLive)
  const slot = Array.from({ length: SHOOT_TIMER_SLOTS }, (_, i) => i).find((i) => !live.some((t) => t.slot === i))
  const stepRef = stepRefOf(s, step.id)
  if (slot === undefined || !stepRef) return { state: s, events: [] }
  const id = s.timers.some((t) => t.id === `wait-${step.id}`) ? `wait-${step.id}-${s.timers.length}` : `wait-${step.id}`
  const timer = newShootTimer(s, { id, slot, label: waitTimerLabel(step), sound: null, stepRef, origin: 'step', ...waitTimerTimes(step) }, by, now)
  return { state: { ...s, timers: [...s.timers, timer] }, events: [{ type: 'timer.changed', timerId: id, state: timer.state }] }
}
