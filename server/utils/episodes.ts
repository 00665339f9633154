// Episodes: a title, the shoot's settings (date, servings, units, budget, target length, presenter)
// and a run order of segments: intro, recipe, sponsor read, outro and free segments, each with its
// script (shared/utils/show-segments.ts). The run order is written whole in one transaction, so a
// reorder is atomic, and only over the version the editor read.
import type { H3Event } from 'h3'
import { Episode, EpisodeSegment, Membership, Recipe, RecipeStep } from '../db/models'
import { DomainError } from '../../shared/utils/domain-error'
import type { StudioAction } from '../../shared/utils/roles'
import { defaultSegmentTitle, newSegmentId, type SegmentKind, type ShowSegment } from '../../shared/utils/show-segments'

type Loaded = Episode & { segments: EpisodeSegment[] }

async function recipeTitles(ids: number[]) {
  const rows = ids.length ? await Recipe.findAll({ where: { id: ids }, attributes: ['id', 'title'] }) : []
  return new Map(rows.map((r) => [r.id, r.title]))
}

export async function episodeView(e: Loaded) {
  const segments = [...e.segments].sort((a, b) => a.position - b.position)
  const titles = await recipeTitles(segments.map((s) => s.recipeId).filter((x): x is number => !!x))
  return {
    id: e.id, studioId: e.studioId, title: e.title, version: e.version, updatedAt: e.updatedAt,
    shootDate: e.shootDate ?? null, servings: e.servings ?? null, unitSystem: (e.unitSystem ?? null) as 'metric' | 'us' | null,
    budgetPerServingMinor: e.budgetPerServingMinor ?? null, targetSeconds: e.targetSeconds ?? null, hostId: e.hostId ?? null,
    segments: segments.map((s) => ({
      id: s.segKey, position: s.position, kind: s.kind as SegmentKind, recipeId: s.recipeId,
      title: s.title ?? defaultSegmentTitle(s.kind as SegmentKind, s.recipeId ? titles.get(s.recipeId) : null),
      script: s.script, closing: s.closing, shot: s.shot ?? '',
    })),
  }
}

export async function loadEpisode(id: number) {
  await useDb()
  const e = (await Episode.findByPk(id, { include: [{ model: EpisodeSegment, as: 'segments' }] })) as Loaded | null
  return e ? episodeView(e) : null
}

export async function listEpisodes(studioId: number) {
  await useDb()
  const rows = (await Episode.findAll({ where: { studioId }, include: [{ model: EpisodeSegment, as: 'segments' }], order: [['id', 'DESC']] })) as Loaded[]
  const views = await Promise.all(rows.map(episodeView))
  return views.map((v) => ({
    id: v.id, title: v.title, updatedAt: v.updatedAt,
    recipes: v.segments.filter((s) => s.recipeId).map((s) => ({ id: s.recipeId!, title: s.title })),
  }))
}

/**
 * An episode's run order with every recipe segment's steps, in recipe order: what the cook plan
 * schedules and what a shoot starts from. A 'not-found' DomainError when there is no such episode.
 */
export async function loadEpisodeRunOrder(episodeId: number) {
  const episode = await loadEpisode(episodeId)
  if (!episode) throw new DomainError('not-found', 'There is no such episode.')
  const recipeIds = episode.segments.map((s) => s.recipeId).filter((x): x is number => !!x)
  const steps = recipeIds.length ? await RecipeStep.findAll({ where: { recipeId: recipeIds }, order: [['recipeId', 'ASC'], ['position', 'ASC']] }) : []
  return {
    ...episode,
    segments: episode.segments.map((s) => ({
      ...s, steps: s.recipeId ? steps.filter((st) => st.recipeId === s.recipeId) : [],
    })),
  }
}

/** The guard for /api/episodes/:id/…: the caller may do `action` in the episode's studio. */
export async function requireEpisode(event: H3Event, action: StudioAction, param = 'id') {
  const studioOf = async (id: number) => (await Episode.findByPk(id, { attributes: ['studioId'] }))?.studioId ?? null
  const { caller, id, studioId } = await requireStudioThing(event, action, studioOf, 'episode', param)
  return { caller, episodeId: id, studioId }
}

async function assertRecipesInStudio(studioId: number, recipeIds: number[], field = 'recipeIds') {
  const unique = [...new Set(recipeIds)]
  if (unique.length !== recipeIds.length) throw new DomainError('invalid', 'Recipes in run order: a recipe appears twice; put each recipe in the episode once.', { field })
  if (unique.length && (await Recipe.count({ where: { id: unique, studioId } })) !== unique.length) {
    throw new DomainError('invalid', 'Recipes in run order: one of the recipes is not in this studio; choose from the studio\'s recipes.', { field })
  }
}

/** The run order as recipe segments only (the short form): the segments already there for those recipes keep their scripts. */
function recipeOnlyRunOrder(current: ShowSegment[], recipeIds: number[]): ShowSegment[] {
  const byRecipe = new Map(current.filter((s) => s.kind === 'recipe').map((s) => [s.recipeId, s]))
  const recipes = recipeIds.map((recipeId) => byRecipe.get(recipeId) ?? { id: newSegmentId(), kind: 'recipe' as const, recipeId, title: '', script: [] })
  const kept = current.filter((s) => s.kind !== 'recipe')
  // Talk before the first recipe stays before; the rest (sponsor, outro) follows the recipes.
  const firstRecipe = current.findIndex((s) => s.kind === 'recipe')
  const before = firstRecipe < 0 ? kept.filter((s) => s.kind === 'intro') : kept.filter((s) => current.indexOf(s) < firstRecipe)
  return [...before, ...recipes, ...kept.filter((s) => !before.includes(s))]
}

async function writeSegments(episodeId: number, segments: ShowSegment[]) {
  await EpisodeSegment.destroy({ where: { episodeId } })
  const titles = await recipeTitles(segments.map((s) => s.recipeId).filter((x): x is number => !!x))
  await EpisodeSegment.bulkCreate(segments.map((s, i) => ({
    episodeId, segKey: s.id, position: i + 1, kind: s.kind, recipeId: s.recipeId ?? null,
    // A recipe segment titled as its recipe follows the recipe's title when it is renamed.
    title: s.kind === 'recipe' && (!s.title.trim() || s.title.trim() === titles.get(s.recipeId!)) ? null : s.title.trim(),
    script: s.script, closing: s.kind === 'recipe' ? s.closing ?? [] : [], shot: s.shot?.trim() || null,
  })))
}

type EpisodeSettings = {
  shootDate?: string | null; servings?: number | null; unitSystem?: 'metric' | 'us' | null
  budgetPerServingMinor?: number | null; targetSeconds?: number | null; hostId?: number | null
}

async function assertHost(studioId: number, hostId: number | null | undefined) {
  if (hostId == null) return
  const member = await Membership.findOne({ where: { studioId, userId: hostId } })
  if (!member) throw new DomainError('invalid', 'Presenter: choose someone from the studio\'s crew list.', { field: 'hostId' })
}

export async function createEpisode(studioId: number, body: { title: string; recipeIds: number[] }) {
  const sequelize = await useDb()
  await assertRecipesInStudio(studioId, body.recipeIds)
  const id = await sequelize.transaction(async () => {
    const episode = await Episode.create({ studioId, title: body.title })
    await writeSegments(episode.id, recipeOnlyRunOrder([], body.recipeIds))
    return episode.id
  })
  return (await loadEpisode(id))!
}

export async function saveEpisode(
  episodeId: number, studioId: number,
  body: { version: number; title?: string; recipeIds?: number[]; segments?: ShowSegment[] } & EpisodeSettings,
) {
  const sequelize = await useDb()
  if (body.recipeIds) await assertRecipesInStudio(studioId, body.recipeIds)
  if (body.segments) await assertRecipesInStudio(studioId, body.segments.flatMap((s) => (s.recipeId ? [s.recipeId] : [])), 'segments')
  await assertHost(studioId, body.hostId)
  const settings = Object.fromEntries(
    (['shootDate', 'servings', 'unitSystem', 'budgetPerServingMinor', 'targetSeconds', 'hostId'] as const)
      .filter((k) => body[k] !== undefined).map((k) => [k, body[k]]),
  )
  await sequelize.transaction(async () => {
    const [changed] = await Episode.update(
      { ...(body.title ? { title: body.title } : {}), ...settings, version: body.version + 1 },
      { where: { id: episodeId, version: body.version } },
    )
    if (!changed) {
      const current = await loadEpisode(episodeId)
      throw new DomainError('conflict', `Someone else saved this episode while you were editing (now version ${current?.version}). Your changes are still on the page: compare, then save again.`, { data: { current } })
    }
    if (body.segments) await writeSegments(episodeId, body.segments)
    else if (body.recipeIds) {
      const current = (await loadEpisode(episodeId))!
      await writeSegments(episodeId, recipeOnlyRunOrder(current.segments.map(showSegmentOf), body.recipeIds))
    }
  })
  return (await loadEpisode(episodeId))!
}

type SegmentView = Awaited<ReturnType<typeof episodeView>>['segments'][number]

/** A stored segment as the run order is written. */
function showSegmentOf(s: SegmentView): ShowSegment {
  return { id: s.id, kind: s.kind, title: s.title, ...(s.recipeId ? { recipeId: s.recipeId } : {}), script: s.script, closing: s.closing, shot: s.shot }
}
