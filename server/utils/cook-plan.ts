// The cook plan of an episode: its recipes' steps handed to the shared scheduler (planCook).
import type { RecipeStep } from '../db/models'
import { DomainError } from '../../shared/utils/domain-error'
import { PlanError, type KitchenProfile, type PlanStep } from '../../shared/utils/plan-types'
import { plainStepText } from '../../shared/utils/step-text'


/** A step with no duration still takes the cook a moment: planned as one minute (common practice). */
export const STEP_WITHOUT_DURATION_S = 60

/**
 * A step's planned duration is the long end of its range: an unattended wait is never planned
 * shorter than the recipe allows, so the food is done when the plan says so.
 */
export function plannedDuration(step: { durationMin: number | null; durationMax: number | null }) {
  return step.durationMax ?? step.durationMin ?? STEP_WITHOUT_DURATION_S
}

const stepKey = (id: number) => String(id)

type EpisodeRunOrder = Awaited<ReturnType<typeof loadEpisodeRunOrder>>

/** The step at `position` and, back through every step that starts together with the one before it, those. */
function followsBlock(atPosition: Map<number, RecipeStep>, position: number): number[] {
  const out = [position]
  for (let p = position; p > 1; p--) {
    const step = atPosition.get(p)
    const together = step && !step.after.length && step.links.length === 1 && step.links[0]!.kind === 'start-start' && step.links[0]!.step === p - 1
    if (!together) break
    out.push(p - 1)
  }
  return out
}
type StepInfo = { recipeId: number; recipeTitle: string; label: string; step: RecipeStep }

/** The planner's input for an episode's recipes, in the episode's order, and what each step is. */
export function episodePlanSteps(episode: EpisodeRunOrder) {
  const input: PlanStep[] = []
  const info = new Map<string, StepInfo>()
  for (const { recipeId, title: recipeTitle, steps: list } of episode.segments.filter((s) => s.recipeId)) {
    const atPosition = new Map(list.map((s) => [s.position, s]))
    for (const s of list) {
      // Tokens read as the ingredient's name; no closing full stop, since cues quote the label in a sentence.
      const label = plainStepText(s.text).replace(/[.。]+\s*$/, '')
      // "Waits for" names earlier steps; a step that names none follows the one before it, and when that
      // one started together with the step before it ("meanwhile, chop the onion"), those too: the pasta
      // goes in once the water has boiled, not as soon as the onion is chopped.
      const after = s.after.length ? s.after : s.position > 1 && !s.links.length ? followsBlock(atPosition, s.position - 1) : []
      input.push({
        id: stepKey(s.id),
        duration: plannedDuration(s),
        handsOn: s.handsOn,
        station: (s.station as PlanStep['station']) ?? null,
        links: [
          ...after.map((p) => atPosition.get(p)).filter((x): x is RecipeStep => !!x).map((from) => ({ from: stepKey(from.id), kind: 'finish-start' as const })),
          ...s.links.map((l) => ({ from: stepKey(atPosition.get(l.step)?.id ?? 0), kind: l.kind, lag: l.lag })),
        ],
        recipe: String(recipeId),
        label,
      })
      info.set(stepKey(s.id), { recipeId: recipeId!, recipeTitle, label, step: s })
    }
  }
  return { input, info }
}

/** The planner's refusal as a DomainError that names the steps in the cook's words. */
function planRefusal(error: PlanError, info: Map<string, StepInfo>): DomainError {
  const named = error.stepIds.map((id) => ({ stepId: Number(id), label: info.get(id)?.label ?? id, recipeTitle: info.get(id)?.recipeTitle ?? '' }))
  return new DomainError(
    error.code,
    `${error.message}${named.length ? ` (steps: ${named.map((n) => `"${n.label}" in ${n.recipeTitle}`).join('; ')})` : ''}`,
    { data: { stepIds: named.map((n) => n.stepId), steps: named } },
  )
}

export async function planEpisode(episodeId: number, kitchen: KitchenProfile) {
  const { input, info } = episodePlanSteps(await loadEpisodeRunOrder(episodeId))
  try {
    const plan = planCook({ steps: input, kitchen })
    return {
      makespan: plan.makespan,
      steps: plan.steps.map((p) => {
        const i = info.get(p.id)!
        return {
          stepId: Number(p.id), start: p.start, end: p.end, lane: p.lane, handsLane: p.handsLane, rack: p.rack, slack: p.slack, critical: p.critical,
          earliestStart: p.earliestStart, latestStart: p.latestStart,
          recipeId: i.recipeId, recipeTitle: i.recipeTitle, label: i.label, handsOn: i.step.handsOn, station: i.step.station,
          durationMin: i.step.durationMin, durationMax: i.step.durationMax,
        }
      }),
      lanes: plan.lanes,
      bounds: plan.bounds,
      criticalPath: plan.criticalPath.map(Number),
      cues: plan.cues.map((c) => ({ ...c, stepId: Number(c.stepId), during: c.during === null ? null : Number(c.during) })),
      rule: plan.rule,
      kitchen,
      timeNotices: stepTimeNotices(info),
    }
  } catch (error) {
    if (!(error instanceof PlanError)) throw error
    throw planRefusal(error, info)
  }
}

/**
 * Steps whose time the plan only guesses: no time at all (planned as STEP_WITHOUT_DURATION_S), or
 * a time, wait or station an import read from the step text that no one has confirmed yet.
 */
export function stepTimeNotices(info: Map<string, StepInfo>) {
  const out: { stepId: number; recipeId: number; recipeTitle: string; label: string; kind: 'no-time' | 'read-from-text'; fields: string[] }[] = []
  for (const [id, i] of info) {
    const base = { stepId: Number(id), recipeId: i.recipeId, recipeTitle: i.recipeTitle, label: i.label }
    if (i.step.durationMin === null && i.step.durationMax === null) out.push({ ...base, kind: 'no-time', fields: [] })
    else if (i.step.readFromText?.length) out.push({ ...base, kind: 'read-from-text', fields: [...i.step.readFromText] })
  }
  return out
}
