// The rehearsal report: each step's planned range against what it took, in kitchen time (the shoot
// clock, which runs at the rehearsal's speed, so a rehearsal at 16× still gives kitchen minutes).
// What a step "took" (our own rule, no standard):
// - a wait with a timer of its own (shoot-waits.ts): from its timer's start to the moment it was
//   called done; a wait whose timer was cancelled, or is still running, is not measured;
// - any other step: the time the cursor spent on it, from each visit to the next (going back adds),
//   counted once the cursor has left it or the shoot has ended.
// Planned: the shoot's own copy of the written range (state.plan.steps minMs..maxMs); the plan
// counts a step at the long end of its range (server/utils/cook-plan.ts, plannedDuration), so a
// step is over by actual − long end, and under when it took less than the short end.
import type { ShootPlanStep, ShootState } from '../types/shoot'
import { shootClockAt } from './shoot-clock'

export type ActualSource = 'timer' | 'cursor'

export interface StepActual {
  ms: number
  source: ActualSource
}

export interface ReportStep {
  stepId: string
  recipeId: string | null
  recipeTitle: string
  label: string
  handsOn: boolean
  plannedMinMs: number | null
  plannedMaxMs: number | null
  actualMs: number | null
  source: ActualSource | null
  /** actual − the long end (positive: over); null when either is unknown. */
  overMs: number | null
  /** 'over' past the long end, 'under' short of the short end, 'within' the range, null unmeasured or unplanned. */
  verdict: 'over' | 'under' | 'within' | null
}

export interface ReportSegment {
  id: string
  title: string
  /** The segment's span in the first plan (first start to last end); without a plan, its steps' long ends added. */
  plannedMs: number | null
  /** Time the cursor spent in the segment. */
  actualMs: number
  overMs: number | null
}

export interface RehearsalReport {
  steps: ReportStep[]
  segments: ReportSegment[]
  /** The steps over their long end, most over first (at most `OVERRUNS_LISTED`). */
  overruns: ReportStep[]
  plannedMakespanMs: number | null
  /** Shoot-clock time from the start to the end (or to now while it runs). */
  actualLengthMs: number
}

export const OVERRUNS_LISTED = 5

/** What stepActuals reads of a shoot. */
export type ShootTimingState = Pick<ShootState, 'status' | 'clock' | 'visits' | 'timers' | 'endedAtServerMs'> & {
  plan?: { steps: readonly ShootPlanStep[] } | null
}

/** The shoot clock at the end of the shoot, or now while it is not over. */
function shootEndMs(state: Pick<ShootState, 'clock' | 'endedAtServerMs'>, nowServerMs: number): number {
  return shootClockAt(state.clock, state.endedAtServerMs ?? nowServerMs)
}

/** The kitchen time each step took (see the rule at the top); steps not measured are absent. */
export function stepActuals(state: ShootTimingState, nowServerMs: number): Map<string, StepActual> {
  const out = new Map<string, StepActual>()
  const planSteps = new Map((state.plan?.steps ?? []).map((p) => [p.id, p]))
  const timed = new Set<string>()
  for (const t of state.timers) {
    const stepId = t.stepRef.stepId
    if (t.origin !== 'step' || stepId === null) continue
    timed.add(stepId)
    if (t.state !== 'acknowledged' || t.startedAtShootMs === undefined || t.closedAtShootMs === undefined || t.closedAtShootMs === null) continue
    out.set(stepId, { ms: Math.max(0, t.closedAtShootMs - t.startedAtShootMs), source: 'timer' })
  }
  const ended = state.status === 'ended'
  const endMs = shootEndMs(state, nowServerMs)
  const dwell = new Map<string, number>()
  state.visits.forEach((v, i) => {
    const stepId = v.stepRef.stepId
    if (stepId === null || timed.has(stepId)) return
    const next = state.visits[i + 1]
    if (!next && !ended) return // still on it
    const until = next?.enteredShootMs ?? endMs
    dwell.set(stepId, (dwell.get(stepId) ?? 0) + Math.max(0, until - v.enteredShootMs))
  })
  for (const [stepId, ms] of dwell) {
    const plan = planSteps.get(stepId)
    // A wait with a time is measured by its timer only; one that never got a timer is not measured.
    if (plan && !plan.handsOn && (plan.maxMs ?? plan.minMs) !== null) continue
    out.set(stepId, { ms, source: 'cursor' })
  }
  return out
}

function verdictOf(actual: number | null, min: number | null, max: number | null): ReportStep['verdict'] {
  const long = max ?? min
  if (actual === null || long === null) return null
  if (actual > long) return 'over'
  if (actual < (min ?? long)) return 'under'
  return 'within'
}

function reportStep(p: ShootPlanStep, actual: StepActual | undefined): ReportStep {
  const actualMs = actual?.ms ?? null
  const long = p.maxMs ?? p.minMs
  return {
    stepId: p.id, recipeId: p.recipe ?? null, recipeTitle: p.recipeTitle, label: p.name ?? p.label ?? p.id, handsOn: p.handsOn,
    plannedMinMs: p.minMs, plannedMaxMs: p.maxMs, actualMs, source: actual?.source ?? null,
    overMs: actualMs === null || long === null ? null : actualMs - long,
    verdict: verdictOf(actualMs, p.minMs, p.maxMs),
  }
}

/** The report of one shoot: steps in run order, segments, the biggest overruns. */
export function rehearsalReport(state: ShootState, nowServerMs: number): RehearsalReport {
  const actuals = stepActuals(state, nowServerMs)
  const planSteps = new Map((state.plan?.steps ?? []).map((p) => [p.id, p]))
  const order = state.runOrder.flatMap((seg) => seg.stepIds)
  const steps = order.flatMap((id) => {
    const p = planSteps.get(id)
    return p ? [reportStep(p, actuals.get(id))] : []
  })
  const endMs = shootEndMs(state, nowServerMs)
  const inSegment = new Array<number>(state.runOrder.length).fill(0)
  state.visits.forEach((v, i) => {
    const until = state.visits[i + 1]?.enteredShootMs ?? endMs
    inSegment[v.stepRef.segment] = (inSegment[v.stepRef.segment] ?? 0) + Math.max(0, until - v.enteredShootMs)
  })
  const first = state.plan?.first ?? null
  const segments = state.runOrder.map((seg, i): ReportSegment => {
    let plannedMs: number | null = null
    if (seg.stepIds.length && first && seg.stepIds.every((id) => first.steps[id])) {
      plannedMs = Math.max(...seg.stepIds.map((id) => first.steps[id]!.endMs)) - Math.min(...seg.stepIds.map((id) => first.steps[id]!.startMs))
    } else if (seg.stepIds.length) {
      const longs = seg.stepIds.map((id) => planSteps.get(id)).map((p) => (p ? p.maxMs ?? p.minMs : null))
      plannedMs = longs.every((x) => x !== null) ? longs.reduce<number>((a, x) => a + x!, 0) : null
    }
    const actualMs = inSegment[i]!
    return { id: seg.id, title: seg.title ?? `Segment ${i + 1}`, plannedMs, actualMs, overMs: plannedMs === null ? null : actualMs - plannedMs }
  })
  return {
    steps, segments, overruns: biggestOverruns(steps),
    plannedMakespanMs: first?.makespanMs ?? null,
    actualLengthMs: state.startedAtServerMs === null ? 0 : endMs,
  }
}

/** The steps over their long end, most over first; ties in run order. */
export function biggestOverruns(steps: readonly ReportStep[], n = OVERRUNS_LISTED): ReportStep[] {
  return steps
    .map((s, i) => ({ s, i }))
    .filter(({ s }) => s.overMs !== null && s.overMs > 0)
    .sort((a, b) => b.s.overMs! - a.s.overMs! || a.i - b.i)
    .slice(0, n)
    .map(({ s }) => s)
}

export interface SuggestedRange {
  /** Seconds, as the recipe stores a step's range. */
  min: number
  max: number
  /** How many rehearsals measured the step. */
  rehearsals: number
}

/**
 * The suggested range of a step from its actuals across rehearsals (kitchen ms), our own rule:
 * the shortest to the longest actual, rounded outward, to the whole minute when at least a minute
 * (short end down, long end up), to 5 seconds below a minute; never under 5 seconds.
 */
export function suggestedRange(actualsMs: readonly number[]): SuggestedRange | null {
  if (!actualsMs.length) return null
  const lo = Math.min(...actualsMs) / 1000
  const hi = Math.max(...actualsMs) / 1000
  const down = (s: number) => (s >= 60 ? Math.floor(s / 60) * 60 : Math.floor(s / 5) * 5)
  const up = (s: number) => (s >= 60 ? Math.ceil(s / 60) * 60 : Math.ceil(s / 5) * 5)
  const min = Math.max(5, down(lo))
  const max = Math.max(min, up(hi))
  return { min, max, rehearsals: actualsMs.length }
}

/** Every step's suggested range from several rehearsals' actuals (one map per rehearsal). */
export function suggestedRanges(perRehearsal: ReadonlyArray<ReadonlyMap<string, StepActual>>): Map<string, SuggestedRange> {
  const all = new Map<string, number[]>()
  for (const actuals of perRehearsal) {
    for (const [stepId, a] of actuals) all.set(stepId, [...(all.get(stepId) ?? []), a.ms])
  }
  const out = new Map<string, SuggestedRange>()
  for (const [stepId, list] of all) out.set(stepId, suggestedRange(list)!)
  return out
}
