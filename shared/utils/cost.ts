// Cost per serving: Σ (amount used ÷ package size × package price) ÷ servings, in two figures,
// with and without optional ingredients. Money stays in exact minor units until the end, where
// each figure is rounded once. Amounts are converted to the package's unit (through the item's
// density between mass and volume); a line that cannot be costed is listed with the reason.
// A range ("2–3 onions") is costed at its upper end by default, so a quoted figure is never low.
// A "to taste" line with no amount cannot be costed, so it leaves the cost incomplete (listed in
// `unmeasured`): the figure is a lower bound until someone writes how much goes in.
import type { UnitId } from './units'
import { UnitConversionError, unitKind, unitLabel } from './units'
import { convertIngredientAmount, type UserDensity } from './density'
import { currencyMinorDigits, roundMinor } from './money'

/** A price's id as the studio stores it. */
export type PriceId = string | number

export interface StudioPrice {
  id: PriceId
  item: string
  /** Package size in `packageUnit`; for things priced each, the number in the pack. */
  packageSize: number
  /** null or "each": priced by the piece. */
  packageUnit: UnitId | 'each' | null
  /** Package price in integer minor units of `currency`. */
  priceMinor: number
  currency: string
  shop?: string | null
  /** ISO date (YYYY-MM-DD) the price was seen. */
  date?: string | null
}

export interface CostedIngredient {
  key: string
  item: string
  min: number | null
  max: number | null
  unit: UnitId | null
  optional: boolean
  /** "Salt, to taste": the amount is the cook's. */
  toTaste?: boolean
  priceId?: PriceId | null
}

export type CostLineStatus = 'priced' | 'no-price' | 'no-amount' | 'to-taste' | 'cannot-convert' | 'other-currency'

export interface CostLine {
  key: string
  item: string
  optional: boolean
  status: CostLineStatus
  priceId: PriceId | null
  /** Amount used for the recipe as written, in the package's unit. */
  amountUsed: number | null
  /** Cost for the recipe as written, in exact (unrounded) minor units. */
  costExact: number | null
  /** The same cost for `forServings`, rounded (for the breakdown only; totals use the exact sum). */
  costMinor: number | null
  /** Why it is not costed, in words that say what to fix. */
  message: string | null
}

export interface CostOptions {
  currency: string
  /** The recipe's yield in servings. */
  servings: number
  /** Servings to cost for (the totals); defaults to the recipe's. */
  forServings?: number
  densities?: readonly UserDensity[]
  /** Budget target per serving in minor units; sets the over-budget flags. */
  budgetPerServingMinor?: number | null
  rangeAt?: 'min' | 'max' | 'mid'
}

export interface RecipeCost {
  currency: string
  minorDigits: number
  servings: number
  totalMinor: number
  totalWithOptionalMinor: number
  perServingMinor: number
  perServingWithOptionalMinor: number
  lines: CostLine[]
  /** Lines with an amount but no price. */
  missing: CostLine[]
  /** Lines with a price that could not be used (unit or currency). */
  problems: CostLine[]
  /** Required "to taste" lines with no amount: their cost is not in the figures. */
  unmeasured: CostLine[]
  /** True when every line with an amount is priced and no required line is "to taste" without an amount. */
  complete: boolean
  budget: { perServingMinor: number; over: boolean; overWithOptional: boolean } | null
}

const isEach = (u: UnitId | 'each' | null): u is 'each' | 'piece' | null => u === null || u === 'each' || u === 'piece'

function amountFor(ing: CostedIngredient, rangeAt: CostOptions['rangeAt']): number | null {
  const lo = ing.min ?? ing.max
  const hi = ing.max ?? ing.min
  if (lo === null || hi === null) return null
  return rangeAt === 'min' ? lo : rangeAt === 'mid' ? (lo + hi) / 2 : hi
}

function costLine(ing: CostedIngredient, prices: ReadonlyMap<PriceId, StudioPrice>, o: CostOptions, scale: number): CostLine {
  const base = { key: ing.key, item: ing.item, optional: ing.optional, priceId: ing.priceId ?? null, amountUsed: null, costExact: null, costMinor: null }
  const amount = amountFor(ing, o.rangeAt)
  if (amount === null && ing.toTaste) {
    return { ...base, status: 'to-taste', message: `"${ing.item}" is to taste, so its cost is not counted; write how much a cook uses to cost it` }
  }
  if (amount === null) return { ...base, status: 'no-amount', message: `"${ing.item}" has no amount, so it is not costed` }
  const price = ing.priceId != null ? prices.get(ing.priceId) : undefined
  if (!price) return { ...base, status: 'no-price', message: `"${ing.item}" has no price; link it to one in the studio price list` }
  if (price.currency !== o.currency) {
    return { ...base, status: 'other-currency', message: `The price for "${ing.item}" is in ${price.currency}, the studio costs in ${o.currency}; enter a ${o.currency} price` }
  }
  if (!(price.packageSize > 0) || !Number.isFinite(price.packageSize)) {
    return { ...base, status: 'cannot-convert', message: `The price for "${ing.item}" has no package size above zero` }
  }
  let used: number
  if (isEach(ing.unit) && isEach(price.packageUnit)) used = amount
  else if (isEach(ing.unit) || isEach(price.packageUnit)) {
    const byPiece = isEach(ing.unit) ? 'counted by the piece' : `measured in ${unitLabel(ing.unit!, 2)}`
    const priced = isEach(price.packageUnit) ? 'priced by the piece' : `priced per ${unitLabel(price.packageUnit as UnitId, 1)}`
    return { ...base, status: 'cannot-convert', message: `"${ing.item}" is ${byPiece} but ${priced}; use the same kind of unit in the recipe and the price` }
  } else {
    try {
      used = convertIngredientAmount(amount, ing.unit!, price.packageUnit as UnitId, ing.item, o.densities)
    } catch (e) {
      if (!(e instanceof UnitConversionError)) throw e
      const pu = price.packageUnit as UnitId
      const hint = unitKind(ing.unit!) === 'count' || unitKind(pu) === 'count'
        ? `"${ing.item}" is used in ${unitLabel(ing.unit!, 2)} but priced per ${unitLabel(pu, 1)}; use the same unit in both`
        : e.message
      return { ...base, status: 'cannot-convert', message: hint }
    }
  }
  const costExact = (used / price.packageSize) * price.priceMinor
  return { ...base, status: 'priced', amountUsed: used, costExact, costMinor: roundMinor(costExact * scale), message: null }
}

/** The cost of a recipe, per serving with and without optional ingredients, and line by line. */
export function costRecipe(ingredients: readonly CostedIngredient[], prices: readonly StudioPrice[], options: CostOptions): RecipeCost {
  const minorDigits = currencyMinorDigits(options.currency)
  const forServings = options.forServings ?? options.servings
  for (const [name, n] of [['recipe servings', options.servings], ['servings', forServings]] as const) {
    if (!Number.isFinite(n) || n <= 0) throw new RangeError(`The ${name} must be a number above zero, not ${n}`)
  }
  for (const p of prices) {
    if (!Number.isInteger(p.priceMinor) || p.priceMinor < 0) throw new RangeError(`The price for "${p.item}" must be a whole number of minor units, zero or more, not ${p.priceMinor}`)
  }
  const byId = new Map(prices.map((p) => [p.id, p]))
  const scale = forServings / options.servings
  const lines = ingredients.map((ing) => costLine(ing, byId, options, scale))
  const sum = (withOptional: boolean) => lines.reduce((s, l) => s + (l.costExact !== null && (withOptional || !l.optional) ? l.costExact : 0), 0)
  const exact = sum(false)
  const exactAll = sum(true)
  const perServingMinor = roundMinor(exact / options.servings)
  const perServingWithOptionalMinor = roundMinor(exactAll / options.servings)
  const target = options.budgetPerServingMinor
  const missing = lines.filter((l) => l.status === 'no-price')
  const problems = lines.filter((l) => l.status === 'cannot-convert' || l.status === 'other-currency')
  const unmeasured = lines.filter((l) => l.status === 'to-taste' && !l.optional)
  return {
    currency: options.currency,
    minorDigits,
    servings: forServings,
    totalMinor: roundMinor(exact * scale),
    totalWithOptionalMinor: roundMinor(exactAll * scale),
    perServingMinor,
    perServingWithOptionalMinor,
    lines,
    missing,
    problems,
    unmeasured,
    complete: missing.length === 0 && problems.length === 0 && unmeasured.length === 0,
    budget: target == null ? null : { perServingMinor: target, over: perServingMinor > target, overWithOptional: perServingWithOptionalMinor > target },
  }
}
