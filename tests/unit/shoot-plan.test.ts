// The host's script in plan order, checked against the cook plan itself (planCook) on small
// kitchens worked by hand: the hands-on beats follow the plan's hands lane, every wait is a beat
// at its planned start, recipes interleave side by side and keep their own segment one at a time.
import { describe, expect, it } from 'vitest'
import { planCook } from '../../shared/utils/plan'
import type { PlanKitchen, PlanStep } from '../../shared/utils/plan-types'
import { cookTitle, shootRunOrderFromPlan, type ScriptRecipe } from '../../shared/utils/shoot-plan'

const MIN = 60
// Pasta: the water comes to the boil (a wait on a burner), then the pasta cooks (a wait), then it
// is drained (hands). Sauce: chop the onion (hands), fry it (hands, burner), simmer (a wait).
const STEPS: PlanStep[] = [
  { id: 'water', duration: 10 * MIN, handsOn: false, station: 'burner', recipe: 'pasta', label: 'Pasta water' },
  { id: 'pasta', duration: 10 * MIN, handsOn: false, station: 'burner', recipe: 'pasta', label: 'Pasta in', after: ['water'] },
  { id: 'drain', duration: 2 * MIN, handsOn: true, station: null, recipe: 'pasta', label: 'Drain', after: ['pasta'] },
  { id: 'chop', duration: 5 * MIN, handsOn: true, station: 'counter', recipe: 'sauce', label: 'Chop onion' },
  { id: 'fry', duration: 6 * MIN, handsOn: true, station: 'burner', recipe: 'sauce', label: 'Fry onion', after: ['chop'] },
  { id: 'simmer', duration: 15 * MIN, handsOn: false, station: 'burner', recipe: 'sauce', label: 'Simmer sauce', after: ['fry'] },
]
const RECIPES: ScriptRecipe[] = [
  { segmentId: 'segment-1', recipeId: 'pasta', title: 'Pasta', stepIds: ['water', 'pasta', 'drain'] },
  { segmentId: 'segment-2', recipeId: 'sauce', title: 'Tomato sauce', stepIds: ['chop', 'fry', 'simmer'] },
]

function scriptFor(kitchen: PlanKitchen) {
  const plan = planCook({ steps: STEPS, kitchen })
  const planned = plan.steps.map((p) => ({ stepId: p.id, start: p.start, end: p.end, handsOn: STEPS.find((s) => s.id === p.id)!.handsOn }))
  return { plan, ...shootRunOrderFromPlan(RECIPES, { steps: planned, sideBySide: kitchen.parallelRecipes ?? true }) }
}

describe('shootRunOrderFromPlan', () => {
  it('side by side: one cooking segment whose beats are the plan\'s starts in order, waits overlapped', () => {
    const { plan, runOrder, source } = scriptFor({ hands: 1, burners: 4, ovens: 1, parallelRecipes: true })
    expect(source).toEqual({ kind: 'plan', sideBySide: true })
    expect(runOrder).toHaveLength(1)
    expect(runOrder[0]!.title).toBe('Pasta and Tomato sauce')
    const order = runOrder[0]!.stepIds
    const start = new Map(plan.steps.map((p) => [p.id, p.start]))
    // Every beat at or after the one before it: the host meets steps in the plan's order of starts.
    for (let i = 1; i < order.length; i++) expect(start.get(order[i]!)!).toBeGreaterThanOrEqual(start.get(order[i - 1]!)!)
    // Worked by hand: at 0 the water goes on (a wait first, it runs by itself) while the onion is chopped.
    expect(order.slice(0, 2)).toEqual(['water', 'chop'])
    // The hands-on beats are the plan's hands lane in order.
    const handsLane = plan.steps.filter((p) => p.handsLane === 'hands-1').sort((a, b) => a.start - b.start).map((p) => p.id)
    expect(order.filter((id) => STEPS.find((s) => s.id === id)!.handsOn)).toEqual(handsLane)
    // The recipes interleave: pasta, sauce, …, and every step appears once.
    expect(new Set(order.map((id) => STEPS.find((s) => s.id === id)!.recipe)).size).toBe(2)
    expect([...order].sort()).toEqual(STEPS.map((s) => s.id).sort())
    // Worked by hand: the sauce's chain, 5 + 6 + 15 = 26 min, is longer than the pasta's 10 + 10 + 2.
    expect(plan.makespan).toBe(26 * MIN)
  })

  it('one recipe at a time: each recipe keeps its segment, its own beats in plan order', () => {
    const { plan, runOrder, source } = scriptFor({ hands: 1, burners: 4, ovens: 1, parallelRecipes: false })
    expect(source).toEqual({ kind: 'plan', sideBySide: false })
    expect(runOrder.map((s) => s.id)).toEqual(['segment-1', 'segment-2'])
    expect(runOrder.map((s) => s.title)).toEqual(['Pasta', 'Tomato sauce'])
    const start = new Map(plan.steps.map((p) => [p.id, p.start]))
    for (const seg of runOrder) {
      for (let i = 1; i < seg.stepIds.length; i++) expect(start.get(seg.stepIds[i]!)!).toBeGreaterThanOrEqual(start.get(seg.stepIds[i - 1]!)!)
    }
    // Inside the sauce, the simmer is still a wait: it starts when the frying ends.
    expect(runOrder[1]!.stepIds).toEqual(['chop', 'fry', 'simmer'])
  })

  it('an episode the plan refuses runs in the recipes\' written order and says which steps keep it from a plan', () => {
    const { runOrder, source } = shootRunOrderFromPlan(RECIPES, null, { reason: 'The steps wait for each other in a circle.', stepIds: ['fry', 'simmer'] })
    expect(runOrder).toEqual([
      { id: 'segment-1', title: 'Pasta', stepIds: ['water', 'pasta', 'drain'] },
      { id: 'segment-2', title: 'Tomato sauce', stepIds: ['chop', 'fry', 'simmer'] },
    ])
    expect(source).toEqual({ kind: 'recipe-order', reason: 'The steps wait for each other in a circle.', stepIds: ['fry', 'simmer'] })
  })

  it('a plan that leaves a step out falls back to the written order, naming the step', () => {
    const { source } = shootRunOrderFromPlan(RECIPES, { steps: [{ stepId: 'water', start: 0, end: 600, handsOn: false }], sideBySide: true })
    expect(source).toMatchObject({ kind: 'recipe-order', stepIds: ['pasta', 'drain', 'chop', 'fry', 'simmer'] })
  })

  it('names the recipes cooked together as a list reads', () => {
    expect(cookTitle(['Stew'])).toBe('Stew')
    expect(cookTitle(['Stew', 'Flatbreads', 'Squash'])).toBe('Stew, Flatbreads and Squash')
  })
})
