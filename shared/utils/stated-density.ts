// A density from a recipe's own words: "½ cup (100 g) sugar" says 100 g of this sugar fill half a
// cup. For costing (cost.ts takes them as the user's densities, which come before the USDA table),
// each ingredient that states a mass beside a volume, or a volume beside a mass, gives one.
import type { StatedMeasure } from '../types/recipe'
import { findDensity, type UserDensity } from './density'
import { formatQuantityText } from './quantity'
import { convertAmount, isUnitId, unitKind, type UnitId } from './units'

interface WithStated {
  item: string
  min: number | null
  max: number | null
  unit: string | null
  stated?: StatedMeasure | { min: number; max: number; unit: string } | null
}

/** The density an ingredient line states, or null: grams of the item in its measured volume (upper ends of the ranges). */
export function statedDensity(ing: WithStated): UserDensity | null {
  const s = ing.stated
  if (!s || ing.max === null || !ing.unit || !isUnitId(ing.unit) || !isUnitId(s.unit) || !(ing.max > 0) || !(s.max > 0)) return null
  const main = { amount: ing.max, unit: ing.unit as UnitId }
  const other = { amount: s.max, unit: s.unit as UnitId }
  const kinds = [unitKind(main.unit), unitKind(other.unit)]
  if (kinds[0] === kinds[1] || kinds.includes('count')) return null
  const [mass, volume] = kinds[0] === 'mass' ? [main, other] : [other, main]
  return { item: ing.item, grams: convertAmount(mass.amount, mass.unit, 'g'), amount: volume.amount, unit: volume.unit }
}

/** The densities a recipe's lines state, one per line that gives one. */
export function statedDensities(ings: readonly WithStated[]): UserDensity[] {
  return ings.map(statedDensity).filter((d): d is UserDensity => d !== null)
}

/**
 * Where a cost line's conversion between volume and mass takes its density from, in words: the
 * recipe's own stated measure, else the USDA entry; null when the line needs no density.
 */
export function conversionSource(ing: WithStated, packageUnit: string | null | undefined): string | null {
  if (!ing.unit || !packageUnit || !isUnitId(ing.unit) || !isUnitId(packageUnit)) return null
  const kinds = [unitKind(ing.unit), unitKind(packageUnit)]
  if (kinds[0] === kinds[1] || kinds.includes('count')) return null
  if (statedDensity(ing) && ing.stated) {
    return `the recipe's own measure: ${formatQuantityText(ing.min, ing.max, ing.unit)} = ${formatQuantityText(ing.stated.min, ing.stated.max, ing.stated.unit as UnitId)}`
  }
  return findDensity(ing.item)?.description ?? null
}
