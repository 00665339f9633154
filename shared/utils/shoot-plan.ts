// The host's script as the cook plan gives it: the order in which the host meets the episode's
// steps on set. Hands-on steps come in the order the plan starts them; every unattended wait
// (simmer, rest, bake, boil) is a short "start it" beat at its planned start, so the pasta goes on
// while the sauce is being made. Side by side, the recipes' beats interleave in one cooking
// segment; one recipe at a time, each recipe's segment holds its own beats (its waits still
// overlap inside it). A plan that cannot be made leaves the recipes in their written order.
import type { ShootPlan, ShootPlanStep, ShootSegment } from '../types/shoot'
import { planCook } from './plan'
import { replanCook } from './plan-replan'
import { PlanError, type KitchenProfile } from './plan-types'
import { firstLivePlan } from './shoot-live-plan'

export interface ScriptRecipe {
  /** The episode segment's id (`segment-12`), its recipe ('' for a segment without one) and title, in the episode's order. */
  segmentId: string
  recipeId: string
  title: string
  /** The recipe's steps in their written order. */
  stepIds: string[]
}

/** A step as the plan placed it: start and end in seconds from the start of the cook. */
export interface ScriptPlannedStep {
  stepId: string
  start: number
  end: number
  handsOn: boolean
}

/** What the shoot's run order came from, for the desk to say. */
export type ScriptSource = ShootPlan['source']

/** Beats in plan order: by planned start; at the same moment a wait goes first (it takes a moment
 * to start, and then it runs by itself), then the recipes' order, then the written order. */
function planOrder(recipes: ScriptRecipe[], planned: Map<string, ScriptPlannedStep>, stepIds: string[]): string[] {
  const written = new Map<string, number>()
  let n = 0
  for (const r of recipes) for (const id of r.stepIds) written.set(id, n++)
  return [...stepIds].sort((a, b) => {
    const pa = planned.get(a)!
    const pb = planned.get(b)!
    return pa.start - pb.start || Number(pa.handsOn) - Number(pb.handsOn) || written.get(a)! - written.get(b)!
  })
}

/**
 * The run order of a shoot from the episode's recipes and their cook plan. `plan` is null when the
 * plan refused the episode; `problem` then says why, and the recipes run as written.
 */
export function shootRunOrderFromPlan(
  recipes: ScriptRecipe[],
  plan: { steps: ScriptPlannedStep[]; sideBySide: boolean } | null,
  problem: { reason: string; stepIds: string[] } | null = null,
): { runOrder: ShootSegment[]; source: ScriptSource } {
  const written = (): ShootSegment[] => recipes.map((r) => ({ id: r.segmentId, title: r.title, stepIds: [...r.stepIds] }))
  if (!plan) {
    return { runOrder: written(), source: { kind: 'recipe-order', reason: problem?.reason ?? 'The episode has no cook plan.', stepIds: problem?.stepIds ?? [] } }
  }
  const planned = new Map(plan.steps.map((s) => [s.stepId, s]))
  const missing = recipes.flatMap((r) => r.stepIds).filter((id) => !planned.has(id))
  if (missing.length) {
    return { runOrder: written(), source: { kind: 'recipe-order', reason: 'The cook plan leaves out some steps.', stepIds: missing } }
  }
  const withSteps = recipes.filter((r) => r.stepIds.length)
  if (!plan.sideBySide || withSteps.length < 2) {
    const runOrder = recipes.map((r) => ({ id: r.segmentId, title: r.title, stepIds: planOrder(recipes, planned, r.stepIds) }))
    return { runOrder, source: { kind: 'plan', sideBySide: plan.sideBySide } }
  }
  const all = planOrder(recipes, planned, withSteps.flatMap((r) => r.stepIds))
  const segment: ShootSegment = { id: 'segment-cook', title: cookTitle(withSteps.map((r) => r.title)), stepIds: all }
  // Segments without steps (intro, sponsor read, outro, a recipe with no steps) keep a place of their
  // own: those before the first recipe with steps come before the cooking, the others after it, in order.
  const first = recipes.indexOf(withSteps[0]!)
  const talk = (list: ScriptRecipe[]) => list.filter((r) => !r.stepIds.length).map((r) => ({ id: r.segmentId, title: r.title, stepIds: [] }))
  return { runOrder: [...talk(recipes.slice(0, first)), segment, ...talk(recipes.slice(first))], source: { kind: 'plan', sideBySide: true } }
}

/** "Lentil stew, flatbreads and squash": the titles of the recipes cooked side by side. */
export function cookTitle(titles: string[]): string {
  if (titles.length <= 1) return titles[0] ?? 'Cooking'
  return `${titles.slice(0, -1).join(', ')} and ${titles.at(-1)}`
}

/**
 * A new shoot's run order and cook plan: the first plan of the steps in the kitchen, the host's script
 * in its order, and the live plan before anything has happened. A plan the planner refuses leaves the
 * recipes in their written order, with the reason and the steps that keep it from being planned.
 */
export function planShootRun(recipes: ScriptRecipe[], steps: ShootPlanStep[], kitchen: KitchenProfile): { runOrder: ShootSegment[]; plan: ShootPlan } {
  const ms = (seconds: number) => Math.round(seconds * 1000)
  const input = { steps, kitchen }
  try {
    const first = planCook(input)
    const handsOn = new Map(steps.map((s) => [s.id, s.handsOn]))
    const { runOrder, source } = shootRunOrderFromPlan(recipes, {
      sideBySide: kitchen.parallelRecipes,
      steps: first.steps.map((p) => ({ stepId: p.id, start: p.start, end: p.end, handsOn: handsOn.get(p.id)! })),
    })
    const live = firstLivePlan(replanCook(input, { now: 0, previous: first }))
    const firstSteps = Object.fromEntries(first.steps.map((p) => [p.id, { startMs: ms(p.start), endMs: ms(p.end), lane: p.lane }]))
    return { runOrder, plan: { source, kitchen, steps, live, first: { makespanMs: ms(first.makespan), steps: firstSteps } } }
  } catch (error) {
    if (!(error instanceof PlanError)) throw error
    const byId = new Map(steps.map((s) => [s.id, s]))
    const named = error.stepIds.map((id) => byId.get(id)).filter((s): s is ShootPlanStep => !!s)
    const reason = `${error.message}${named.length ? ` (steps: ${named.map((s) => `"${s.name ?? s.label ?? s.id}" in ${s.recipeTitle}`).join('; ')})` : ''}`
    const { runOrder, source } = shootRunOrderFromPlan(recipes, null, { reason, stepIds: error.stepIds })
    return { runOrder, plan: { source, kitchen, steps, first: null, live: null } }
  }
}
