// A small kitchen for unit tests of the live shoot, worked by hand: beans soak 25–30 min (a wait from
// the start); the onion is chopped (5 min), then the lentils simmer 20–25 min on a burner while the
// herbs are picked (10 min); the stew is finished (3 min) once they are done. With one cook the plan
// is soak 0–30, chop 0–5, simmer 5–30, herbs 5–15, finish 30–33 (minutes).
import type { ShootPlanStep } from '../../shared/types/shoot'
import type { KitchenProfile } from '../../shared/utils/plan-types'
import type { ScriptRecipe } from '../../shared/utils/shoot-plan'

const MIN = 60_000

export const KITCHEN: KitchenProfile = { hands: 1, burners: 4, ovens: 1, racksPerOven: 1, parallelRecipes: true }

export const step = (id: string, minutes: [number | null, number], handsOn: boolean, extra: Partial<ShootPlanStep> = {}): ShootPlanStep => ({
  id, duration: minutes[1] * 60, handsOn, station: null, recipe: 'stew', recipeTitle: 'Red lentil stew', label: id, name: null,
  minMs: minutes[0] === null ? null : minutes[0] * MIN, maxMs: minutes[1] * MIN, ...extra,
})

export const STEPS: ShootPlanStep[] = [
  step('soak', [25, 30], false, { recipe: 'beans', recipeTitle: 'Soaked beans', name: 'Bean soak' }),
  step('chop', [null, 5], true, { station: 'counter' }),
  step('simmer', [20, 25], false, { station: 'burner', after: ['chop'], name: 'Lentils' }),
  step('herbs', [null, 10], true, { after: ['chop'] }),
  step('finish', [null, 3], true, { after: ['simmer'] }),
]

export const RECIPES: ScriptRecipe[] = [
  { segmentId: 'segment-1', recipeId: 'beans', title: 'Soaked beans', stepIds: ['soak'] },
  { segmentId: 'segment-2', recipeId: 'stew', title: 'Red lentil stew', stepIds: ['chop', 'simmer', 'herbs', 'finish'] },
]
