// What the shoot screens read for each step: the step's text with its amounts scaled and shown in
// the studio's unit system, the ingredients the step uses with their allergens, the cautions, the
// camera shot, and when the cook plan puts the step (ms on the shoot clock). Sent in the snapshot.
import { RecipeStep } from '../db/models'
import type { Kitchen } from './cook-plan'
import type { ShootState } from '../../shared/types/shoot'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { euAllergenLabel, type EuAllergenId } from '../../shared/utils/allergens'
import { findStepTokens } from '../../shared/utils/step-text'
import { CAUTIONS, isCautionId } from '../../shared/utils/cautions'

type StepDetails = ShootSnapshot['steps']

/** The cook plan's start and end of each step, in ms from the start of the cook; empty when the
 * episode cannot be planned (the plan page says why). */
async function plannedTimes(episodeId: number | null, kitchen: Kitchen) {
  const times = new Map<string, { start: number; end: number }>()
  if (episodeId === null) return { times, makespanMs: null as number | null }
  try {
    const plan = await planEpisode(episodeId, kitchen)
    for (const p of plan.steps) times.set(String(p.stepId), { start: p.start * 1000, end: p.end * 1000 })
    return { times, makespanMs: plan.makespan * 1000 }
  } catch {
    return { times, makespanMs: null }
  }
}

export async function shootScript(state: ShootState, shoot: { studioId: number; episodeId: number | null }) {
  const ids = state.runOrder.flatMap((s) => s.stepIds).map(Number)
  const settings = await studioSettings(shoot.studioId)
  const units = settings.unitSystem as 'metric' | 'us'
  const { times, makespanMs } = await plannedTimes(shoot.episodeId, settings.kitchen)
  const steps: StepDetails = {}
  if (!ids.length) return { steps, units, makespanMs }
  const recipeIds = [...new Set((await RecipeStep.findAll({ where: { id: ids }, attributes: ['recipeId'] })).map((s) => s.recipeId))]
  for (const recipeId of recipeIds) {
    const view = (await loadRecipe(recipeId))!
    const scaled = scaleLoadedRecipe(view, settings, undefined, units)
    const rendered = new Map(scaled.steps.map((s) => [s.id, s]))
    const scaledByKey = new Map(scaled.ingredients.map((i) => [i.key, i]))
    const viewByKey = new Map(view.ingredients.map((i) => [i.key, i]))
    for (const s of view.steps) {
      if (!ids.includes(s.id)) continue
      const keys = [...new Set(findStepTokens(s.text).map((t) => t.key))]
      const used = keys.map((k) => ({ scaled: scaledByKey.get(k), view: viewByKey.get(k) })).filter((u) => u.scaled && u.view)
      const allergens = [...new Set(used.flatMap((u) => (u.view!.allergens?.eu ?? []) as EuAllergenId[]))].map(euAllergenLabel)
      const plan = times.get(String(s.id))
      const cautions = allergens.length && !s.cautions.includes('allergen') ? [...s.cautions, 'allergen'] : s.cautions
      steps[String(s.id)] = {
        recipeId, recipeTitle: view.title, position: s.position, text: s.text, handsOn: s.handsOn,
        durationMin: s.durationMin, durationMax: s.durationMax, cameraShot: s.cameraShot, cameraNote: s.cameraNote,
        cautions,
        cautionNotes: cautions.map((c) => (isCautionId(c) ? { id: c, label: CAUTIONS[c].label, text: CAUTIONS[c].text } : { id: c, label: c, text: c })),
        script: s.script,
        segments: rendered.get(s.id)?.segments ?? [{ text: s.text }],
        ingredients: used.map((u) => ({ key: u.scaled!.key, item: u.scaled!.item, amount: u.scaled!.text })),
        allergens,
        plannedStartMs: plan?.start ?? null,
        plannedEndMs: plan?.end ?? null,
      }
    }
  }
  return { steps, units, makespanMs }
}
