// What the shoot screens read for each step: the step's text with its amounts scaled to the episode's
// servings and shown in its unit system, the ingredients the step uses with their allergens, the
// cautions, the camera shot, the step's photo, and when the shoot's first plan put the step (ms on
// the shoot clock); and the episode as a show (server/utils/show.ts): every segment's script with its
// live fields written from the data now. Built once per shoot and kept until the episode, one of its
// recipes, the studio's prices or settings or the presenter's pace change: a join or a resync then
// costs a few small reads, not a cook plan and the scaling of every recipe.
import { fn, col } from 'sequelize'
import { Episode, Membership, Price, Recipe, RecipeStep, Studio } from '../db/models'
import { loadRecipe, studioSettings, type RecipeView } from '../utils/recipes'
import { scaleLoadedRecipe } from '../utils/recipe-maths'
import { episodeShow, type EpisodeShow } from '../utils/show'
import type { ShootShow, ShootSnapshot } from '../../shared/types/socket-events'
import type { ShootSegment } from '../../shared/types/shoot'
import { segmentShot } from '../../shared/utils/show-segments'
import { isDomainError } from '../../shared/utils/domain-error'
import { allergenStateOf, euAllergenLabel, usAllergenLabel, type EuAllergenId, type UsAllergenId } from '../../shared/utils/allergens'
import { findStepTokens } from '../../shared/utils/step-text'
import { segmentsText } from '../../shared/utils/step-segments'
import { cautionsFor, countryOfLocale, isCautionId } from '../../shared/utils/cautions'
import type { ShootRow } from './store'

export type ShootScript = Pick<ShootSnapshot, 'steps' | 'units' | 'makespanMs' | 'show'>

/** Builds the script of a shoot from the database: the recipes of its steps, scaled, and the plan. */
export async function buildShootScript(row: ShootRow): Promise<ShootScript> {
  const ids = new Set(stepIdsOf(row))
  const settings = await studioSettings(row.studioId)
  const show = row.episodeId === null ? null : await showOf(row.episodeId)
  const units = show?.units ?? (settings.unitSystem as 'metric' | 'us')
  const servings = show?.servingsSet ? show.servings : undefined
  const CAUTIONS = cautionsFor(countryOfLocale(settings.locale))
  // The plan the shoot began with (server/shoot/plan.ts); none on a shoot the planner refused.
  const first = row.state.plan?.first ?? null
  const names = new Map((row.state.plan?.steps ?? []).map((p) => [p.id, p.name]))
  const steps: ShootScript['steps'] = {}
  const views: RecipeView[] = []
  for (const recipeId of await recipeIdsOf(row)) {
    const view = await loadRecipe(recipeId)
    if (!view) continue
    views.push(view)
    const scaled = scaleLoadedRecipe(view, settings, servings, units)
    const rendered = new Map(scaled.steps.map((s) => [s.id, s]))
    const scaledByKey = new Map(scaled.ingredients.map((i) => [i.key, i]))
    const viewByKey = new Map(view.ingredients.map((i) => [i.key, i]))
    const lastStepId = view.steps.at(-1)?.id
    for (const s of view.steps) {
      if (!ids.has(s.id)) continue
      const keys = [...new Set(findStepTokens(s.text).map((t) => t.key))]
      const used = keys.flatMap((k) => {
        const sc = scaledByKey.get(k)
        const v = viewByKey.get(k)
        return sc && v ? [{ scaled: sc, view: v }] : []
      })
      const allergens = [...new Set(used.flatMap((u) => (u.view.allergens?.eu ?? []) as EuAllergenId[]))].map(euAllergenLabel)
      // The US list beside the EU one when the shoot works in US units (FALCPA 2004, FASTER Act 2021).
      const allergensUs = units === 'us' ? [...new Set(used.flatMap((u) => (u.view.allergens?.us ?? []) as UsAllergenId[]))].map(usAllergenLabel) : []
      const allergensUnchecked = used.filter((u) => allergenStateOf(u.view as never) !== 'checked').map((u) => u.view.item)
      const plan = first?.steps[String(s.id)]
      const cautions = allergens.length && !s.cautions.includes('allergen') ? [...s.cautions, 'allergen'] : s.cautions
      steps[String(s.id)] = {
        recipeId, recipeTitle: view.title, position: s.position, text: s.text, handsOn: s.handsOn,
        durationMin: s.durationMin, durationMax: s.durationMax, cameraShot: s.cameraShot, cameraNote: s.cameraNote,
        cautions,
        cautionNotes: cautions.map((c) => (isCautionId(c) ? { id: c, label: CAUTIONS[c].label, text: CAUTIONS[c].text } : { id: c, label: c, text: c })),
        // The lines to say, their amounts written for the shoot's servings and units (never a raw {{key}}).
        script: rendered.get(s.id)?.script.map(segmentsText) ?? s.script,
        scriptSegments: rendered.get(s.id)?.script ?? s.script.map((text) => [{ text }]),
        segments: rendered.get(s.id)?.segments ?? [{ text: s.text }],
        ingredients: used.map((u) => ({ key: u.scaled.key, item: u.scaled.item, amount: u.scaled.text })),
        allergens,
        allergensUs,
        allergensUnchecked,
        plannedStartMs: plan?.startMs ?? null,
        plannedEndMs: plan?.endMs ?? null,
        name: names.get(String(s.id)) ?? null,
        photo: s.photo,
        plating: s.id === lastStepId ? view.photo : null,
      }
    }
  }
  return { steps, units, makespanMs: first?.makespanMs ?? null, show: show ? showForShoot(show, row.state.runOrder, views) : null }
}

/** The episode's show, or null when the episode has gone since the shoot was made. */
async function showOf(episodeId: number): Promise<EpisodeShow | null> {
  try {
    return await episodeShow(episodeId)
  } catch (error) {
    if (isDomainError(error) && error.code === 'not-found') return null
    throw error
  }
}

/**
 * The show as the shoot's screens read it: segments by the shoot's segment ids, each recipe's lines
 * at its first and last step in the shoot's run order (so side by side, each recipe still opens and
 * closes where the host meets it), and every shoot segment's planned time.
 */
export function showForShoot(show: EpisodeShow, runOrder: readonly ShootSegment[], recipes: readonly Pick<RecipeView, 'id' | 'steps'>[]): ShootShow {
  const segments: ShootShow['segments'] = {}
  const atSteps: ShootShow['atSteps'] = {}
  const plannedMs: ShootShow['plannedMs'] = {}
  const order = runOrder.flatMap((seg) => seg.stepIds.map((stepId) => ({ stepId, segmentId: seg.id })))
  for (const s of show.segments) {
    const id = `segment-${s.id}`
    segments[id] = {
      kind: s.kind, title: s.title, recipeId: s.recipeId, script: s.script, closing: s.closing, shot: segmentShot({ kind: s.kind, shot: s.shot }),
      claims: s.claims.filter((c) => c.verdict !== 'true').map((c) => ({ text: c.text, verdict: c.verdict as 'false' | 'unknown', detail: c.detail })),
      missing: s.missing, plannedMs: s.totalMs,
    }
    const recipe = s.recipeId ? recipes.find((r) => r.id === s.recipeId) : undefined
    const mine = new Set((recipe?.steps ?? []).map((st) => String(st.id)))
    const met = order.filter((o) => mine.has(o.stepId))
    for (const seg of new Set(met.map((m) => m.segmentId))) plannedMs[seg] = (plannedMs[seg] ?? 0) + s.totalMs
    if (!met.length) {
      if (runOrder.some((seg) => seg.id === id)) plannedMs[id] = (plannedMs[id] ?? 0) + s.totalMs
      continue
    }
    if (s.script.parts.length) (atSteps[met[0]!.stepId] ??= {}).opening = { segmentId: id, title: s.title, script: s.script }
    if (s.closing?.parts.length) (atSteps[met.at(-1)!.stepId] ??= {}).closing = { segmentId: id, title: s.title, script: s.closing }
  }
  return { segments, atSteps, plannedMs, runtime: show.runtime, wpm: show.pace.wpm, flags: show.flags }
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
  const [episode, studio, recipes, prices] = await Promise.all([
    row.episodeId === null ? null : Episode.findByPk(row.episodeId, { attributes: ['version', 'updatedAt', 'hostId'] }),
    Studio.findByPk(row.studioId, { attributes: ['updatedAt'] }),
    recipeIds.length ? Recipe.findAll({ where: { id: recipeIds }, attributes: ['id', 'version', 'updatedAt'], order: [['id', 'ASC']] }) : [],
    Price.findOne({ where: { studioId: row.studioId }, attributes: [[fn('COUNT', col('id')), 'n'], [fn('MAX', col('updated_at')), 'latest']], raw: true }),
  ])
  // A live field may name a recipe outside the run order, and the presenter's pace times the show.
  const [named, host] = await Promise.all([
    row.episodeId === null ? [] : Recipe.findAll({ where: { studioId: row.studioId }, attributes: ['id', 'version'], order: [['id', 'ASC']] }),
    episode?.hostId ? Membership.findOne({ where: { studioId: row.studioId, userId: episode.hostId }, attributes: ['readingWpm'] }) : null,
  ])
  const stamp = (d: Date | string | undefined | null) => (d ? new Date(d).getTime() : 0)
  return JSON.stringify([
    episode ? [episode.version, stamp(episode.updatedAt), host?.readingWpm ?? null] : null,
    stamp(studio?.updatedAt),
    recipes.map((r) => [r.id, r.version, stamp(r.updatedAt)]),
    named.map((r) => [r.id, r.version]),
    prices,
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

  /** The script when it has changed since it was last built (a price, a recipe, the episode), else null. */
  async function changed(row: ShootRow): Promise<ShootScript | null> {
    const before = entries.get(row.id)?.version
    const script = await scriptOf(row)
    return before !== undefined && entries.get(row.id)?.version !== before ? script : null
  }

  return Object.assign(scriptOf, { stats, changed, forget: (shootId: number) => entries.delete(shootId) })
}
