// Volume ↔ mass through densities (shared/utils/density.ts, shared/data/densities.ts).
// Gram weights: USDA FoodData Central, SR Legacy household measures (NDB numbers in the data file;
// each entry was checked against its SR Legacy NDB number, issue 14). Cup = 236.5882365 mL (NIST Handbook 44 App. C).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { DENSITIES } from '../../shared/data/densities'
import { convertIngredientAmount, densityFromMeasure, densityItemKey, findDensity } from '../../shared/utils/density'
import { UnitConversionError } from '../../shared/utils/units'

const CUP_ML = 236.5882365

describe('the SR Legacy table', () => {
  it('cites an NDB number and states its provenance for every entry', () => {
    for (const d of DENSITIES) {
      expect(d.ndb, d.id).toMatch(/^\d{5}$/)
      expect(d.provenance, d.id).toMatch(new RegExp(`^checked against SR Legacy NDB ${d.ndb}($|; )`))
      expect(d.food.length, d.id).toBeGreaterThan(3)
    }
  })
  it('holds plausible densities only (0.2–1.6 g/mL; oats and cocoa are the lightest)', () => {
    for (const d of DENSITIES) {
      const gpm = densityFromMeasure(d.grams, d.measure.amount, d.measure.unit)
      expect(gpm, d.id).toBeGreaterThan(0.2)
      expect(gpm, d.id).toBeLessThan(1.6)
    }
  })
  it('gives each name to one food only', () => {
    const names = DENSITIES.flatMap((d) => d.names.map(densityItemKey))
    expect(new Set(names).size).toBe(names.length)
  })
  it('leaves out names that could mean several foods (rice, cream, oil)', () => {
    for (const vague of ['rice', 'cream', 'oil']) expect(findDensity(vague), vague).toBeNull()
  })
})

// USDA SR Legacy NDB numbers, as corrected by the reading of issue 14.
describe('the entries that cited the wrong SR Legacy food', () => {
  const by = (id: string) => DENSITIES.find((d) => d.id === id)!
  it('bread flour, 137 g per cup, is SR Legacy NDB 20083 (bread, enriched), not 20481 (all-purpose, unenriched)', () => {
    expect(by('flour-bread')).toMatchObject({ ndb: '20083', food: 'Wheat flour, white, bread, enriched', grams: 137, measure: { amount: 1, unit: 'cup' } })
  })
  it('soy sauce, 16 g per tbsp, is SR Legacy NDB 16123 (shoyu), not 16124 (tamari, 18 g)', () => {
    expect(by('soy-sauce')).toMatchObject({ ndb: '16123', food: 'Soy sauce made from soy and wheat (shoyu)', grams: 16, measure: { amount: 1, unit: 'tbsp' } })
  })
  it('short-grain rice, SR Legacy NDB 20052, reads "enriched, uncooked"', () => {
    expect(by('rice-short-grain').food).toBe('Rice, white, short-grain, enriched, uncooked')
  })
  it('cornstarch, SR Legacy NDB 20027: the 8 g tablespoon is derived from the 128 g cup, and says so', () => {
    expect(by('cornstarch')).toMatchObject({ grams: 8, measure: { amount: 1, unit: 'tbsp' } })
    expect(by('cornstarch').provenance).toBe('checked against SR Legacy NDB 20027; the tablespoon is derived from the cup weight, 128 g ÷ 16')
    expect(128 / 16).toBe(8)
    expect(findDensity('cornflour')!.description).toMatch(/derived from the cup weight/)
  })
  it('no entry cites 20481 or 16124 any more', () => {
    expect(DENSITIES.map((d) => d.ndb)).not.toContain('20481')
    expect(DENSITIES.map((d) => d.ndb)).not.toContain('16124')
    expect(DENSITIES).toHaveLength(32)
  })
})

describe('conversions with SR Legacy gram weights', () => {
  it('all-purpose flour, NDB 20081: 1 cup = 125 g, so 500 g = 4 cups', () => {
    expect(convertIngredientAmount(1, 'cup', 'g', 'plain flour')).toBeCloseTo(125, 10)
    expect(convertIngredientAmount(500, 'g', 'cup', 'all-purpose flour')).toBeCloseTo(4, 10)
    expect(findDensity('Flour')!.gramsPerMl).toBeCloseTo(125 / CUP_ML, 12)
  })
  it('granulated sugar, NDB 19335: 1 cup = 200 g, so 1 tbsp = 200/16 = 12.5 g (SR lists about 12.6 g; from memory)', () => {
    expect(convertIngredientAmount(1, 'tbsp', 'g', 'sugar')).toBeCloseTo(12.5, 10)
  })
  it('table salt, NDB 02047: 1 tsp = 6 g, so 1 tbsp = 18 g (SR lists 18 g; from memory)', () => {
    expect(convertIngredientAmount(1, 'tbsp', 'g', 'salt')).toBeCloseTo(18, 10)
  })
  it('butter, NDB 01001: 1 cup = 227 g, so 1 tbsp = 14.19 g (SR lists 14.2 g; from memory) and 1 stick-sized ½ cup = 113.5 g', () => {
    expect(convertIngredientAmount(1, 'tbsp', 'g', 'butter')).toBeCloseTo(14.1875, 10)
    expect(convertIngredientAmount(0.5, 'cup', 'g', 'butter')).toBeCloseTo(113.5, 10)
  })
  it('olive oil, NDB 04053: 1 tbsp = 13.5 g, so 1 cup = 216 g (SR lists 216 g; from memory)', () => {
    expect(convertIngredientAmount(1, 'cup', 'g', 'extra virgin olive oil')).toBeCloseTo(216, 10)
  })
  it('tap water, NDB 14411: 237 g per cup ≈ 1.00 g/mL, as water should be', () => {
    expect(findDensity('water')!.gramsPerMl).toBeCloseTo(1.0017, 3)
  })
  it('long-grain rice, NDB 20044: basmati is long-grain (common practice), 1 cup = 185 g; converts to metric mass units too', () => {
    expect(convertIngredientAmount(2, 'cup', 'kg', 'basmati rice')).toBeCloseTo(0.37, 12)
    expect(convertIngredientAmount(1, 'cup', 'oz', 'basmati rice')).toBeCloseTo(185 / 28.349523125, 10)
  })
  it('describes where the figure comes from', () => {
    expect(findDensity('honey')!.description).toMatch(/USDA SR Legacy NDB 19296, Honey: 1 tbsp = 21 g \(checked against SR Legacy NDB 19296\)/)
  })
  it('passes same-kind conversions straight through', () => {
    expect(convertIngredientAmount(3, 'tsp', 'tbsp', 'anything at all')).toBe(1)
  })
})

describe('a density the user enters', () => {
  it('wins over the table, and teaches Hobline an item the table lacks', () => {
    const mine = [{ item: 'Plain flour', grams: 120, amount: 1, unit: 'cup' as const }, { item: 'almond flour', grams: 96, amount: 1, unit: 'cup' as const }]
    expect(convertIngredientAmount(1, 'cup', 'g', 'plain flour', mine)).toBeCloseTo(120, 10)
    expect(convertIngredientAmount(2, 'cup', 'g', 'almond flour', mine)).toBeCloseTo(192, 10)
    expect(findDensity('almond flour', mine)).toMatchObject({ source: 'user', description: 'your entry: 1 cup = 96 g' })
  })
  it('refuses a density that is not positive or not per volume', () => {
    expect(() => densityFromMeasure(0, 1, 'cup')).toThrow(/positive weight/)
    expect(() => densityFromMeasure(100, 1, 'g')).toThrow(/not a volume unit/)
  })
})

describe('never guessed', () => {
  it('refuses an unknown item with a message that names it and says what to enter', () => {
    expect(() => convertIngredientAmount(1, 'cup', 'g', 'almond flour')).toThrow(UnitConversionError)
    expect(() => convertIngredientAmount(1, 'cup', 'g', 'almond flour')).toThrow(/No density is known for "almond flour".*Enter its weight for a measured amount/)
  })
  it('asks which rice for bare "rice"', () => {
    expect(() => convertIngredientAmount(1, 'cup', 'g', 'rice')).toThrow(/Say which rice \(long-, medium- or short-grain\)/)
  })
  it('refuses counted units', () => {
    expect(() => convertIngredientAmount(2, 'clove', 'g', 'garlic')).toThrow(/counted/)
  })
})

describe('volume → mass → volume round trip for every table entry (property)', () => {
  it('returns the amount', () => {
    fc.assert(
      fc.property(fc.constantFrom(...DENSITIES), fc.double({ min: 0.01, max: 5000, noNaN: true }), fc.constantFrom('tsp', 'tbsp', 'cup', 'ml', 'l', 'metric-cup', 'imp-pint' as const), fc.constantFrom('g', 'kg', 'oz', 'lb' as const), (d, v, vol, mass) => {
        const item = d.names[0]!
        const back = convertIngredientAmount(convertIngredientAmount(v, vol, mass, item), mass, vol, item)
        expect(Math.abs(back - v) / v).toBeLessThan(1e-12)
      }),
    )
  })
})
