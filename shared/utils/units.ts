// Kitchen units and exact conversions between them.
//
// US customary (NIST Handbook 44, Appendix C; NIST SP 811): the gallon is 231 in³ = 3.785411784 L
// exactly; fl oz = gal/128, cup = 8 fl oz, tbsp = ½ fl oz, tsp = 1/6 fl oz, pint = 16 fl oz,
// quart = 32 fl oz. Avoirdupois pound = 0.45359237 kg exactly; ounce = lb/16.
// UK imperial (Weights and Measures Act 1985, Schedule 1): gallon = 4.54609 L; pint = gal/8;
// fl oz = pint/20; quart = 2 pints.
// Metric cup = 250 mL (a convention in Australia, New Zealand and Canada; no statute).
//
// Each unit is an exact ratio of integers to its base (mL or g). A conversion reduces the ratio
// of two ratios with BigInt before dividing, so 3 tsp → 1 tbsp is exactly 1 and cup → mL is the
// correctly rounded double of 236.5882365. Mass ↔ volume needs a density (grams per mL) that the
// caller supplies (see density.ts); it is never guessed.

export type VolumeUnitId =
  | 'tsp' | 'tbsp' | 'floz' | 'cup' | 'pint' | 'quart' | 'gallon'
  | 'ml' | 'cl' | 'dl' | 'l' | 'metric-cup'
  | 'imp-floz' | 'imp-pint' | 'imp-quart' | 'imp-gallon'
export type MassUnitId = 'mg' | 'g' | 'kg' | 'oz' | 'lb'
/** Counted units: they scale, but convert only to themselves. */
export type CountUnitId =
  | 'pinch' | 'dash' | 'drop' | 'clove' | 'can' | 'jar' | 'packet' | 'bunch' | 'handful'
  | 'sprig' | 'slice' | 'piece' | 'stalk' | 'head' | 'sheet' | 'stick'
export type UnitId = VolumeUnitId | MassUnitId | CountUnitId
export type UnitKind = 'volume' | 'mass' | 'count'
export type UnitSystem = 'us' | 'metric' | 'imperial'

interface UnitDef {
  kind: UnitKind
  system: UnitSystem | null
  /** Size of one unit in the base (mL for volume, g for mass) as numerator / denominator. */
  ratio: readonly [bigint, bigint] | null
  one: string
  many: string
}

// US gallon = 3785.411784 mL = 3785411784 / 10⁶; imperial gallon = 4546.09 mL = 454609 / 100;
// pound = 453.59237 g = 45359237 / 10⁵. Every other unit divides these further.
const USGAL = 3785411784n
const IMPGAL = 454609n
const LB = 45359237n

const defs: Record<UnitId, UnitDef> = {
  tsp: { kind: 'volume', system: 'us', ratio: [USGAL, 768_000_000n], one: 'tsp', many: 'tsp' },
  tbsp: { kind: 'volume', system: 'us', ratio: [USGAL, 256_000_000n], one: 'tbsp', many: 'tbsp' },
  floz: { kind: 'volume', system: 'us', ratio: [USGAL, 128_000_000n], one: 'fl oz', many: 'fl oz' },
  cup: { kind: 'volume', system: 'us', ratio: [USGAL, 16_000_000n], one: 'cup', many: 'cups' },
  pint: { kind: 'volume', system: 'us', ratio: [USGAL, 8_000_000n], one: 'pint', many: 'pints' },
  quart: { kind: 'volume', system: 'us', ratio: [USGAL, 4_000_000n], one: 'quart', many: 'quarts' },
  gallon: { kind: 'volume', system: 'us', ratio: [USGAL, 1_000_000n], one: 'gallon', many: 'gallons' },
  ml: { kind: 'volume', system: 'metric', ratio: [1n, 1n], one: 'mL', many: 'mL' },
  cl: { kind: 'volume', system: 'metric', ratio: [10n, 1n], one: 'cL', many: 'cL' },
  dl: { kind: 'volume', system: 'metric', ratio: [100n, 1n], one: 'dL', many: 'dL' },
  l: { kind: 'volume', system: 'metric', ratio: [1000n, 1n], one: 'L', many: 'L' },
  'metric-cup': { kind: 'volume', system: 'metric', ratio: [250n, 1n], one: 'metric cup', many: 'metric cups' },
  'imp-floz': { kind: 'volume', system: 'imperial', ratio: [IMPGAL, 16_000n], one: 'imperial fl oz', many: 'imperial fl oz' },
  'imp-pint': { kind: 'volume', system: 'imperial', ratio: [IMPGAL, 800n], one: 'imperial pint', many: 'imperial pints' },
  'imp-quart': { kind: 'volume', system: 'imperial', ratio: [IMPGAL, 400n], one: 'imperial quart', many: 'imperial quarts' },
  'imp-gallon': { kind: 'volume', system: 'imperial', ratio: [IMPGAL, 100n], one: 'imperial gallon', many: 'imperial gallons' },
  mg: { kind: 'mass', system: 'metric', ratio: [1n, 1000n], one: 'mg', many: 'mg' },
  g: { kind: 'mass', system: 'metric', ratio: [1n, 1n], one: 'g', many: 'g' },
  kg: { kind: 'mass', system: 'metric', ratio: [1000n, 1n], one: 'kg', many: 'kg' },
  oz: { kind: 'mass', system: 'us', ratio: [LB, 1_600_000n], one: 'oz', many: 'oz' },
  lb: { kind: 'mass', system: 'us', ratio: [LB, 100_000n], one: 'lb', many: 'lb' },
  pinch: { kind: 'count', system: null, ratio: null, one: 'pinch', many: 'pinches' },
  dash: { kind: 'count', system: null, ratio: null, one: 'dash', many: 'dashes' },
  drop: { kind: 'count', system: null, ratio: null, one: 'drop', many: 'drops' },
  clove: { kind: 'count', system: null, ratio: null, one: 'clove', many: 'cloves' },
  can: { kind: 'count', system: null, ratio: null, one: 'can', many: 'cans' },
  jar: { kind: 'count', system: null, ratio: null, one: 'jar', many: 'jars' },
  packet: { kind: 'count', system: null, ratio: null, one: 'packet', many: 'packets' },
  bunch: { kind: 'count', system: null, ratio: null, one: 'bunch', many: 'bunches' },
  handful: { kind: 'count', system: null, ratio: null, one: 'handful', many: 'handfuls' },
  sprig: { kind: 'count', system: null, ratio: null, one: 'sprig', many: 'sprigs' },
  slice: { kind: 'count', system: null, ratio: null, one: 'slice', many: 'slices' },
  piece: { kind: 'count', system: null, ratio: null, one: 'piece', many: 'pieces' },
  stalk: { kind: 'count', system: null, ratio: null, one: 'stalk', many: 'stalks' },
  head: { kind: 'count', system: null, ratio: null, one: 'head', many: 'heads' },
  sheet: { kind: 'count', system: null, ratio: null, one: 'sheet', many: 'sheets' },
  stick: { kind: 'count', system: null, ratio: null, one: 'stick', many: 'sticks' },
}

export const UNIT_IDS = Object.keys(defs) as UnitId[]

/** Thrown when an amount cannot be converted; the message says what to fix. */
export class UnitConversionError extends Error {
  constructor(message: string, readonly code: 'unknown-unit' | 'incompatible' | 'no-density') {
    super(message)
    this.name = 'UnitConversionError'
  }
}

export function isUnitId(value: unknown): value is UnitId {
  return typeof value === 'string' && Object.prototype.hasOwnProperty.call(defs, value)
}

function def(id: string): UnitDef {
  if (!isUnitId(id)) throw new UnitConversionError(`"${id}" is not a unit Hobline knows; use one of: ${UNIT_IDS.join(', ')}`, 'unknown-unit')
  return defs[id]
}

export function unitKind(id: UnitId): UnitKind {
  return def(id).kind
}

export function unitSystem(id: UnitId): UnitSystem | null {
  return def(id).system
}

/** The unit as a cook writes it after an amount: "1 cup", "2 cups", "5 mL", "3 cloves". */
export function unitLabel(id: UnitId, amount = 1): string {
  const d = def(id)
  return Math.abs(amount) > 1 ? d.many : d.one
}

function gcd(a: bigint, b: bigint): bigint {
  while (b) [a, b] = [b, a % b]
  return a
}

/** The exact factor from one unit to another of the same kind, rounded once to a double. */
function exactFactor(from: UnitDef, to: UnitDef): number {
  const [fn, fd] = from.ratio!
  const [tn, td] = to.ratio!
  const n = fn * td
  const d = fd * tn
  const g = gcd(n, d)
  return Number(n / g) / Number(d / g)
}

/** Size of one unit in its base: mL for volume, g for mass. */
export function unitBaseSize(id: UnitId): number {
  const d = def(id)
  if (!d.ratio) throw new UnitConversionError(`"${id}" is counted, not measured, so it has no size in mL or g`, 'incompatible')
  return exactFactor(d, { ...d, ratio: [1n, 1n] })
}

export interface ConvertOptions {
  /** Density of the item in grams per millilitre, needed only between mass and volume. */
  gramsPerMl?: number | null
  /** Name of the item, for the error message when no density is given. */
  item?: string | null
}

/**
 * Convert an amount between units. Volume ↔ mass only with `gramsPerMl`; counted units
 * (clove, can, pinch…) convert only to themselves.
 */
export function convertAmount(value: number, from: UnitId, to: UnitId, options: ConvertOptions = {}): number {
  if (!Number.isFinite(value)) throw new UnitConversionError(`The amount must be a finite number, not ${value}`, 'incompatible')
  const a = def(from)
  const b = def(to)
  if (from === to) return value
  if (a.kind === 'count' || b.kind === 'count') {
    const counted = a.kind === 'count' ? from : to
    throw new UnitConversionError(`"${unitLabel(counted, 2)}" are counted, not measured: they cannot be converted to ${a.kind === 'count' ? unitLabel(to, 2) : unitLabel(from, 2)}`, 'incompatible')
  }
  if (a.kind === b.kind) return value * exactFactor(a, b)
  const density = options.gramsPerMl
  if (density == null || !Number.isFinite(density) || density <= 0) {
    const what = options.item ? `"${options.item}"` : 'this item'
    throw new UnitConversionError(
      `No density is known for ${what}, so ${unitLabel(from, 2)} cannot be converted to ${unitLabel(to, 2)}. ` +
        `Enter its weight for a measured amount (for example grams in 1 cup), or state the amount in ${unitLabel(from, 2)}.`,
      'no-density',
    )
  }
  if (a.kind === 'volume') return value * exactFactor(a, defs.ml) * density * exactFactor(defs.g, b)
  return ((value * exactFactor(a, defs.g)) / density) * exactFactor(defs.ml, b)
}

export type TemperatureScale = 'C' | 'F'

/** Degrees Celsius ↔ Fahrenheit by NIST SP 811: t/°C = (t/°F − 32)/1.8. Returns the other scale. */
export function convertTemperature(value: number, from: TemperatureScale): number {
  if (!Number.isFinite(value)) throw new RangeError(`The temperature must be a finite number, not ${value}`)
  if (from === 'F') return (value - 32) / 1.8
  if (from === 'C') return value * 1.8 + 32
  throw new RangeError(`"${String(from)}" is not a temperature scale; use "C" or "F"`)
}

export interface GasMark {
  mark: number
  approximate: true
  /** The nominal °F of that mark (250 °F + 25 °F per mark), for showing beside it. */
  nominalF: number
  note: string
}

/**
 * Nearest gas mark 1–9 for an oven temperature, always labelled approximate. Common practice
 * (UK oven dials; from memory): mark n ≈ 250 °F + 25 °F × n for marks 1–9. Published tables round
 * differently and disagree beyond marks 1–8, so the note says to check the oven's own guide.
 */
export function nearestGasMark(value: number, from: TemperatureScale = 'C'): GasMark {
  const f = from === 'F' ? value : convertTemperature(value, 'C')
  if (!Number.isFinite(f)) throw new RangeError(`The temperature must be a finite number, not ${value}`)
  const raw = Math.round((f - 250) / 25)
  const mark = Math.min(9, Math.max(1, raw))
  const notes = ['Gas marks are approximate: published tables disagree, most of all beyond marks 1–8. Check your oven\'s own guide.']
  if (raw < 1) notes.push('This is cooler than gas mark 1.')
  if (raw > 9) notes.push('This is hotter than gas mark 9.')
  return { mark, approximate: true, nominalF: 250 + 25 * mark, note: notes.join(' ') }
}

/**
 * An oven setting in the other scale, rounded to 5 degrees as oven dials are marked (common
 * practice): ovenTemperatureText(180, 'C') → { text: "355 °F", exact: 356 }. The exact value is
 * returned for the hover.
 */
export function ovenTemperatureText(value: number, from: TemperatureScale): { text: string; exact: number; scale: TemperatureScale } {
  const exact = convertTemperature(value, from)
  const scale: TemperatureScale = from === 'C' ? 'F' : 'C'
  return { text: `${Math.round(exact / 5) * 5} °${scale}`, exact, scale }
}
