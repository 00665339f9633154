// What the shoot screens read for each step: the step's text with its amounts scaled and shown in
// the studio's unit system, the ingredients the step uses with their allergens, the cautions, the
// camera shot, and when the shoot's first plan put the step (ms on the shoot clock). Built once per shoot
// and kept until the episode, one of its recipes or the studio's settings change: a join or a
// resync then costs three small reads, not a cook plan and the scaling of every recipe.
import { Episode, Recipe, RecipeStep, Studio } from '../db/models'
import { loadRecipe, studioSettings } from '../utils/recipes'
import { scaleLoadedRecipe } from '../utils/recipe-maths'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { allergenStateOf, euAllergenLabel, usAllergenLabel, type EuAllergenId, type UsAllergenId } from '../../shared/utils/allergens'
import { findStepTokens } from '../../shared/utils/step-text'
import { cautionsFor, countryOfLocale, isCautionId } from '../../shared/utils/cautions'
import type { ShootRow } from './store'

export type ShootScript = Pick<ShootSnapshot, 'steps' | 'units' | 'makespanMs'>

/** Builds the script of a shoot from the database: the recipes of its steps, scaled, and the plan. */
export async function buildShootScript(row: ShootRow): Promise<ShootScript> {
  const ids = new Set(stepIdsOf(row))
  const settings = await studioSettings(row.studioId)
  const units = settings.unitSystem as 'metric' | 'us'
  const CAUTIONS = cautionsFor(countryOfLocale(settings.locale))
  // The plan the shoot began with (server/shoot/plan.ts); none on a shoot the planner refused.
  const first = row.state.plan?.first ?? null
  const names = new Map((row.state.plan?.steps ?? []).map((p) => [p.id, p.name]))
  const steps: ShootScript['steps'] = {}
  for (const recipeId of await recipeIdsOf(row)) {
    const view = await loadRecipe(recipeId)
    if (!view) continue
    const scaled = scaleLoadedRecipe(view, settings, undefined, units)
    const rendered = new Map(scaled.steps.map((s) => [s.id, s]))
    const scaledByKey = new Map(scaled.ingredients.map((i) => [i.key, i]))
    const viewByKey = new Map(view.ingredients.map((i) => [i.key, i]))
    for (const s of view.steps) {
      if (!ids.has(s.id)) continue
      const keys = [...new Set(findStepTokens(s.text).map((t) => t.key))]
      const used = keys.flatMap((k) => {
        const sc = scaledByKey.get(k)
        const v = viewByKey.get(k)
        return sc && v ? [{ scaled: sc, view: v }] : []
      })
      const allergens = [...new Set(used.flatMap((u) => (u.view.allergens?.eu ?? []) as EuAllergenId[]))].map(euAllergenLabel)
      // The US list beside the EU one when the studio works in US units (FALCPA 2004, FASTER Act 2021).
      const allergensUs = units === 'us' ? [...new Set(used.flatMap((u) => (u.view.allergens?.us ?? []) as UsAllergenId[]))].map(usAllergenLabel) : []
      const allergensUnchecked = used.filter((u) => allergenStateOf(u.view as never) !== 'checked').map((u) => u.view.item)
      const plan = first?.steps[String(s.id)]
      const cautions = allergens.length && !s.cautions.includes('allergen') ? [...s.cautions, 'allergen'] : s.cautions
      steps[String(s.id)] = {
        recipeId, recipeTitle: view.title, position: s.position, text: s.text, handsOn: s.handsOn,
        durationMin: s.durationMin, durationMax: s.durationMax, cameraShot: s.cameraShot, cameraNote: s.cameraNote,
        cautions,
        cautionNotes: cautions.map((c) => (isCautionId(c) ? { id: c, label: CAUTIONS[c].label, text: CAUTIONS[c].text } : { id: c, label: c, text: c })),
        script: s.script,
        segments: rendered.get(s.id)?.segments ?? [{ text: s.text }],
        ingredients: used.map((u) => ({ key: u.scaled.key, item: u.scaled.item, amount: u.scaled.text })),
        allergens,
        allergensUs,
        allergensUnchecked,
        plannedStartMs: plan?.startMs ?? null,
        plannedEndMs: plan?.endMs ?? null,
        name: names.get(String(s.id)) ?? null,
      }
    }
  }
  return { steps, units, makespanMs: first?.makespanMs ?? null }
}

const stepIdsOf = (row: ShootRow) => [...new Set(row.state.runOrder.flatMap((s) => s.stepIds).map(Number))]

async function recipeIdsOf(row: ShootRow): Promise<number[]> {
  const ids = stepIdsOf(row)
  if (!ids.length) return []
  return [...new Set((await RecipeStep.findAll({ where: { id: ids }, attributes: ['recipeId'] })).map((s) => s.recipeId))].sort((a, b) => a - b)
}

/** What the script is built from: it is built again when this changes. */
export async function shootScriptVersion(row: ShootRow): Promise<string> {
  const recipeIds = await recipeIdsOf(row)
  const [episode, studio, recipes] = await Promise.all([
    row.episodeId === null ? null : Episode.findByPk(row.episodeId, { attributes: ['version', 'updatedAt'] }),
    Studio.findByPk(row.studioId, { attributes: ['updatedAt'] }),
    recipeIds.length ? Recipe.findAll({ where: { id: recipeIds }, attributes: ['id', 'version', 'updatedAt'], order: [['id', 'ASC']] }) : [],
  ])
  const stamp = (d: Date | undefined | null) => (d ? new Date(d).getTime() : 0)
  return JSON.stringify([
    episode ? [episode.version, stamp(episode.updatedAt)] : null,
    stamp(studio?.updatedAt),
    recipes.map((r) => [r.id, r.version, stamp(r.updatedAt)]),
  ])
}

export interface ScriptSource {
  build: (row: ShootRow) => Promise<ShootScript>
  version: (row: ShootRow) => Promise<string>
}

/**
 * The script of each shoot, built once and kept while its version holds (read before the build,
 * so a change made during a build is seen next time). Screens that join at the same moment share
 * one build. `stats.builds` counts builds (the benchmark and the tests read it).
 */
export function createScriptCache(source: ScriptSource = { build: buildShootScript, version: shootScriptVersion }) {
  type Entry = { version: string; script: ShootScript }
  const entries = new Map<number, Entry>()
  const pending = new Map<number, Promise<ShootScript>>()
  const stats = { builds: 0 }

  async function fresh(row: ShootRow): Promise<ShootScript> {
    const version = await source.version(row)
    const cached = entries.get(row.id)
    if (cached?.version === version) return cached.script
    stats.builds++
    const script = await source.build(row)
    entries.set(row.id, { version, script })
    return script
  }

  function scriptOf(row: ShootRow): Promise<ShootScript> {
    const inFlight = pending.get(row.id)
    if (inFlight) return inFlight
    const job = fresh(row).finally(() => pending.delete(row.id))
    pending.set(row.id, job)
    return job
  }

  return Object.assign(scriptOf, { stats, forget: (shootId: number) => entries.delete(shootId) })
}
