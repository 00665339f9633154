// Scaling to any number of servings and showing amounts the way cooks measure them.
//
// Rounding rules (common practice of US and metric kitchens; no standard covers them):
// US volume  under 1 tbsp: teaspoons to ⅛ ¼ ½ ¾; under ¼ cup: tablespoons plus teaspoons
//            ("1 tbsp + 1 tsp"; a range uses ½ tbsp); under 8 cups: cups to ⅛ ¼ ⅓ ½ ⅔ ¾;
//            above: quarts to ¼ (imperial pints to ¼ in a studio of imperial fluid measures).
//            So 3 tsp shows as 1 tbsp and 16 tbsp as 1 cup.
// US mass    under 4 oz: ounces to ¼; under 1 lb: whole ounces; above: "1 lb 2 oz" (a range: lb to ¼).
// Metric vol under 15 mL: spoons as above (spoons are used the world over); under 100 mL: 5 mL
//            steps; under 1 L: 10 mL steps (or 250 mL metric cups to ¼ ⅓ ½ ⅔ ¾ when the studio
//            chooses them); above: litres to 0.05.
// Metric mass under 1 g: 0.1 g steps; under 10 g: 0.5 g steps; under 1 kg: whole grams; above: kilograms to 0.05.
// Counted    (2 onions, 3 cloves): to ¼ under 10, whole numbers above.
// A non-zero amount is never shown as zero: below the smallest step it reads "less than ⅛ tsp".
// The exact value (unrounded, in the unit shown) is always returned beside the text.
// Where the recipe states the amount in the display's own system too ("½ cup (100 g)"), that
// stated measure is shown (scaled) instead of a conversion: it is the author's own density. Each
// amount says where it came from: as written, as stated beside the main unit, or converted.
import { formatAmountExact, vulgarFraction } from './amount-text'
import type { RecipeIngredientDraft } from '../types/recipe'
import { formatQuantityText } from './quantity'
import { convertAmount, unitKind, unitLabel, unitSystem, type UnitId } from './units'

export type DisplaySystem = 'metric' | 'us'

export interface KitchenDisplayOptions {
  system: DisplaySystem
  /** Show metric volumes from ¼ to 4 metric cups (250 mL) in cups rather than mL. */
  metricCups?: boolean
  /** The studio's fluid measures: large US-system volumes are shown in imperial pints when 'imperial'. */
  fluid?: 'us' | 'imperial'
}

export interface KitchenAmount {
  /** What the cook reads: "1½ cups", "1 tbsp + 1 tsp", "2–3", "less than ⅛ tsp", "to taste". */
  text: string
  /** The unit shown (for "1 lb 2 oz" the larger one); null for counted items and no amount. */
  unit: UnitId | null
  /** Exact values in `unit`, unrounded (null for no amount). */
  min: number | null
  max: number | null
  /** For the hover: "exactly 1.333 tbsp". Empty for no amount. */
  exactText: string
}

/**
 * How a studio shows amounts (its settings as the studio API gives them), in `units` when given:
 * the one reading of them, for the shoot screens, the recipe page and the editor's preview alike.
 */
export function studioKitchenDisplay(
  settings: { unitSystem: string; cupUnit: string; fluidMeasure: 'us' | 'imperial' }, units?: DisplaySystem,
): KitchenDisplayOptions {
  return { system: units ?? (settings.unitSystem === 'us' ? 'us' : 'metric'), metricCups: settings.cupUnit === 'metric-cup', fluid: settings.fluidMeasure }
}

/** value × to ÷ from servings. */
export function scaleAmount(value: number, fromServings: number, toServings: number): number {
  for (const [name, n] of [['recipe servings', fromServings], ['servings', toServings]] as const) {
    if (!Number.isFinite(n) || n <= 0) throw new RangeError(`The ${name} must be a number above zero, not ${n}`)
  }
  return (value * toServings) / fromServings
}

const EIGHTHS = [0, 1 / 8, 1 / 4, 1 / 2, 3 / 4]
const CUPS = [0, 1 / 8, 1 / 4, 1 / 3, 1 / 2, 2 / 3, 3 / 4]
const QUARTERS = [0, 1 / 4, 1 / 2, 3 / 4]
const HALVES = [0, 1 / 2]

/** Nearest whole-plus-fraction from a set; `lessThan` when a positive value would round to zero. */
function toFraction(v: number, fractions: number[]): { value: number; lessThan?: number } {
  const whole = Math.floor(v)
  let best = whole
  for (const f of [...fractions, 1]) if (Math.abs(whole + f - v) < Math.abs(best - v) - 1e-12) best = whole + f
  if (best === 0 && v > 0) return { value: 0, lessThan: fractions.find((f) => f > 0)! }
  return { value: best }
}

function toStep(v: number, step: number): { value: number; lessThan?: number } {
  const r = Math.round(v / step) * step
  const value = Number(r.toPrecision(12))
  if (value === 0 && v > 0) return { value: 0, lessThan: step }
  return { value }
}

function fractionText(v: number): string {
  const whole = Math.floor(v + 1e-9)
  const frac = v - whole
  if (frac < 1e-9) return String(whole)
  for (const d of [2, 3, 4, 8]) {
    const n = Math.round(frac * d)
    if (Math.abs(frac - n / d) < 1e-9) return `${whole || ''}${vulgarFraction(n, d)}`
  }
  return formatAmountExact(v)
}

const decimalText = (v: number) => String(Number(v.toPrecision(12)))

interface Rounded {
  text: string
  unit: UnitId | null
}

/** One end of an amount, in the unit already chosen. */
function roundOne(v: number, unit: UnitId | null, style: 'eighths' | 'cups' | 'halves' | 'quarters' | 'step', step = 1): string {
  const r = style === 'step' ? toStep(v, step)
    : toFraction(v, style === 'eighths' ? EIGHTHS : style === 'cups' ? CUPS : style === 'halves' ? HALVES : QUARTERS)
  const show = style === 'step' ? decimalText : fractionText
  const amount = r.lessThan !== undefined ? `less than ${show(r.lessThan)}` : show(r.value)
  // the plural follows the number shown: "1 cup" for 1.02 cups, "less than ⅛ tsp"
  return unit ? `${amount} ${unitLabel(unit, r.lessThan ?? r.value)}` : amount
}

/**
 * Choose the unit and rounding for a measured or counted amount. A range is shown in the unit
 * its smaller end needs, so both ends stay measurable ("3–4½ tbsp", not "⅛–¼ cup").
 */
function chooseDisplay(
  min: number, max: number, unit: UnitId | null, options: KitchenDisplayOptions,
): { unit: UnitId | null; min: number; max: number; render: (v: number, isRange: boolean) => Rounded } {
  const single = (u: UnitId | null, style: Parameters<typeof roundOne>[2], step?: number) => (v: number) => ({ text: roundOne(v, u, style, step), unit: u })
  const kind = unit ? unitKind(unit) : 'count'
  const conv = (to: UnitId) => ({ min: convertAmount(min, unit!, to), max: convertAmount(max, unit!, to) })

  if (kind === 'count') {
    const r = min < 10 ? single(unit, 'quarters') : single(unit, 'step', 1)
    return { unit, min, max, render: (v) => r(v) }
  }
  if (kind === 'volume') {
    const ml = convertAmount(min, unit!, 'ml')
    const tsp = convertAmount(min, unit!, 'tsp')
    const spoons = tsp < 2.9375 ? 'tsp' : tsp < 11.5 ? 'tbsp' : null // ⅞ of the next size rounds up to it
    if (spoons === 'tsp' && (options.system === 'us' || ml < 15)) return { unit: 'tsp', ...conv('tsp'), render: (v) => single('tsp', 'eighths')(v) }
    if (options.system === 'us' || ml < 15) {
      if (spoons === 'tbsp') return { unit: 'tbsp', ...conv('tbsp'), render: (v, isRange) => (isRange ? single('tbsp', 'halves')(v) : tbspAndTsp(v)) }
      if (convertAmount(min, unit!, 'cup') < 8) return { unit: 'cup', ...conv('cup'), render: single('cup', 'cups') }
      if (options.fluid === 'imperial') return { unit: 'imp-pint', ...conv('imp-pint'), render: single('imp-pint', 'quarters') }
      return { unit: 'quart', ...conv('quart'), render: single('quart', 'quarters') }
    }
    if (options.metricCups && ml >= 62.5 && ml < 1000) return { unit: 'metric-cup', ...conv('metric-cup'), render: single('metric-cup', 'cups') }
    if (ml < 995) return { unit: 'ml', ...conv('ml'), render: (v) => single('ml', 'step', v < 97.5 ? 5 : 10)(v) }
    return { unit: 'l', ...conv('l'), render: single('l', 'step', 0.05) }
  }
  // mass
  if (options.system === 'us') {
    const oz = convertAmount(min, unit!, 'oz')
    if (oz < 15.5) return { unit: 'oz', ...conv('oz'), render: (v) => single('oz', v < 3.875 ? 'eighths' : 'step', 1)(v) }
    return { unit: 'lb', ...conv('lb'), render: (v, isRange) => (isRange ? single('lb', 'quarters')(v) : poundsAndOunces(v)) }
  }
  const g = convertAmount(min, unit!, 'g')
  if (g < 999.5) return { unit: 'g', ...conv('g'), render: (v) => single('g', 'step', v < 0.95 ? 0.1 : v < 9.75 ? 0.5 : 1)(v) }
  return { unit: 'kg', ...conv('kg'), render: single('kg', 'step', 0.05) }
}

function tbspAndTsp(tbsp: number): Rounded {
  let whole = Math.floor(tbsp)
  let rest = toFraction((tbsp - whole) * 3, EIGHTHS).value
  if (rest >= 3) {
    whole += 1
    rest = 0
  }
  const text = rest ? `${whole} tbsp + ${fractionText(rest)} tsp` : `${whole} tbsp`
  return { text, unit: 'tbsp' }
}

function poundsAndOunces(lb: number): Rounded {
  let whole = Math.floor(lb)
  let oz = Math.round((lb - whole) * 16)
  if (oz === 16) {
    whole += 1
    oz = 0
  }
  return { text: oz ? `${whole} lb ${oz} oz` : `${whole} lb`, unit: 'lb' }
}

function exactNumber(v: number): string {
  return String(Number(v.toPrecision(4)))
}

/** An amount (as stored, in its own unit) shown the way cooks measure, with the exact value. */
export function formatKitchenAmount(
  min: number | null, max: number | null, unit: UnitId | null, options: KitchenDisplayOptions, toTaste = false,
): KitchenAmount {
  if (min === null && max === null) return { text: toTaste ? 'to taste' : '', unit: null, min: null, max: null, exactText: '' }
  const lo = Math.min(min ?? max!, max ?? min!)
  const hi = Math.max(min ?? max!, max ?? min!)
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo < 0) throw new RangeError(`An amount must be zero or more, not ${min}–${max}`)
  const d = chooseDisplay(lo, hi, unit, options)
  const a = d.render(d.min, d.min !== d.max)
  const b = d.render(d.max, d.min !== d.max)
  let text = a.text
  if (a.text !== b.text) {
    const sameUnitTail = d.unit ? ` ${unitLabel(d.unit, 2)}` : ''
    const bare = (t: string) => (sameUnitTail && t.endsWith(sameUnitTail) ? t.slice(0, -sameUnitTail.length) : d.unit && t.endsWith(` ${unitLabel(d.unit, 1)}`) ? t.slice(0, -unitLabel(d.unit, 1).length - 1) : t)
    text = `${bare(a.text)}–${b.text}`
  }
  const label = d.unit ? ` ${unitLabel(d.unit, Number(exactNumber(d.max)))}` : ''
  const exactText = d.min === d.max ? `exactly ${exactNumber(d.min)}${label}` : `exactly ${exactNumber(d.min)}–${exactNumber(d.max)}${label}`
  return { text, unit: d.unit, min: d.min, max: d.max, exactText }
}

export interface ScaledIngredient extends KitchenAmount {
  /** Where the amount shown came from: the main amount as written, the equivalent stated beside it, or a conversion. */
  source: 'written' | 'stated' | 'converted'
  /** For the hover: "stated in the recipe beside ½ cup", "converted from 1 cup" (the amount as written, scaled); empty when as written. */
  sourceText: string
  key: string
  item: string
  prep: string | null
  optional: boolean
  toTaste: boolean
  group: string | null
}

/** A recipe's ingredients scaled from its servings to `servings` and shown in one system. */
export function scaleRecipeIngredients(
  ingredients: readonly RecipeIngredientDraft[], fromServings: number, servings: number, options: KitchenDisplayOptions,
): { servings: number; ingredients: ScaledIngredient[] } {
  scaleAmount(1, fromServings, servings) // refuses servings that are not above zero, even with no amounts
  const scale = (v: number) => scaleAmount(v, fromServings, servings)
  return {
    servings,
    ingredients: [...ingredients].sort((a, b) => a.position - b.position).map((ing) => ({
      key: ing.key, item: ing.item, prep: ing.prep, optional: ing.optional, toTaste: ing.toTaste, group: ing.group,
      ...formatIngredientAmount(ing, scale, options),
    })),
  }
}

/** Show the stated measure when it is in the display's system and the main one is not. */
function useStated(main: UnitId, stated: UnitId, system: DisplaySystem): boolean {
  return unitSystem(stated) === system && unitSystem(main) !== system
}

type AmountFields = Pick<RecipeIngredientDraft, 'min' | 'max' | 'unit' | 'toTaste' | 'stated'>

/**
 * An ingredient's amount, scaled by `scale`, shown in the display's system: the stated equivalent
 * when it is in that system and the main unit is not, else the main amount (converted when the
 * display needs it), saying which.
 */
export function formatIngredientAmount(
  ing: AmountFields, scale: (v: number) => number, options: KitchenDisplayOptions,
): KitchenAmount & Pick<ScaledIngredient, 'source' | 'sourceText'> {
  const s = (v: number | null) => (v === null ? null : scale(v))
  // the amount as written, scaled (to 4 significant digits): what the shown amount stands beside or was converted from
  const near = (v: number | null) => (v === null ? null : Number(scale(v).toPrecision(4)))
  const written = formatQuantityText(near(ing.min), near(ing.max), ing.unit)
  if (ing.min !== null && ing.unit && ing.stated && useStated(ing.unit, ing.stated.unit, options.system)) {
    const shown = formatKitchenAmount(scale(ing.stated.min), scale(ing.stated.max), ing.stated.unit, options)
    return { ...shown, source: 'stated', sourceText: `stated in the recipe beside ${written}` }
  }
  const shown = formatKitchenAmount(s(ing.min), s(ing.max), ing.unit, options, ing.toTaste)
  const converted = ing.unit !== null && shown.unit !== null && unitSystem(shown.unit) !== unitSystem(ing.unit)
  return { ...shown, source: converted ? 'converted' : 'written', sourceText: converted ? `converted from ${written}` : '' }
}
