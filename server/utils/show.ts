// The episode as a show, filled from the data: every segment's script with its live fields written
// (shared/utils/live-fields.ts), the plain-word claims checked (script-claims.ts), and the planned
// runtime at the presenter's pace with each recipe's share of the cook plan (show-runtime.ts). The
// episode page, the desk and the shoot's script all read it, so a price change shows everywhere.
import { Membership, Recipe, User } from '../db/models'
import { planCook } from '../../shared/utils/plan'
import { PlanError } from '../../shared/utils/plan-types'
import { renderScript, showRecipeCost, type RenderedScript, type ShowData, type ShowRecipeData } from '../../shared/utils/live-fields'
import { checkScriptClaims, claimScope, type Claim } from '../../shared/utils/script-claims'
import { cookShares, showRuntime, SHOW_WPM_DEFAULT } from '../../shared/utils/show-runtime'
import type { ScriptPiece, SegmentKind } from '../../shared/utils/show-segments'
import { studioKitchenDisplay } from '../../shared/utils/scale'
import { episodePlanSteps } from './cook-plan'
import { loadEpisodeRunOrder } from './episodes'
import { costLoadedRecipe, pricesFor, scaleLoadedRecipe } from './recipe-maths'
import { loadRecipe, studioSettings } from './recipes'

type RunOrder = Awaited<ReturnType<typeof loadEpisodeRunOrder>>
type Settings = Awaited<ReturnType<typeof studioSettings>>

export type ShowClaim = Claim & { piece: number; part: 'script' | 'closing' }

export interface ShowSegmentView {
  id: string
  kind: SegmentKind
  title: string
  recipeId: number | null
  /** What the camera frames ('' for the kind's usual shot). */
  shot: string
  script: RenderedScript
  closing: RenderedScript | null
  claims: ShowClaim[]
  /** Missing data of the live fields, in plain words. */
  missing: string[]
  words: number
  readMs: number
  cookMs: number
  totalMs: number
}

/** Every recipe a script names (a field can name a recipe of the studio that is not in the run order). */
function namedRecipeIds(episode: RunOrder): number[] {
  const ids = new Set<number>()
  for (const s of episode.segments) {
    if (s.recipeId) ids.add(s.recipeId)
    for (const p of [...s.script, ...s.closing]) if ('field' in p && 'recipeId' in p.field) ids.add(p.field.recipeId)
  }
  return [...ids]
}

async function showRecipes(episode: RunOrder, settings: Settings, units: 'metric' | 'us', servings: number | null) {
  const ids = namedRecipeIds(episode)
  const inStudio = ids.length ? (await Recipe.findAll({ where: { id: ids, studioId: episode.studioId }, attributes: ['id'] })).map((r) => r.id) : []
  const prices = await pricesFor(episode.studioId)
  const out: ShowRecipeData[] = []
  for (const id of inStudio) {
    const view = await loadRecipe(id)
    if (!view) continue
    const scaled = scaleLoadedRecipe(view, settings, servings ?? undefined, units)
    const t = view.times
    out.push({
      id, title: view.title, servings: scaled.servings,
      ingredients: scaled.ingredients.map((i) => ({ key: i.key, item: i.item, text: i.text })),
      cost: showRecipeCost(costLoadedRecipe(view, settings, prices)),
      totalSeconds: t.total ?? (t.prep !== null && t.cook !== null ? t.prep + t.cook : null),
    })
  }
  return out
}

/** Each recipe segment's cook time on camera from the plan (cookShares), or its steps one after another when the planner refuses. */
function cookTimes(episode: RunOrder, settings: Settings): { byKey: Map<string, number>; from: 'plan' | 'written'; problem: string | null } {
  const { input } = episodePlanSteps(episode)
  const recipeSegments = episode.segments.filter((s) => s.recipeId)
  try {
    const plan = planCook({ steps: input, kitchen: settings.kitchen })
    const placed = new Map(plan.steps.map((p) => [p.id, { startMs: Math.round(p.start * 1000), endMs: Math.round(p.end * 1000) }]))
    const byKey = cookShares(
      recipeSegments.map((s) => ({ id: s.id, steps: s.steps.flatMap((st) => placed.get(String(st.id)) ?? []) })),
      Math.round(plan.makespan * 1000),
    )
    return { byKey, from: 'plan', problem: null }
  } catch (error) {
    if (!(error instanceof PlanError)) throw error
    const duration = new Map(input.map((p) => [p.id, p.duration]))
    const byKey = new Map(recipeSegments.map((s) => [s.id, Math.round(s.steps.reduce((sum, st) => sum + (duration.get(String(st.id)) ?? 0), 0) * 1000)]))
    return { byKey, from: 'written', problem: error.message }
  }
}

/** The presenter's reading pace: their own setting in this studio, else the default, and where it came from. */
async function presenterPace(studioId: number, hostId: number | null) {
  if (hostId === null) return { wpm: SHOW_WPM_DEFAULT, presenter: null as string | null, from: 'default' as const }
  const [member, user] = await Promise.all([Membership.findOne({ where: { studioId, userId: hostId } }), User.findByPk(hostId, { attributes: ['name'] })])
  if (!member) return { wpm: SHOW_WPM_DEFAULT, presenter: null, from: 'default' as const }
  return { wpm: member.readingWpm ?? SHOW_WPM_DEFAULT, presenter: user?.name ?? null, from: member.readingWpm ? 'presenter' as const : 'default' as const }
}

/** The data the live fields read, and the episode it came from. */
export async function episodeShowData(episodeId: number) {
  const episode = await loadEpisodeRunOrder(episodeId)
  const settings = await studioSettings(episode.studioId)
  const units = (episode.unitSystem ?? (settings.unitSystem === 'us' ? 'us' : 'metric')) as 'metric' | 'us'
  const recipes = await showRecipes(episode, settings, units, episode.servings)
  const firstRecipe = recipes.find((r) => episode.segments.some((s) => s.recipeId === r.id))
  const data: ShowData = {
    servings: episode.servings ?? firstRecipe?.servings ?? 1,
    display: studioKitchenDisplay(settings, units),
    locale: settings.locale,
    currency: settings.currency,
    budgetPerServingMinor: episode.budgetPerServingMinor ?? settings.budgetPerServingMinor,
    recipes,
  }
  return { episode, settings, units, data }
}

/** The show: each segment rendered and checked, with its planned time, and the runtime against the target. */
export async function episodeShow(episodeId: number) {
  const { episode, settings, units, data } = await episodeShowData(episodeId)
  const pace = await presenterPace(episode.studioId, episode.hostId)
  const cook = cookTimes(episode, settings)
  const rendered = episode.segments.map((s) => {
    const scope = claimScope({ kind: s.kind, recipeId: s.recipeId ?? undefined }, data)
    const check = (pieces: ScriptPiece[], part: ShowClaim['part']) => checkScriptClaims(pieces, data, scope).map((c) => ({ ...c, part }))
    const script = renderScript(s.script, data)
    const closing = s.kind === 'recipe' ? renderScript(s.closing, data) : null
    return { s, script, closing, claims: [...check(s.script, 'script'), ...check(s.closing, 'closing')] }
  })
  const runtime = showRuntime(
    rendered.map((r) => ({ id: r.s.id, text: `${r.script.text} ${r.closing?.text ?? ''}`, cookMs: cook.byKey.get(r.s.id) ?? 0 })),
    { wpm: pace.wpm, targetMs: episode.targetSeconds === null ? null : episode.targetSeconds * 1000 },
  )
  const times = new Map(runtime.segments.map((t) => [t.id, t]))
  const segments: ShowSegmentView[] = rendered.map(({ s, script, closing, claims }) => {
    const t = times.get(s.id)!
    return {
      id: s.id, kind: s.kind, title: s.title, recipeId: s.recipeId, shot: s.shot, script, closing, claims,
      missing: [...script.missing, ...(closing?.missing ?? [])],
      words: t.words, readMs: t.readMs, cookMs: t.cookMs, totalMs: t.totalMs,
    }
  })
  return {
    episodeId: episode.id, version: episode.version, servings: data.servings, servingsSet: episode.servings !== null, units,
    currency: data.currency, locale: data.locale, budgetPerServingMinor: data.budgetPerServingMinor,
    pace: { ...pace, source: 'About 150 words a minute: the average rate of conversational English given by the National Center for Voice and Speech.' },
    cook: { from: cook.from, problem: cook.problem },
    segments,
    runtime: { totalMs: runtime.totalMs, targetMs: runtime.targetMs, overMs: runtime.overMs },
    /** How many lines need a look: missing data and claims the data says are false. */
    flags: segments.reduce((n, s) => n + s.missing.length + s.claims.filter((c) => c.verdict === 'false').length, 0),
  }
}

export type EpisodeShow = Awaited<ReturnType<typeof episodeShow>>
