// Densities for turning an ingredient's volume into mass and back: one the user entered for the
// item first, then the USDA SR Legacy household-measure table (shared/data/densities.ts), never a
// guess. With neither, the conversion is refused with a message that names the item.
import { DENSITIES, DENSITY_HINTS, type DensityEntry } from '../data/densities'
import { UnitConversionError, convertAmount, unitBaseSize, unitKind, type UnitId } from './units'

/** A density the user entered: grams in a measured amount of the item ("1 cup = 120 g"). */
export interface UserDensity {
  item: string
  grams: number
  amount: number
  unit: UnitId
}

export interface FoundDensity {
  gramsPerMl: number
  source: 'user' | 'usda-sr-legacy'
  /** What the figure is: "your entry: 1 cup = 120 g" or the SR food, NDB number and provenance. */
  description: string
  entry?: DensityEntry
}

/** The name as matched: lower case, accents and a trailing parenthesis dropped, spaces collapsed. */
export function densityItemKey(item: string): string {
  return item
    .normalize('NFD').replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/\([^)]*\)\s*$/, '')
    .replace(/[’']/g, "'")
    .replace(/\s+/g, ' ')
    .trim()
}

/** Grams per millilitre from a weighed measure: densityFromMeasure(125, 1, 'cup') ≈ 0.528. */
export function densityFromMeasure(grams: number, amount: number, unit: UnitId): number {
  if (!(grams > 0) || !(amount > 0) || !Number.isFinite(grams) || !Number.isFinite(amount)) {
    throw new UnitConversionError(`A density needs a positive weight and a positive amount, not ${grams} g in ${amount}`, 'no-density')
  }
  if (unitKind(unit) !== 'volume') throw new UnitConversionError(`A density is grams in a measured volume; "${unit}" is not a volume unit`, 'incompatible')
  return grams / (amount * unitBaseSize(unit))
}

const byName = new Map<string, DensityEntry>()
for (const d of DENSITIES) for (const n of d.names) byName.set(densityItemKey(n), d)

/** The density Hobline would use for an item, or null when it knows none. */
export function findDensity(item: string, userDensities: readonly UserDensity[] = []): FoundDensity | null {
  const key = densityItemKey(item)
  const own = userDensities.find((u) => densityItemKey(u.item) === key)
  if (own) {
    return { gramsPerMl: densityFromMeasure(own.grams, own.amount, own.unit), source: 'user', description: `your entry: ${own.amount} ${own.unit} = ${own.grams} g` }
  }
  const entry = byName.get(key)
  if (!entry) return null
  return {
    gramsPerMl: densityFromMeasure(entry.grams, entry.measure.amount, entry.measure.unit),
    source: 'usda-sr-legacy',
    description: `USDA SR Legacy NDB ${entry.ndb}, ${entry.food}: ${entry.measure.amount} ${entry.measure.unit}${entry.measure.note ? ` (${entry.measure.note})` : ''} = ${entry.grams} g (${entry.provenance})`,
    entry,
  }
}

/**
 * Convert an ingredient's amount; between mass and volume through its density (the user's, then
 * the SR Legacy table). Refuses with a message naming the item when no density is known.
 */
export function convertIngredientAmount(value: number, from: UnitId, to: UnitId, item: string, userDensities: readonly UserDensity[] = []): number {
  const kinds = [unitKind(from), unitKind(to)]
  if (kinds[0] === kinds[1] || kinds.includes('count')) return convertAmount(value, from, to, { item })
  const found = findDensity(item, userDensities)
  if (!found) {
    try {
      convertAmount(value, from, to, { item })
    } catch (e) {
      const hint = DENSITY_HINTS[densityItemKey(item)]
      if (hint && e instanceof UnitConversionError) throw new UnitConversionError(`${e.message} ${hint}`, e.code)
      throw e
    }
  }
  return convertAmount(value, from, to, { item, gramsPerMl: found!.gramsPerMl })
}
