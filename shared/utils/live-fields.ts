// Live fields of a show's script, rendered from the data at shoot time. The server fills a plain
// `ShowData` (the episode's servings, units, money settings and, per recipe, what the fields read);
// this file only writes words. A field whose data is missing renders as a placeholder in plain
// words ("[cost unknown: Parsley has no price]"), flagged and listed, so the prompter never shows a
// raw field. Amounts use the kitchen writers of scale.ts; money formatMoney (money.ts); times
// durationText (duration.ts); oven temperatures ovenSpoken below.
import type { UnitId } from './units'
import type { StatedMeasure } from '../types/recipe'
import type { CostLineStatus, RecipeCost } from './cost'
import { convertTemperature } from './units'
import { durationText } from './duration'
import { formatMoney } from './money'
import { formatIngredientAmount, scaleAmount, type KitchenDisplayOptions } from './scale'
import type { LiveField, ScriptPiece } from './show-segments'

/** An ingredient a field can name: its amount already written, or as the recipe writes it (scaled here). */
export type ShowIngredient = { key: string; item: string } & (
  | { text: string }
  | { min: number | null; max: number | null; unit: UnitId | null; toTaste?: boolean; stated?: StatedMeasure | null }
)

/** Why a line is not in the cost: no price linked, a price in another unit or currency, or to taste with no amount. */
export interface CostGap {
  item: string
  optional: boolean
  status: Exclude<CostLineStatus, 'priced' | 'no-amount'>
}

export interface ShowRecipeCost {
  perServingMinor: number
  perServingWithOptionalMinor: number
  /** costRecipe's `complete`: every line with an amount is priced. */
  complete: boolean
  gaps: CostGap[]
}

export interface ShowRecipeData {
  id: number
  title: string
  /** Servings as the recipe is written; amounts given raw are scaled from this to the episode's. */
  servings: number
  ingredients: ShowIngredient[]
  cost: ShowRecipeCost | null
  totalSeconds: number | null
}

export interface ShowData {
  /** Servings for the shoot; the recipes scale to it. */
  servings: number
  display: KitchenDisplayOptions
  locale: string
  currency: string
  budgetPerServingMinor: number | null
  /** The episode's recipes in run order; a recipe deleted from the studio is simply absent. */
  recipes: ShowRecipeData[]
}

export interface RenderedPart {
  text: string
  field?: LiveField
  /** Why the field could not be written, in plain words; `text` is then the placeholder. */
  missing?: string
}

export interface RenderedScript {
  text: string
  parts: RenderedPart[]
  missing: string[]
}

/** The cost fragment of ShowRecipeData from costRecipe's answer. */
export function showRecipeCost(cost: RecipeCost): ShowRecipeCost {
  const gaps = [...cost.missing, ...cost.problems, ...cost.unmeasured]
    .map((l) => ({ item: l.item, optional: l.optional, status: l.status as CostGap['status'] }))
  return { perServingMinor: cost.perServingMinor, perServingWithOptionalMinor: cost.perServingWithOptionalMinor, complete: cost.complete, gaps }
}

const GAP_WORDS: Record<CostGap['status'], [string, string]> = {
  'no-price': ['has no price', 'have no price'],
  'cannot-convert': ['has a price in another kind of unit', 'have prices in another kind of unit'],
  'other-currency': ['has a price in another currency', 'have prices in another currency'],
  'to-taste': ['is to taste with no amount', 'are to taste with no amount'],
}

/** "Parsley has no price", "Parsley and lemon have no price; salt is to taste with no amount". */
export function gapWords(gaps: readonly CostGap[]): string {
  const byStatus = new Map<CostGap['status'], string[]>()
  for (const g of gaps) byStatus.set(g.status, [...(byStatus.get(g.status) ?? []), g.item])
  const clauses = [...byStatus].map(([status, items]) => {
    const names = items.length === 1 ? items[0]! : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`
    return `${names} ${GAP_WORDS[status][items.length === 1 ? 0 : 1]}`
  })
  const text = clauses.join('; ')
  return text.charAt(0).toUpperCase() + text.slice(1)
}

/** The gaps that leave a cost figure unknown: every gap with the optional ingredients, only required ones without. */
export function costGapsFor(cost: ShowRecipeCost, withOptional: boolean): CostGap[] {
  const gaps = cost.gaps.filter((g) => withOptional || !g.optional)
  if (gaps.length || !withOptional || cost.complete) return gaps
  return [{ item: 'an ingredient', optional: true, status: 'no-price' }]
}

/**
 * An oven temperature as cooks say it in both scales: the °C as set, the °F rounded to the nearest
 * 25 °F, the steps US oven dials are marked in and the steps of the °C/°F/gas-mark tables printed in
 * British cookbooks (common practice; the tables are cited from memory: 140 °C 275 °F, 150 °C 300 °F,
 * 160 °C 325 °F, 180 °C 350 °F, 190 °C 375 °F, 200 °C 400 °F, 220 °C 425 °F, 230 °C 450 °F, 240 °C
 * 475 °F). 220 °C → "220 °C, 425 °F" (exactly 428 °F by NIST SP 811).
 */
export function ovenSpoken(celsius: number): { text: string; fahrenheit: number; exactF: number } {
  const exactF = convertTemperature(celsius, 'C')
  const fahrenheit = Math.round(exactF / 25) * 25
  return { text: `${Math.round(celsius)} °C, ${fahrenheit} °F`, fahrenheit, exactF }
}

/** A recipe's total time as said on camera: whole minutes from a minute ("1 h 10 min"), seconds below it. */
export function totalTimeSpoken(seconds: number): string {
  return durationText(seconds >= 60 ? Math.round(seconds / 60) * 60 : seconds)
}

const GONE = 'the recipe is no longer in the studio'

function renderField(field: LiveField, data: ShowData): { text: string } | { missing: string; label: string } {
  const money = (minor: number) => formatMoney(minor, data.currency, data.locale)
  switch (field.kind) {
    case 'servings':
      return { text: String(data.servings) }
    case 'budget':
      return data.budgetPerServingMinor == null
        ? { label: 'budget unknown', missing: 'no budget per serving is set for the episode' }
        : { text: money(data.budgetPerServingMinor) }
    case 'oven':
      return { text: ovenSpoken(field.celsius).text }
  }
  const recipe = data.recipes.find((r) => r.id === field.recipeId)
  const label = field.kind === 'amount' ? 'amount unknown' : field.kind === 'cost' ? 'cost unknown' : 'total time unknown'
  if (!recipe) return { label, missing: GONE }
  if (field.kind === 'total-time') {
    return recipe.totalSeconds == null ? { label, missing: `${recipe.title} has no total time` } : { text: totalTimeSpoken(recipe.totalSeconds) }
  }
  if (field.kind === 'cost') {
    if (!recipe.cost) return { label, missing: `${recipe.title} has not been costed` }
    const gaps = costGapsFor(recipe.cost, field.withOptional)
    if (gaps.length) return { label, missing: gapWords(gaps) }
    return { text: money(field.withOptional ? recipe.cost.perServingWithOptionalMinor : recipe.cost.perServingMinor) }
  }
  const ing = recipe.ingredients.find((i) => i.key === field.ingredientKey)
  if (!ing) return { label, missing: `${recipe.title} no longer has that ingredient` }
  if ('text' in ing) return ing.text ? { text: ing.text } : { label, missing: `${ing.item} has no amount` }
  const shown = formatIngredientAmount(
    { min: ing.min, max: ing.max, unit: ing.unit, toTaste: ing.toTaste ?? false, stated: ing.stated ?? null },
    (v) => scaleAmount(v, recipe.servings, data.servings), data.display,
  )
  return shown.text ? { text: shown.text } : { label, missing: `${ing.item} has no amount` }
}

/** A script with its live fields written from the data; missing data becomes a flagged placeholder in plain words. */
export function renderScript(pieces: readonly ScriptPiece[], data: ShowData): RenderedScript {
  const parts: RenderedPart[] = []
  const missing: string[] = []
  for (const piece of pieces) {
    if ('text' in piece) {
      if (piece.text) parts.push({ text: piece.text })
      continue
    }
    const r = renderField(piece.field, data)
    if ('text' in r) parts.push({ text: r.text, field: piece.field })
    else {
      parts.push({ text: `[${r.label}: ${r.missing}]`, field: piece.field, missing: r.missing })
      missing.push(r.missing)
    }
  }
  return { text: parts.map((p) => p.text).join(''), parts, missing }
}
