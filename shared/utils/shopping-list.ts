// The shopping list of an episode: every ingredient of every recipe at the shoot's servings, merged
// by item, added up where the units allow, rounded up to what the shop sells, grouped by shop
// section, with the cost of the basket (whole packages) and of what the recipes use.
//
// Rules (pure; the route supplies the recipes and the studio's prices):
// - Items merge by name after lower case, accents, a trailing "(…)" and plurals are folded
//   ("Onions" and "onion" are one line; "chopped tomatoes" and "tomatoes" stay two).
// - Amounts add within a kind: mass to mass and volume to volume through units.ts (NIST exact
//   factors: 1 tbsp = 14.78676478125 mL, 1 kg = 1000 g); counted units only to the same unit. Mass
//   and volume add only through a density, the costing's own: the recipe's stated measure ("1 tsp
//   (2 g)"), else USDA SR Legacy (density.ts); the line names it. With none, the amounts stay apart
//   and the line says why.
// - A range counts at its upper end (as the costing does), so the shopper never buys short.
// - Packages: ⌈needed ÷ package size⌉ of the linked price, in the price's unit. The basket costs
//   whole packages; "used" is needed ÷ size × price, summed exactly and rounded once.
import type { StatedMeasure } from '../types/recipe'
import type { StudioPrice } from './cost'
import { convertIngredientAmount, densityItemKey, findDensity } from './density'
import { roundMinor } from './money'
import { formatQuantityText } from './quantity'
import { SHOP_SECTIONS, SHOP_SECTION_LABELS, shopSection, type ShopSection } from './shop-sections'
import { statedDensity } from './stated-density'
import { UnitConversionError, convertAmount, isUnitId, unitKind, unitLabel, unitSystem, type UnitId } from './units'

export interface ShoppingIngredient {
  key: string
  item: string
  min: number | null
  max: number | null
  unit: string | null
  optional: boolean
  toTaste: boolean
  priceId: string | number | null
  stated?: StatedMeasure | { min: number; max: number; unit: string } | null
}

export interface ShoppingRecipe {
  recipeId: number
  title: string
  /** Servings the recipe is written for. */
  servings: number
  ingredients: readonly ShoppingIngredient[]
}

export interface ShoppingAmount {
  min: number
  max: number
  unit: UnitId | null
  text: string
}

export interface ShoppingUse {
  recipeId: number
  recipeTitle: string
  /** "2 tbsp", "to taste", "" for no amount. */
  text: string
  optional: boolean
}

export interface ShoppingPackages {
  count: number
  size: number
  unit: UnitId | 'each'
  /** "2 × 400 g", "1 × pack of 3", "2 × 1 can". */
  text: string
}

export interface ShoppingLine {
  key: string
  item: string
  section: ShopSection
  /** One amount when everything added up; more when some could not be added (see notes). */
  amounts: ShoppingAmount[]
  /** The amounts as one text: "5 tbsp", "200 g + 1 cup", "" when to taste only. */
  text: string
  /** Every use is optional: the shopper may leave it out. */
  optional: boolean
  /** No use gives an amount: bought by the cook's judgement. */
  toTaste: boolean
  uses: ShoppingUse[]
  /** Why amounts were not added, where a density came from, a use to taste beside amounts. */
  notes: string[]
  price: { id: string; item: string; shop: string | null; packageSize: number; packageUnit: string; priceMinor: number } | null
  packages: ShoppingPackages | null
  /** Why no packages were counted (no price, another currency, a unit that does not convert). */
  packageNote: string | null
  /** Whole packages, in minor units. */
  basketMinor: number | null
  /** The share used, exact (unrounded) minor units. */
  usedExact: number | null
  usedMinor: number | null
  /** What is left of the packages, in the package's unit. */
  leftover: { amount: number; unit: UnitId | 'each'; text: string } | null
}

export interface ShoppingList {
  currency: string
  lines: ShoppingLine[]
  sections: { id: ShopSection; label: string; keys: string[] }[]
  totals: {
    basketMinor: number
    /** The basket without lines that are optional everywhere. */
    basketRequiredMinor: number
    usedMinor: number
    usedRequiredMinor: number
    /** Items with something left over: "olive oil: 426 mL". */
    leftovers: { key: string; item: string; text: string }[]
    /** Items not in the totals, with why. */
    notCosted: { key: string; item: string; reason: string }[]
  }
}

export interface ShoppingOptions {
  /** Servings on set; null: each recipe as written. */
  servings: number | null
  prices: readonly StudioPrice[]
  currency: string
}

/** One word's plural folded to its singular, by the common English endings. */
function singular(word: string): string {
  if (word.length <= 3 || /(ss|us|is|ous)$/.test(word)) return word
  if (word.endsWith('ies')) return `${word.slice(0, -3)}y`
  if (/(oes|ches|shes|xes|sses)$/.test(word)) return word.slice(0, -2)
  if (word.endsWith('s')) return word.slice(0, -1)
  return word
}

/** The name items merge by: folded case, accents, trailing "(…)" and plurals. "Onions" → "onion". */
export function itemKey(item: string): string {
  return densityItemKey(item).replace(/[^a-z0-9' -]/g, ' ').split(/\s+/).filter(Boolean).map(singular).join(' ')
}

/** A URL-safe key of the line (what the check-offs store): "chopped-tomato". */
export function lineKey(item: string): string {
  return itemKey(item).replace(/'/g, '').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'item'
}

/** Up to three significant figures, the way a list is read: 73.93 → 73.9, 1234.5 → 1230 (so 1.23 kg). */
const tidy = (v: number) => Number(v.toPrecision(3))

/** An amount as the list shows it; grams and millilitres from 1000 up as kilograms and litres. */
function amountText(min: number, max: number, unit: UnitId | null): ShoppingAmount {
  let [lo, hi, u] = [min, max, unit]
  if ((u === 'g' || u === 'ml') && hi >= 1000) [lo, hi, u] = [lo / 1000, hi / 1000, u === 'g' ? 'kg' : 'l']
  // metric amounts in decimals ("1.5 kg"), the others as a cook writes them ("1½ cups")
  const metric = u !== null && unitSystem(u) === 'metric'
  const text = metric ? `${tidy(lo) === tidy(hi) ? tidy(hi) : `${tidy(lo)}–${tidy(hi)}`} ${unitLabel(u!, tidy(hi))}` : formatQuantityText(tidy(lo), tidy(hi), u)
  return { min, max, unit, text }
}

type Part = { min: number; max: number; unit: UnitId | null }
type Use = { recipe: ShoppingRecipe; ing: ShoppingIngredient; factor: number }

/** The bucket an amount adds into: all masses, all volumes, or one counted unit (null: pieces). */
function bucketOf(unit: UnitId | null): string {
  if (!unit) return 'each'
  const kind = unitKind(unit)
  return kind === 'count' ? `count:${unit}` : kind
}

/** Parts of one bucket added: in their own unit when they share it, else in g or mL (NIST exact factors). */
function addParts(parts: Part[]): Part {
  const units = new Set(parts.map((p) => p.unit))
  if (units.size === 1) return { min: parts.reduce((s, p) => s + p.min, 0), max: parts.reduce((s, p) => s + p.max, 0), unit: parts[0]!.unit }
  const base: UnitId = unitKind(parts[0]!.unit!) === 'mass' ? 'g' : 'ml'
  const to = (v: number, u: UnitId | null) => convertAmount(v, u!, base)
  return { min: parts.reduce((s, p) => s + to(p.min, p.unit), 0), max: parts.reduce((s, p) => s + to(p.max, p.unit), 0), unit: base }
}

/** The density a line can take, the costing's order: a recipe's stated measure, else USDA SR Legacy. */
function lineDensity(uses: Use[], item: string): { gramsPerMl: number; source: string } | null {
  for (const u of uses) {
    const d = statedDensity(u.ing)
    if (d) {
      const found = findDensity(d.item, [d])!
      return { gramsPerMl: found.gramsPerMl, source: `${u.recipe.title}'s own measure: ${formatQuantityText(d.amount, d.amount, d.unit)} = ${tidy(d.grams)} g` }
    }
  }
  const usda = findDensity(item)
  return usda ? { gramsPerMl: usda.gramsPerMl, source: usda.description } : null
}

function packagesText(count: number, size: number, unit: UnitId | 'each'): string {
  if (unit === 'each') return size === 1 ? `${count} × 1` : `${count} × pack of ${tidy(size)}`
  return `${count} × ${amountText(size, size, unit).text}`
}

function leftoverText(amount: number, unit: UnitId | 'each'): string {
  if (unit === 'each') return String(tidy(amount))
  return amountText(amount, amount, unit).text
}

function buildLine(key: string, uses: Use[], o: ShoppingOptions, prices: Map<string, StudioPrice>): ShoppingLine {
  const item = uses[0]!.ing.item
  const notes: string[] = []
  const measured = uses.filter((u) => u.ing.max !== null || u.ing.min !== null)
  const buckets = new Map<string, Part[]>()
  for (const u of measured) {
    const lo = (u.ing.min ?? u.ing.max)! * u.factor
    const hi = (u.ing.max ?? u.ing.min)! * u.factor
    const unit = u.ing.unit && isUnitId(u.ing.unit) ? u.ing.unit : null
    const b = bucketOf(unit)
    buckets.set(b, [...(buckets.get(b) ?? []), { min: lo, max: hi, unit }])
  }
  let sums = new Map([...buckets].map(([b, parts]) => [b, addParts(parts)]))
  const mass = sums.get('mass')
  const volume = sums.get('volume')
  if (mass && volume) {
    const density = lineDensity(uses, item)
    const [m, v] = [amountText(mass.min, mass.max, mass.unit), amountText(volume.min, volume.max, volume.unit)]
    if (density) {
      const g = (x: number) => convertAmount(x, volume.unit!, 'g', { gramsPerMl: density.gramsPerMl })
      const inMass = { min: g(volume.min), max: g(volume.max), unit: 'g' as UnitId }
      notes.push(`${v.text} counted as ${amountText(inMass.min, inMass.max, 'g').text} (density: ${density.source})`)
      sums.delete('volume')
      sums.set('mass', addParts([mass, inMass]))
    } else {
      notes.push(`not added: ${m.text} and ${v.text} need a density; none is known for ${item}`)
    }
  }
  sums = new Map([...sums].sort(([a], [b]) => a.localeCompare(b)))
  const amounts = [...sums.values()].map((p) => amountText(p.min, p.max, p.unit))
  const counted = [...sums.keys()].filter((b) => b.startsWith('count:') || b === 'each')
  if (counted.length && sums.size > 1) {
    notes.push(`not added: ${amounts.map((a) => a.text).join(' and ')} are counted in different units (a counted piece has no weight or volume)`)
  }
  const toTasteUses = uses.filter((u) => u.ing.min === null && u.ing.max === null)
  if (measured.length && toTasteUses.length) notes.push(`also to taste in ${toTasteUses.map((u) => u.recipe.title).join(', ')}`)
  const useList: ShoppingUse[] = uses.map((u) => ({
    recipeId: u.recipe.recipeId,
    recipeTitle: u.recipe.title,
    text: u.ing.min === null && u.ing.max === null
      ? (u.ing.toTaste ? 'to taste' : '')
      : amountText((u.ing.min ?? u.ing.max)! * u.factor, (u.ing.max ?? u.ing.min)! * u.factor, u.ing.unit && isUnitId(u.ing.unit) ? u.ing.unit : null).text,
    optional: u.ing.optional,
  }))

  const line: ShoppingLine = {
    key, item, section: shopSection(itemKey(item), (measured[0]?.ing.unit ?? null) as UnitId | null),
    amounts, text: amounts.map((a) => a.text).join(' + '),
    optional: uses.every((u) => u.ing.optional), toTaste: measured.length === 0,
    uses: useList, notes, price: null, packages: null, packageNote: null, basketMinor: null, usedExact: null, usedMinor: null, leftover: null,
  }
  const priceId = uses.map((u) => u.ing.priceId).find((p) => p != null)
  const price = priceId != null ? prices.get(String(priceId)) : undefined
  if (!price) {
    line.packageNote = priceId != null ? 'its price is no longer in the price list' : 'no price is linked to it in the studio price list'
    return line
  }
  line.price = { id: String(price.id), item: price.item, shop: price.shop ?? null, packageSize: price.packageSize, packageUnit: price.packageUnit ?? 'each', priceMinor: price.priceMinor }
  if (line.section === 'other') line.section = shopSection(itemKey(price.item), price.packageUnit)
  if (!measured.length) {
    line.packageNote = 'to taste: buy what the cook asks for'
    return line
  }
  if (price.currency !== o.currency) {
    line.packageNote = `its price is in ${price.currency}, the studio costs in ${o.currency}`
    return line
  }
  const pUnit: UnitId | 'each' = !price.packageUnit || price.packageUnit === 'each' || price.packageUnit === 'piece' ? 'each' : price.packageUnit
  const densities = uses.map((u) => statedDensity(u.ing)).filter((d) => d !== null)
  let needed = 0
  try {
    for (const p of sums.values()) {
      const isEach = p.unit === null || p.unit === 'piece'
      if (pUnit === 'each' || isEach) {
        if (pUnit !== 'each' || !isEach) {
          const used = isEach ? 'counted by the piece' : `measured in ${unitLabel(p.unit!, 2)}`
          const sold = pUnit === 'each' ? 'by the piece' : `by the ${unitLabel(pUnit, 1)}`
          throw new UnitConversionError(`${item} is ${used} but sold ${sold}`, 'incompatible')
        }
        needed += p.max
      } else {
        needed += convertIngredientAmount(p.max, p.unit!, pUnit, item, densities)
      }
    }
  } catch (e) {
    if (!(e instanceof UnitConversionError)) throw e
    line.packageNote = `packages not counted: ${e.message}`
    return line
  }
  const count = Math.max(1, Math.ceil(needed / price.packageSize - 1e-9))
  line.packages = { count, size: price.packageSize, unit: pUnit, text: packagesText(count, price.packageSize, pUnit) }
  line.basketMinor = count * price.priceMinor
  line.usedExact = (needed / price.packageSize) * price.priceMinor
  line.usedMinor = roundMinor(line.usedExact)
  const left = count * price.packageSize - needed
  if (left > 1e-9 * price.packageSize) line.leftover = { amount: left, unit: pUnit, text: leftoverText(left, pUnit) }
  return line
}

/** The list for an episode's recipes (in run order) at `servings` (null: each as written). */
export function buildShoppingList(recipes: readonly ShoppingRecipe[], o: ShoppingOptions): ShoppingList {
  if (o.servings !== null && (!Number.isFinite(o.servings) || o.servings <= 0)) throw new RangeError(`The servings must be a number above zero, not ${o.servings}`)
  const prices = new Map(o.prices.map((p) => [String(p.id), p]))
  const byKey = new Map<string, Use[]>()
  for (const recipe of recipes) {
    const factor = o.servings === null ? 1 : o.servings / recipe.servings
    for (const ing of recipe.ingredients) {
      const key = lineKey(ing.item)
      byKey.set(key, [...(byKey.get(key) ?? []), { recipe, ing, factor }])
    }
  }
  const lines = [...byKey].map(([key, uses]) => buildLine(key, uses, o, prices))
  lines.sort((a, b) => SHOP_SECTIONS.indexOf(a.section) - SHOP_SECTIONS.indexOf(b.section) || a.item.localeCompare(b.item))
  const sections = SHOP_SECTIONS.map((id) => ({ id, label: SHOP_SECTION_LABELS[id], keys: lines.filter((l) => l.section === id).map((l) => l.key) }))
    .filter((s) => s.keys.length)
  const sum = (pick: (l: ShoppingLine) => number | null, required: boolean) =>
    lines.reduce((s, l) => s + (pick(l) !== null && (!required || !l.optional) ? pick(l)! : 0), 0)
  return {
    currency: o.currency,
    lines,
    sections,
    totals: {
      basketMinor: sum((l) => l.basketMinor, false),
      basketRequiredMinor: sum((l) => l.basketMinor, true),
      usedMinor: roundMinor(sum((l) => l.usedExact, false)),
      usedRequiredMinor: roundMinor(sum((l) => l.usedExact, true)),
      leftovers: lines.filter((l) => l.leftover).map((l) => ({ key: l.key, item: l.item, text: l.leftover!.text })),
      notCosted: lines.filter((l) => l.basketMinor === null).map((l) => ({ key: l.key, item: l.item, reason: l.packageNote ?? '' })),
    },
  }
}
