// Episodes: a title and a run order of segments (one recipe segment per recipe, in order, for now).
import type { H3Event } from 'h3'
import { Episode, EpisodeSegment, Recipe, RecipeStep } from '../db/models'
import { DomainError } from '../../shared/utils/domain-error'
import type { StudioAction } from '../../shared/utils/roles'

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
    segments: segments.map((s) => ({
      id: s.id, position: s.position, kind: s.kind, recipeId: s.recipeId,
      title: s.title ?? (s.recipeId ? titles.get(s.recipeId) ?? null : null),
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
      ...s, title: s.title ?? 'Segment', steps: s.recipeId ? steps.filter((st) => st.recipeId === s.recipeId) : [],
    })),
  }
}

/** The guard for /api/episodes/:id/…: the caller may do `action` in the episode's studio. */
export async function requireEpisode(event: H3Event, action: StudioAction, param = 'id') {
  const studioOf = async (id: number) => (await Episode.findByPk(id, { attributes: ['studioId'] }))?.studioId ?? null
  const { caller, id, studioId } = await requireStudioThing(event, action, studioOf, 'episode', param)
  return { caller, episodeId: id, studioId }
}

async function assertRecipesInStudio(studioId: number, recipeIds: number[]) {
  const unique = [...new Set(recipeIds)]
  if (unique.length !== recipeIds.length) throw new DomainError('invalid', 'Recipes in run order: a recipe appears twice; put each recipe in the episode once.', { field: 'recipeIds' })
  if (unique.length && (await Recipe.count({ where: { id: unique, studioId } })) !== unique.length) {
    throw new DomainError('invalid', 'Recipes in run order: one of the recipes is not in this studio; choose from the studio\'s recipes.', { field: 'recipeIds' })
  }
}

async function writeRecipeSegments(episodeId: number, recipeIds: number[]) {
  await EpisodeSegment.destroy({ where: { episodeId } })
  for (const [i, recipeId] of recipeIds.entries()) await EpisodeSegment.create({ episodeId, position: i + 1, kind: 'recipe', recipeId, title: null })
}

export async function createEpisode(studioId: number, body: { title: string; recipeIds: number[] }) {
  const sequelize = await useDb()
  await assertRecipesInStudio(studioId, body.recipeIds)
  const id = await sequelize.transaction(async () => {
    const episode = await Episode.create({ studioId, title: body.title })
    await writeRecipeSegments(episode.id, body.recipeIds)
    return episode.id
  })
  return (await loadEpisode(id))!
}

export async function saveEpisode(episodeId: number, studioId: number, body: { version: number; title?: string; recipeIds?: number[] }) {
  const sequelize = await useDb()
  if (body.recipeIds) await assertRecipesInStudio(studioId, body.recipeIds)
  await sequelize.transaction(async () => {
    const [changed] = await Episode.update(
      { ...(body.title ? { title: body.title } : {}), version: body.version + 1 },
      { where: { id: episodeId, version: body.version } },
    )
    if (!changed) {
      const current = await loadEpisode(episodeId)
      throw new DomainError('conflict', `Someone else saved this episode while you were editing (now version ${current?.version}). Your changes are still on the page: compare, then save again.`, { data: { current } })
    }
    if (body.recipeIds) await writeRecipeSegments(episodeId, body.recipeIds)
  })
  return (await loadEpisode(episodeId))!
}
