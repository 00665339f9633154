// Recipes: load, create, save with optimistic locking, delete, list. Plain objects out.
import type { H3Event } from 'h3'
import { Op } from 'sequelize'
import { Recipe, RecipeIngredient, RecipeStep, Studio } from '../db/models'
import type { RecipeCreateBody, RecipeUpdateBody } from '../../shared/utils/recipe-schemas'
import type { StudioAction } from '../../shared/utils/roles'
import type { RecipeDraft } from '../../shared/types/recipe'
import { DomainError } from '../../shared/utils/domain-error'
import type { KitchenProfile } from '../../shared/utils/plan-types'

type Loaded = Recipe & { ingredients: RecipeIngredient[]; steps: RecipeStep[] }

export function photoUrl(key: string | null | undefined) {
  return key ? { url: `/api/photos/${key}`, thumbUrl: `/api/photos/${key}?size=thumb` } : null
}

export function recipeView(r: Loaded) {
  const ingredients = [...r.ingredients].sort((a, b) => a.position - b.position).map((i) => ({
    id: i.id, key: i.key, position: i.position, min: i.min, max: i.max, unit: i.unit, item: i.item, prep: i.prep,
    optional: i.optional, toTaste: i.toTaste, group: i.group, allergens: i.allergens, priceId: i.priceId, stated: i.stated ?? null,
    allergenState: allergenStateOf(i as never), allergensCheckedBy: i.allergensCheckedBy ?? null,
    allergensCheckedAt: i.allergensCheckedAt ? new Date(i.allergensCheckedAt).toISOString() : null,
  }))
  const steps = [...r.steps].sort((a, b) => a.position - b.position).map((s) => ({
    id: s.id, position: s.position, name: s.name ?? null, text: s.text, script: s.script, handsOn: s.handsOn,
    durationMin: s.durationMin, durationMax: s.durationMax, station: s.station, after: s.after, links: s.links,
    cameraShot: s.cameraShot, cameraNote: s.cameraNote, cautions: s.cautions, group: s.group, readFromText: s.readFromText ?? [], photo: photoUrl(s.photo),
  }))
  return {
    id: r.id, studioId: r.studioId, version: r.version, title: r.title, summary: r.summary, servings: r.servings, yieldText: r.yieldText,
    tags: r.tags, notes: r.notes, times: r.times, photo: photoUrl(r.photo), ingredients, steps,
    allergens: listRecipeAllergens(ingredients as never), updatedAt: r.updatedAt,
  }
}

export type RecipeView = ReturnType<typeof recipeView>

/** The recipe as a draft (shared/types/recipe.ts), for scaling, costing and export. */
export function recipeDraft(view: RecipeView): RecipeDraft {
  return {
    title: view.title, summary: view.summary, servings: view.servings, yieldText: view.yieldText, tags: view.tags, notes: view.notes, times: view.times,
    ingredients: view.ingredients.map(({ id: _id, priceId, ...i }) => ({ ...i, priceId: priceId === null ? null : String(priceId) })) as RecipeDraft['ingredients'],
    steps: view.steps.map(({ id: _id, photo: _photo, ...s }) => s) as RecipeDraft['steps'],
  }
}

const withParts = { include: [{ model: RecipeIngredient, as: 'ingredients' }, { model: RecipeStep, as: 'steps' }] }

export async function loadRecipe(id: number): Promise<RecipeView | null> {
  await useDb()
  const r = (await Recipe.findByPk(id, withParts)) as Loaded | null
  return r ? recipeView(r) : null
}

/** The guard for /api/recipes/:id/…: the caller may do `action` in the recipe's studio. */
export async function requireRecipe(event: H3Event, action: StudioAction, param = 'id') {
  const studioOf = async (id: number) => (await Recipe.findByPk(id, { attributes: ['studioId'] }))?.studioId ?? null
  const { caller, id, studioId } = await requireStudioThing(event, action, studioOf, 'recipe', param)
  return { caller, recipeId: id, studioId }
}

/** Who is saving: the name stored beside the allergens they mark checked. */
export interface Checker { name: string }

/**
 * The allergen certainty to store: a row marked checked keeps its earlier stamp when its allergens have
 * not changed, and is stamped with the saver's name and now otherwise; any other state has no stamp.
 */
function certainty(ing: RecipeCreateBody['ingredients'][number], existing: RecipeIngredient | null, checker: Checker | null) {
  const state = allergenStateOf(ing as never)
  if (state !== 'checked') return { allergenState: state, allergensCheckedBy: null, allergensCheckedAt: null }
  const same = existing && existing.allergenState === 'checked' && JSON.stringify(existing.allergens) === JSON.stringify(ing.allergens)
  if (same) return { allergenState: state, allergensCheckedBy: existing.allergensCheckedBy ?? null, allergensCheckedAt: existing.allergensCheckedAt ?? null }
  if (!checker) throw new DomainError('invalid', `Allergens checked: only a signed-in person can mark the allergens of "${ing.item}" as checked.`, { field: 'ingredients.allergenState' })
  return { allergenState: state, allergensCheckedBy: checker.name, allergensCheckedAt: new Date() }
}

async function writeParts(recipeId: number, body: RecipeCreateBody, checker: Checker | null) {
  const keepIngredients = body.ingredients.map((i) => i.id).filter((x): x is number => !!x)
  await RecipeIngredient.destroy({ where: { recipeId, ...(keepIngredients.length ? { id: { [Op.notIn]: keepIngredients } } : {}) } })
  for (const [index, { id, ...ing }] of body.ingredients.entries()) {
    const existing = id ? await RecipeIngredient.findOne({ where: { id, recipeId } }) : null
    const values = { ...ing, ...certainty(ing, existing, checker), recipeId, position: index + 1, priceId: ing.priceId ?? null } as never
    if (existing) await existing.update(values)
    else await RecipeIngredient.create(values)
  }
  const keepSteps = body.steps.map((s) => s.id).filter((x): x is number => !!x)
  await RecipeStep.destroy({ where: { recipeId, ...(keepSteps.length ? { id: { [Op.notIn]: keepSteps } } : {}) } })
  for (const [index, { id, ...step }] of body.steps.entries()) {
    const values = { ...step, recipeId, position: index + 1 } as never
    const existing = id ? await RecipeStep.findOne({ where: { id, recipeId } }) : null
    if (existing) await existing.update(values)
    else await RecipeStep.create(values)
  }
}

function recipeFields(body: RecipeCreateBody) {
  const { title, summary, servings, yieldText, tags, notes, times } = body
  return { title, summary, servings, yieldText, tags, notes, times }
}

export async function createRecipe(studioId: number, body: RecipeCreateBody, checker: Checker | null = null): Promise<RecipeView> {
  const sequelize = await useDb()
  const id = await sequelize.transaction(async () => {
    const recipe = await Recipe.create({ studioId, ...recipeFields(body) })
    await writeParts(recipe.id, body, checker)
    return recipe.id
  })
  return (await loadRecipe(id))!
}

/**
 * Saves only when the recipe is still at the version the editor started from. Otherwise a 409
 * that carries the newer recipe, so the page can keep the editor's text and show what changed.
 */
export async function saveRecipe(recipeId: number, body: RecipeUpdateBody, checker: Checker | null = null): Promise<RecipeView> {
  const sequelize = await useDb()
  await sequelize.transaction(async () => {
    const [changed] = await Recipe.update(
      { ...recipeFields(body), version: body.version + 1 },
      { where: { id: recipeId, version: body.version } },
    )
    if (changed === 0) {
      const current = await loadRecipe(recipeId)
      throw new DomainError(
        'conflict',
        `Someone else saved this recipe while you were editing (now version ${current?.version}). Your changes are still in the editor: compare, then save again.`,
        { data: { current } },
      )
    }
    await writeParts(recipeId, body, checker)
  })
  return (await loadRecipe(recipeId))!
}

export async function deleteRecipe(recipeId: number) {
  await useDb()
  // Read the photo keys before the rows go; the files go only once the rows are gone.
  const photos = await recipePhotoKeys(recipeId)
  await Recipe.destroy({ where: { id: recipeId } })
  await deletePhotos(photos)
}

export async function studioSettings(studioId: number) {
  await useDb()
  const s = await Studio.findByPk(studioId)
  if (!s) throw new DomainError('not-found', 'There is no such studio.')
  // Plain values: Sequelize's CreationOptional brand must not reach the pages through the API types.
  return {
    id: s.id, name: s.name, locale: s.locale as string, currency: s.currency as string, timeZone: s.timeZone as string,
    budgetPerServingMinor: (s.budgetPerServingMinor ?? null) as number | null, cupUnit: s.cupUnit as string,
    unitSystem: s.unitSystem as string, kitchen: s.kitchen as KitchenProfile,
    fluidMeasure: studioFluidMeasure(s), fluidMeasureChosen: s.fluidMeasure === 'us' || s.fluidMeasure === 'imperial',
  }
}

/** Reads an import into a body ready to save, with what could not be understood. */
export async function readRecipeImport(studioId: number, text: string) {
  const settings = await studioSettings(studioId)
  const { imported, body, invalid } = await readImportOffLoop(text, { cups: settings.cupUnit === 'metric-cup' ? 'metric' : 'us', fluid: settings.fluidMeasure })
  if (invalid) {
    throw new DomainError('invalid', `The recipe was read, but one part cannot be saved as it is. ${invalid.message}`, { data: { field: invalid.field, draft: imported.recipe, problems: imported.problems } })
  }
  return { draft: imported.recipe, body: body!, problems: imported.problems, images: imported.images }
}
