// The publish kit (server side): a recipe's public page with its schema.org Recipe JSON-LD (and the
// episode's video with its chapters as Clip parts), and the episode's video description. The words
// and numbers are made in shared/utils/publish-kit.ts; this file gathers the data.
import { randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { Episode, Recipe, RecipePage } from '../db/models'
import { DomainError } from '../../shared/utils/domain-error'
import { countryOfLocale } from '../../shared/utils/cautions'
import { formatMoney } from '../../shared/utils/money'
import { exportSchemaOrgRecipe } from '../../shared/utils/schemaorg-export'
import { HOBLINE_LD_PREFIX } from '../../shared/utils/schemaorg-steps'
import { takeChapters } from '../../shared/utils/take-log'
import { recipeClips, segmentChapterLines, videoDescription, type DescriptionRecipe } from '../../shared/utils/publish-kit'
import type { ShootRow } from '../shoot/store'
import { episodeShow } from './show'
import { loadEpisodeRunOrder } from './episodes'
import { costLoadedRecipe, pricesFor, scaleLoadedRecipe } from './recipe-maths'
import { loadRecipe, recipeDraft, studioSettings, type RecipeView } from './recipes'

type Settings = Awaited<ReturnType<typeof studioSettings>>
type Prices = Awaited<ReturnType<typeof pricesFor>>

/** "2 cans butter beans, drained": the scaled amount, the item and its prep. */
const ingredientLine = (i: { text: string; item: string; prep: string | null }) => `${[i.text, i.item].filter(Boolean).join(' ')}${i.prep ? `, ${i.prep}` : ''}`

/** Words of a list: "a", "a and b", "a, b and c". */
const listWords = (items: string[]) => items.length <= 1 ? (items[0] ?? '') : `${items.slice(0, -1).join(', ')} and ${items.at(-1)}`

/** The cost per serving in words, with and without the optional ingredients, and where the prices were seen. */
export function recipeCostWords(view: RecipeView, settings: Settings, prices: Prices) {
  const cost = costLoadedRecipe(view, settings, prices)
  const money = (minor: number) => formatMoney(minor, cost.currency, settings.locale)
  const optional = view.ingredients.filter((i) => i.optional).map((i) => i.item)
  const unpriced = [...cost.missing, ...cost.problems, ...cost.unmeasured].filter((l) => !l.optional).map((l) => l.item)
  let line = `${money(cost.perServingMinor)} a serving`
  if (optional.length && cost.perServingWithOptionalMinor !== cost.perServingMinor) {
    line += ` (${money(cost.perServingWithOptionalMinor)} with the optional ${listWords(optional)})`
  }
  if (unpriced.length) line += `, not counting ${listWords(unpriced)} (no price yet)`
  const used = new Set(cost.lines.filter((l) => l.status === 'priced').map((l) => l.priceId))
  const seen = prices.filter((p) => used.has(p.id))
  return {
    line, complete: cost.complete, currency: cost.currency,
    perServingMinor: cost.perServingMinor, perServingWithOptionalMinor: cost.perServingWithOptionalMinor,
    prices: pricesWords(seen, settings),
  }
}

/** "Prices seen at Marrow Lane Grocer and Tallow Yard Pantry, 3 Nov 2026 to 12 Nov 2026." */
function pricesWords(seen: Prices, settings: Settings) {
  const shops = [...new Set(seen.map((p) => p.shop).filter((s): s is string => !!s))]
  const dates = seen.map((p) => p.date).filter((d): d is string => !!d).sort()
  const day = (iso: string) => new Intl.DateTimeFormat(settings.locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })
    .format(new Date(`${iso}T00:00:00Z`))
  const when = dates.length === 0 ? '' : dates[0] === dates.at(-1) ? `, ${day(dates[0]!)}` : `, ${day(dates[0]!)} to ${day(dates.at(-1)!)}`
  const line = seen.length === 0 ? 'No prices yet.' : `Prices seen at ${shops.length ? listWords(shops) : 'shops not named'}${when}.`
  return { shops, from: dates[0] ?? null, to: dates.at(-1) ?? null, line }
}

/** "Recording 12 · 2 Dec 2026, 14:05 · 7 chapters": which recording, when it started in the studio's time. */
function takeLabel(row: ShootRow, settings: Settings): string {
  const started = row.state.startedAtServerMs
  const when = started === null ? 'not started' : new Intl.DateTimeFormat(settings.locale, {
    day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: settings.timeZone,
  }).format(started)
  const chapters = row.state.markers.filter((m) => m.kind === 'chapter').length
  return `Recording ${row.id} · ${when} · ${chapters} ${chapters === 1 ? 'chapter' : 'chapters'}`
}

/** The chapters of a recording, each with its step's name (or its segment's title) for a Clip. */
function namedChapters(row: ShootRow) {
  const steps = row.state.plan?.steps ?? []
  const names = new Map(steps.map((s) => [s.id, s.name ?? s.label ?? s.recipeTitle]))
  return takeChapters(row.state.markers, row.state.runOrder, recipesOfSteps(row))
    .map((c) => ({ ...c, name: (c.stepId && names.get(c.stepId)) || c.segmentTitle }))
}

/** Each step's recipe title, from the shoot's plan. */
const recipesOfSteps = (row: ShootRow) => new Map((row.state.plan?.steps ?? []).map((s) => [s.id, s.recipeTitle]))

/** Where a recording ends: the recording time of its rolls (or its last marker, for a shoot still rolling). */
function recordingEndMs(row: ShootRow): number {
  const last = Math.max(0, ...row.state.markers.map((m) => m.recordingMs ?? 0))
  return Math.max(row.state.recordedMs ?? 0, last)
}

/** The chosen recording of an episode, when it still is one of the episode's recordings. */
async function chosenTake(episode: { id: number; publishShootId: number | null }): Promise<ShootRow | null> {
  if (episode.publishShootId === null) return null
  const row = await useShoot().store.read(episode.publishShootId)
  return row && row.episodeId === episode.id && row.mode === 'take' ? row : null
}

/** The schema.org VideoObject of a recipe's page: the episode's video and its chapters in the recipe's segment. */
async function recipeVideo(recipeId: number, episodeId: number | null, imageUrl: string | null) {
  if (episodeId === null) return null
  const episode = await Episode.findByPk(episodeId)
  const row = episode && await chosenTake(episode)
  if (!episode || !row) return null
  const steps = new Set((await loadRecipe(recipeId))?.steps.map((s) => String(s.id)) ?? [])
  if (!row.state.runOrder.some((s) => s.stepIds.some((id) => steps.has(id)))) return null
  const video: Record<string, unknown> = {
    '@type': 'VideoObject', name: episode.title, description: `${episode.title}: the recipe's part of the episode, chapter by chapter.`,
    uploadDate: new Date(row.state.endedAtServerMs ?? row.state.startedAtServerMs ?? Date.now()).toISOString(),
    hasPart: recipeClips(steps, namedChapters(row), recordingEndMs(row), episode.videoUrl),
  }
  if (episode.videoUrl) video.contentUrl = episode.videoUrl
  if (imageUrl) video.thumbnailUrl = [imageUrl]
  return video
}

/** The recipe's JSON-LD for the public: the production's own notes (lines to say, camera notes) left out. */
function publicJsonLd(view: RecipeView, imageUrl: string | null) {
  const ld = exportSchemaOrgRecipe(recipeDraft(view))
  const hidden = new Set(['script', 'cameraShot', 'cameraNote'].map((key) => `${HOBLINE_LD_PREFIX}:${key}`))
  const strip = (node: Record<string, unknown>): Record<string, unknown> => Object.fromEntries(Object.entries(node)
    .filter(([key]) => !hidden.has(key))
    .map(([key, value]) => [key, key === 'itemListElement' && Array.isArray(value) ? value.map((n) => n?.['@type'] ? strip(n) : n) : value]))
  ld.recipeInstructions = (ld.recipeInstructions as Record<string, unknown>[]).map(strip)
  if (imageUrl) ld.image = [imageUrl]
  return ld
}

/** The stored photo of a published recipe; 404 when the page or the photo is not there. */
export async function publishedPhotoKey(slug: string): Promise<string> {
  await useDb()
  const page = await RecipePage.findOne({ where: { slug } })
  const recipe = page && await Recipe.findByPk(page.recipeId, { attributes: ['photo'] })
  if (!recipe?.photo) throw new DomainError('not-found', 'There is no published photo at this address.')
  return recipe.photo
}

/** A published recipe's page, for anyone with its address; 404 when it is not published. */
export async function publicRecipePage(slug: string, site: string) {
  await useDb()
  const page = await RecipePage.findOne({ where: { slug } })
  const view = page && await loadRecipe(page.recipeId)
  if (!page || !view) throw new DomainError('not-found', 'There is no published recipe at this address. Check the address, or ask the studio whether it is still published.')
  const settings = await studioSettings(view.studioId)
  const prices = await pricesFor(view.studioId)
  const scaled = scaleLoadedRecipe(view, settings)
  const photo = view.photo ? { url: `/api/published/recipes/${slug}/photo`, thumbUrl: `/api/published/recipes/${slug}/photo?size=thumb` } : null
  const imageUrl = photo ? `${site}${photo.url}` : null
  const jsonLd = publicJsonLd(view, imageUrl)
  const video = await recipeVideo(view.id, page.episodeId, imageUrl)
  if (video) jsonLd.video = video
  return {
    slug, studio: settings.name, title: view.title, summary: view.summary, servings: view.servings, yieldText: view.yieldText,
    times: view.times, photo, cautionCountry: countryOfLocale(settings.locale),
    ingredients: scaled.ingredients.map((i) => ({ key: i.key, text: ingredientLine(i), optional: i.optional, group: i.group })),
    steps: view.steps.map((s, n) => ({ position: s.position, name: s.name, text: scaled.steps[n]!.text, cautions: s.cautions, group: s.group })),
    allergens: view.allergens,
    cost: recipeCostWords(view, settings, prices),
    jsonLd,
  }
}

export type PublicRecipePage = Awaited<ReturnType<typeof publicRecipePage>>

const SLUG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/

/** Publishes a recipe of the episode at a chosen or a new random address (re-publishing keeps its address unless a new one is chosen). */
export async function publishRecipe(episodeId: number, recipeId: number, chosen: string | null, byName: string) {
  await episodeRecipe(episodeId, recipeId)
  if (chosen !== null && !SLUG.test(chosen)) {
    throw new DomainError('invalid', 'Address: use lower-case letters, digits and single hyphens, such as "smoky-bean-stew".', { field: 'slug' })
  }
  const current = await RecipePage.findByPk(recipeId)
  const slug = chosen ?? current?.slug ?? randomBytes(12).toString('base64url').toLowerCase().replace(/[^a-z0-9]/g, '')
  const other = await RecipePage.findOne({ where: { slug } })
  if (other && other.recipeId !== recipeId) {
    throw new DomainError('conflict', `Address: "${slug}" is taken by another published recipe; choose another.`, { field: 'slug' })
  }
  if (current) await current.update({ slug, episodeId, publishedByName: byName })
  else await RecipePage.create({ recipeId, slug, episodeId, publishedByName: byName })
  return slug
}

export async function unpublishRecipe(episodeId: number, recipeId: number) {
  await episodeRecipe(episodeId, recipeId)
  await RecipePage.destroy({ where: { recipeId } })
}

/** The recipe number in a route's address. */
export function recipeIdParam(event: H3Event): number {
  const id = Number(getRouterParam(event, 'recipeId'))
  if (!Number.isSafeInteger(id) || id <= 0) throw new DomainError('invalid', 'The recipe number in the address is a whole number, such as /publish/recipes/12.')
  return id
}

/** Refuses a recipe that is not in the episode's run order (so no other studio's recipe can be reached by its number). */
async function episodeRecipe(episodeId: number, recipeId: number) {
  const episode = await loadEpisodeRunOrder(episodeId)
  if (!episode.segments.some((s) => s.recipeId === recipeId)) {
    throw new DomainError('invalid', 'This recipe is not in the episode\'s run order; publish the recipes the episode cooks.', { field: 'recipeId' })
  }
}

/** The episode's publish kit: the chosen recording, its chapter lines, each recipe's page and the video description. */
export async function publishKit(episodeId: number, site: string) {
  const show = await episodeShow(episodeId)
  const episode = (await Episode.findByPk(episodeId))!
  const runOrder = await loadEpisodeRunOrder(episodeId)
  const settings = await studioSettings(runOrder.studioId)
  const prices = await pricesFor(runOrder.studioId)
  const row = await chosenTake(episode)
  const chapters = row ? segmentChapterLines(takeChapters(row.state.markers, row.state.runOrder, recipesOfSteps(row))) : { lines: [], startsAtZero: false }
  const recipeIds = runOrder.segments.map((s) => s.recipeId).filter((id): id is number => !!id)
  const pages = new Map((await RecipePage.findAll({ where: { recipeId: recipeIds } })).map((p) => [p.recipeId, p]))
  const recipes = []
  const described: DescriptionRecipe[] = []
  const seenPrices: string[] = []
  for (const id of recipeIds) {
    const view = (await loadRecipe(id))!
    const words = recipeCostWords(view, settings, prices)
    const page = pages.get(id)
    const url = page ? `${site}/r/${page.slug}` : null
    const scaled = scaleLoadedRecipe(view, settings, show.servings, show.units)
    const ingredients = scaled.ingredients.map((i) => `${ingredientLine(i)}${i.optional ? ' (optional)' : ''}`)
    recipes.push({ recipeId: id, title: view.title, cost: words, page: page ? { slug: page.slug, url, publishedBy: page.publishedByName } : null })
    described.push({ title: view.title, costLine: `${words.line} at ${show.servings} ${show.servings === 1 ? 'serving' : 'servings'}`, ingredients, pageUrl: url })
    seenPrices.push(words.prices.line)
  }
  const premise = show.segments.find((s) => s.kind === 'intro')?.script.text ?? ''
  const takes = (await useShoot().store.takesOf(episodeId)).map((t) => ({ id: t.id, label: takeLabel(t, settings) }))
  return {
    episodeId, title: episode.title, shootId: row?.id ?? null, takes, videoUrl: episode.videoUrl, premise,
    chapters: chapters.lines, chaptersStartAtZero: chapters.startsAtZero, recipes,
    description: videoDescription({ title: episode.title, premise, chapters: chapters.lines, recipes: described, pricesLine: [...new Set(seenPrices)].join(' ') }),
  }
}

/** Chooses the recording whose take log gives the chapters, and the finished video's address. */
export async function setPublishTake(episodeId: number, body: { shootId?: number | null; videoUrl?: string | null }) {
  const episode = await Episode.findByPk(episodeId)
  if (!episode) throw new DomainError('not-found', 'There is no such episode.')
  if (body.shootId !== undefined && body.shootId !== null) {
    const row = await useShoot().store.read(body.shootId)
    if (!row || row.episodeId !== episodeId) throw new DomainError('invalid', 'Recording: choose one of this episode\'s shoots.', { field: 'shootId' })
    if (row.mode !== 'take') throw new DomainError('invalid', 'Recording: a rehearsal has no footage; choose a recording.', { field: 'shootId' })
  }
  await episode.update({
    ...(body.shootId !== undefined ? { publishShootId: body.shootId } : {}),
    ...(body.videoUrl !== undefined ? { videoUrl: body.videoUrl } : {}),
  })
}
