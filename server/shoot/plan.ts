// A new shoot's run order and cook plan, from the episode and the studio's kitchen (planShootRun in
// shared/utils/shoot-plan.ts): the host's script is the plan. An episode the planner refuses is
// still shot, its recipes in their written order, and the desk names the steps that keep it from
// being planned.
import type { ShootPlan, ShootPlanStep, ShootSegment } from '../../shared/types/shoot'
import type { KitchenProfile } from '../../shared/utils/plan-types'
import { planShootRun, type ScriptRecipe } from '../../shared/utils/shoot-plan'
import { episodePlanSteps } from '../utils/cook-plan'
import type { loadEpisodeRunOrder } from '../utils/episodes'

type EpisodeRunOrder = Awaited<ReturnType<typeof loadEpisodeRunOrder>>
const ms = (seconds: number | null) => (seconds === null ? null : Math.round(seconds * 1000))

/** The run order and the plan of a shoot of `episode` in a kitchen. */
export function planShoot(episode: EpisodeRunOrder, kitchen: KitchenProfile): { runOrder: ShootSegment[]; plan: ShootPlan } {
  const { input, info } = episodePlanSteps(episode)
  const steps: ShootPlanStep[] = input.map((p) => {
    const { recipeTitle, step } = info.get(p.id)!
    return { ...p, recipeTitle, name: step.name ?? null, minMs: ms(step.durationMin), maxMs: ms(step.durationMax) }
  })
  const recipes: ScriptRecipe[] = episode.segments.map((s) => ({
    segmentId: `segment-${s.id}`, recipeId: String(s.recipeId ?? ''), title: s.title, stepIds: s.steps.map((st) => String(st.id)),
  }))
  return planShootRun(recipes, steps, kitchen)
}
