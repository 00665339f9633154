// Scaling, costing and the recipe list: the shared domain core applied to stored recipes.
import { Op } from 'sequelize'
import { Recipe, RecipeIngredient, Studio } from '../db/models'
import type { z } from 'zod'
import type { studioSettingsSchema } from '../../shared/utils/recipe-schemas'
import type { UnitId } from '../../shared/utils/units'
import type { RecipeView } from './recipes'

export async function scaledRecipe(recipeId: number, studioId: number, servings?: number, units?: 'metric' | 'us') {
  return scaleLoadedRecipe((await loadRecipe(recipeId))!, await studioSettings(studioId), servings, units)
}

type StudioSettings = Awaited<ReturnType<typeof studioSettings>>

/** A recipe already loaded, scaled for a studio whose settings are already read. */
export function scaleLoadedRecipe(recipe: RecipeView, settings: StudioSettings, servings?: number, units?: 'metric' | 'us') {
  const display = studioKitchenDisplay(settings, units)
  const system = display.system
  const target = servings ?? recipe.servings
  const draft = recipeDraft(recipe)
  const scaled = scaleRecipeIngredients(draft.ingredients, recipe.servings, target, display)
  const byKey = new Map(recipe.ingredients.map((i) => [i.key, i]))
  const factor = target / recipe.servings
  return {
    servings: target,
    units: system,
    fluidMeasure: settings.fluidMeasure,
    ingredients: scaled.ingredients.map((s) => {
      const ing = byKey.get(s.key)!
      return {
        id: ing.id, key: s.key, item: s.item, prep: s.prep, min: s.min, max: s.max, unit: s.unit,
        text: s.text, exactText: s.exactText, source: s.source, sourceText: s.sourceText, optional: s.optional, toTaste: s.toTaste, group: s.group,
      }
    }),
    steps: recipe.steps.map((step) => {
      const options = { ...display, ingredients: draft.ingredients, fromServings: recipe.servings, toServings: target }
      const rendered = renderStepText(step.text, options)
      // The lines to say on camera may name amounts too ("that's {{flour}} of flour"): written the same way.
      const script = step.script.map((line) => renderStepText(line, options).segments)
      return { id: step.id, position: step.position, text: rendered.text, segments: rendered.segments, problems: rendered.problems, script }
    }),
    factor,
  }
}

/** The studio's prices as the costing reads them. */
export async function pricesFor(studioId: number) {
  return (await listPrices(studioId)).map(studioPrice)
}
type StudioPrices = Awaited<ReturnType<typeof pricesFor>>

type CostLine = {
  key: string; item: string; min: number | null; max: number | null; unit: string | null; optional: boolean; toTaste?: boolean; priceId: number | null
}

function costInput(ingredients: CostLine[]) {
  return ingredients.map((i) => ({
    key: i.key, item: i.item, min: i.min, max: i.max, unit: i.unit as UnitId | null, optional: i.optional, toTaste: i.toTaste === true,
    priceId: i.priceId ? String(i.priceId) : null,
  }))
}

/** A loaded recipe costed against the studio's prices (already read), for `servings` (the recipe's own by default). */
export function costLoadedRecipe(recipe: RecipeView, settings: Pick<StudioSettings, 'currency' | 'budgetPerServingMinor'>, prices: StudioPrices, servings?: number) {
  return costRecipe(costInput(recipe.ingredients), prices, {
    currency: settings.currency, servings: recipe.servings, forServings: servings ?? recipe.servings, budgetPerServingMinor: settings.budgetPerServingMinor,
    densities: statedDensities(recipe.ingredients),
  })
}

export async function recipeCostView(recipeId: number, studioId: number, servings?: number) {
  const recipe = (await loadRecipe(recipeId))!
  const settings = await studioSettings(studioId)
  const prices = await pricesFor(studioId)
  const cost = costLoadedRecipe(recipe, settings, prices, servings)
  const dec = (minor: number) => minorToDecimal(minor, cost.currency)
  const fmt = (minor: number) => formatMoney(minor, cost.currency, settings.locale)
  return {
    currency: cost.currency,
    locale: settings.locale,
    servings: cost.servings,
    total: dec(cost.totalMinor),
    totalWithOptional: dec(cost.totalWithOptionalMinor),
    perServing: dec(cost.perServingMinor),
    perServingWithOptional: dec(cost.perServingWithOptionalMinor),
    formatted: { total: fmt(cost.totalMinor), perServing: fmt(cost.perServingMinor), perServingWithOptional: fmt(cost.perServingWithOptionalMinor) },
    minor: {
      total: cost.totalMinor, totalWithOptional: cost.totalWithOptionalMinor,
      perServing: cost.perServingMinor, perServingWithOptional: cost.perServingWithOptionalMinor,
    },
    complete: cost.complete,
    budget: cost.budget && { ...cost.budget, perServing: dec(cost.budget.perServingMinor), formatted: fmt(cost.budget.perServingMinor) },
    lines: cost.lines.map((l) => ({
      ...l, cost: l.costMinor === null ? null : dec(l.costMinor), formatted: l.costMinor === null ? null : fmt(l.costMinor),
      // where a volume ↔ mass conversion took its density from: the recipe's own measure, else USDA SR Legacy
      conversion: l.status === 'priced' ? conversionSource(recipe.ingredients.find((i) => i.key === l.key)!, prices.find((p) => p.id === l.priceId)?.packageUnit) : null,
    })),
    missing: cost.missing.map((l) => ({ key: l.key, item: l.item, message: l.message })),
    problems: cost.problems.map((l) => ({ key: l.key, item: l.item, message: l.message })),
    unmeasured: cost.unmeasured.map((l) => ({ key: l.key, item: l.item, message: l.message })),
  }
}

export async function listRecipes(studioId: number, filters: { q?: string; tag?: string; allergen?: string; without?: string }) {
  await useDb()
  const settings = await studioSettings(studioId)
  const where: Record<string | symbol, unknown> = { studioId }
  if (filters.q) where[Op.or] = [{ title: { [Op.like]: `%${filters.q}%` } }, { summary: { [Op.like]: `%${filters.q}%` } }]
  const rows = await Recipe.findAll({ where, include: [{ model: RecipeIngredient, as: 'ingredients' }], order: [['title', 'ASC']] })
  const prices = await pricesFor(studioId)
  const recipes = rows.map((r) => {
    const ings = (r as Recipe & { ingredients: RecipeIngredient[] }).ingredients
    const allergens = listRecipeAllergens(ings as never)
    const cost = costRecipe(costInput(ings), prices, {
      currency: settings.currency, servings: r.servings, budgetPerServingMinor: settings.budgetPerServingMinor,
      densities: statedDensities(ings),
    })
    return {
      id: r.id, title: r.title, summary: r.summary, servings: r.servings, tags: r.tags, photo: photoUrl(r.photo), updatedAt: r.updatedAt,
      allergens: { eu: allergens.eu.map((a: { id: string }) => a.id), us: allergens.us.map((a: { id: string }) => a.id) },
      /** Ingredients whose allergens nobody has checked. */
      allergensUnchecked: allergens.unchecked.length,
      freeOf: filters.without ? recipeFreeOf(ings as never, filters.without) : null,
      cost: {
        perServing: minorToDecimal(cost.perServingMinor, cost.currency),
        perServingWithOptional: minorToDecimal(cost.perServingWithOptionalMinor, cost.currency),
        formatted: formatMoney(cost.perServingMinor, cost.currency, settings.locale),
        complete: cost.complete,
        overBudget: cost.budget?.over ?? false,
      },
    }
  })
  const others = recipes.filter((r) =>
    (!filters.tag || r.tags.includes(filters.tag))
    && (!filters.allergen || r.allergens.eu.includes(filters.allergen) || r.allergens.us.includes(filters.allergen)))
  // "Free of" counts only checked ingredients: a recipe is listed when none contains the group and all are
  // checked; one that lists no such group but has unchecked ingredients is named apart, with how many.
  const filtered = others.filter((r) => !r.freeOf || r.freeOf.free)
  const notChecked = others.filter((r) => r.freeOf && !r.freeOf.contains && !r.freeOf.free)
    .map((r) => ({ id: r.id, title: r.title, unchecked: r.freeOf!.unchecked }))
  return { recipes: filtered, notChecked, currency: settings.currency, budgetPerServingMinor: settings.budgetPerServingMinor }
}

export async function updateStudioSettings(studioId: number, body: z.output<typeof studioSettingsSchema>) {
  await useDb()
  if (body.currency) currencyMinorDigits(body.currency) // refuses a code Intl does not know
  await Studio.update(body, { where: { id: studioId } })
  return studioSettings(studioId)
}

