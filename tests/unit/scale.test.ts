// Scaling and kitchen rounding (shared/utils/scale.ts). Unit sizes from NIST Handbook 44
// Appendix C (3 tsp = 1 tbsp, 16 tbsp = 1 cup, cup = 236.5882365 mL, lb = 453.59237 g,
// oz = 28.349523125 g); how far to round is common practice of US and metric kitchens.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { formatKitchenAmount, scaleAmount, scaleRecipeIngredients } from '../../shared/utils/scale'
import { parseQuantity } from '../../shared/utils/quantity'
import { convertAmount, unitKind, UNIT_IDS, type UnitId } from '../../shared/utils/units'
import type { RecipeIngredientDraft } from '../../shared/types/recipe'

const us = { system: 'us' as const }
const metric = { system: 'metric' as const }
const text = (v: number, unit: UnitId | null, o: { system: 'us' | 'metric'; metricCups?: boolean } = us) => formatKitchenAmount(v, v, unit, o).text

describe('scaleAmount', () => {
  it('multiplies by new servings over recipe servings', () => {
    expect(scaleAmount(200, 4, 6)).toBe(300)
    expect(scaleAmount(1, 3, 1)).toBeCloseTo(1 / 3, 15)
  })
  it('refuses servings that are not above zero', () => {
    expect(() => scaleAmount(1, 4, 0)).toThrow(/servings must be a number above zero/)
    expect(() => scaleAmount(1, Number.NaN, 2)).toThrow(/recipe servings/)
  })
})

describe('US volume: spoons and cups (NIST: 3 tsp = 1 tbsp, 16 tbsp = 1 cup; rounding common practice)', () => {
  it('chooses the sensible unit: 3 tsp → 1 tbsp, 16 tbsp → 1 cup, 48 tsp → 1 cup', () => {
    expect(text(3, 'tsp')).toBe('1 tbsp')
    expect(text(16, 'tbsp')).toBe('1 cup')
    expect(text(48, 'tsp')).toBe('1 cup')
  })
  it('uses ⅛ ¼ ½ ¾ for teaspoons', () => {
    expect(text(0.5, 'tsp')).toBe('½ tsp')
    expect(text(0.3, 'tsp')).toBe('¼ tsp')
    expect(text(1.7, 'tsp')).toBe('1¾ tsp')
    expect(text(0.14, 'tsp')).toBe('⅛ tsp')
  })
  it('writes tablespoons with a teaspoon remainder: 4 tsp = 1 tbsp + 1 tsp', () => {
    expect(text(4, 'tsp')).toBe('1 tbsp + 1 tsp')
    expect(text(2.5, 'tbsp')).toBe('2 tbsp + 1½ tsp')
    expect(text(3.65, 'tbsp')).toBe('3 tbsp + 2 tsp') // 3.65 tbsp = 10.95 tsp
    expect(text(3.7, 'tbsp')).toBe('3 tbsp + 2⅛ tsp') // 11.1 tsp
    expect(text(3.98, 'tbsp')).toBe('¼ cup') // 11.94 tsp: within ⅛ tsp of ¼ cup (12 tsp)
  })
  it('uses ⅛ ¼ ⅓ ½ ⅔ ¾ for cups, and quarts from 8 cups', () => {
    expect(text(0.3, 'cup')).toBe('⅓ cup')
    expect(text(0.7, 'cup')).toBe('⅔ cup')
    expect(text(1.1, 'cup')).toBe('1⅛ cups')
    expect(text(2.75, 'cup')).toBe('2¾ cups')
    expect(text(1.02, 'cup')).toBe('1 cup')
    expect(text(10, 'cup')).toBe('2½ quarts')
  })
  it('converts metric volumes: 250 mL → 1 cup (250 / 236.588 = 1.057); 15 mL → 1 tbsp', () => {
    expect(text(250, 'ml')).toBe('1 cup')
    expect(text(15, 'ml')).toBe('1 tbsp')
    expect(text(5, 'ml')).toBe('1 tsp')
  })
})

describe('US mass: ounces and pounds (NIST: 16 oz = 1 lb = 453.59237 g)', () => {
  it('500 g = 17.64 oz → 1 lb 2 oz; 100 g = 3.527 oz → 3½ oz; 7 g = 0.247 oz → ¼ oz', () => {
    expect(text(500, 'g')).toBe('1 lb 2 oz')
    expect(text(100, 'g')).toBe('3½ oz')
    expect(text(7, 'g')).toBe('¼ oz')
  })
  it('whole ounces from 4 oz; whole pounds when the ounces round away', () => {
    expect(text(200, 'g')).toBe('7 oz') // 7.05 oz
    expect(text(1.99, 'lb')).toBe('2 lb')
    expect(text(1.25, 'lb')).toBe('1 lb 4 oz')
  })
})

describe('metric (whole grams above 10 g; mL → L and g → kg from about 1000)', () => {
  it('1 cup = 236.588 mL → 240 mL; 2 tbsp = 29.57 mL → 30 mL; 1 tbsp stays a spoon', () => {
    expect(text(1, 'cup', metric)).toBe('240 mL')
    expect(text(2, 'tbsp', metric)).toBe('30 mL')
    expect(text(1, 'tbsp', metric)).toBe('1 tbsp')
    expect(text(1, 'tsp', metric)).toBe('1 tsp')
  })
  it('1 lb = 453.59 g → 454 g; 12.4 g → 12 g; 7.3 g → 7.5 g; 0.3 g → 0.3 g', () => {
    expect(text(1, 'lb', metric)).toBe('454 g')
    expect(text(12.4, 'g', metric)).toBe('12 g')
    expect(text(7.3, 'g', metric)).toBe('7.5 g')
    expect(text(0.3, 'g', metric)).toBe('0.3 g')
  })
  it('1000 mL → 1 L, 1500 mL → 1.5 L, 1000 g → 1 kg, 1234 g → 1.25 kg', () => {
    expect(text(1000, 'ml', metric)).toBe('1 L')
    expect(text(1500, 'ml', metric)).toBe('1.5 L')
    expect(text(1000, 'g', metric)).toBe('1 kg')
    expect(text(1234, 'g', metric)).toBe('1.25 kg')
  })
  it('shows 250 mL metric cups when the studio chooses them', () => {
    expect(text(1, 'metric-cup', { system: 'metric', metricCups: true })).toBe('1 metric cup')
    expect(text(375, 'ml', { system: 'metric', metricCups: true })).toBe('1½ metric cups')
    expect(text(375, 'ml', metric)).toBe('380 mL')
  })
})

describe('counted items, ranges, no amount', () => {
  it('counts to ¼ below 10 and whole above', () => {
    expect(text(1.5, null)).toBe('1½')
    expect(text(2.3, 'clove')).toBe('2¼ cloves')
    expect(text(12.4, null)).toBe('12')
  })
  it('shows a range in one unit, the one its smaller end needs, and one amount when both ends round alike', () => {
    expect(formatKitchenAmount(3, 4.5, 'tbsp', us).text).toBe('3–4½ tbsp')
    expect(formatKitchenAmount(500, 1500, 'g', metric).text).toBe('500–1500 g')
    expect(formatKitchenAmount(2, 3, 'tbsp', us).text).toBe('2–3 tbsp')
    expect(formatKitchenAmount(1, 2, 'cup', us).text).toBe('1–2 cups')
    expect(formatKitchenAmount(0.5, 0.75, 'tsp', us).text).toBe('½–¾ tsp')
    expect(formatKitchenAmount(8, 12, 'oz', metric).text).toBe('227–340 g')
    expect(formatKitchenAmount(1.02, 1.04, 'cup', us).text).toBe('1 cup')
  })
  it('shows "to taste" (or nothing) for no amount', () => {
    expect(formatKitchenAmount(null, null, null, us, true)).toEqual({ text: 'to taste', unit: null, min: null, max: null, exactText: '' })
    expect(formatKitchenAmount(null, null, null, us).text).toBe('')
  })
  it('never rounds a non-zero amount to zero', () => {
    expect(text(0.01, 'tsp')).toBe('less than ⅛ tsp')
    expect(text(0.01, 'g', metric)).toBe('less than 0.1 g')
    expect(text(0.1, null)).toBe('less than ¼')
  })
  it('refuses negative amounts', () => {
    expect(() => formatKitchenAmount(-1, -1, 'g', metric)).toThrow(/zero or more/)
  })
})

describe('the exact value is kept beside the text', () => {
  it('returns unrounded numbers in the unit shown, and an exact text for the hover', () => {
    const a = formatKitchenAmount(4, 4, 'tsp', us)
    expect(a.unit).toBe('tbsp')
    expect(a.min).toBeCloseTo(4 / 3, 14)
    expect(a.exactText).toBe('exactly 1.333 tbsp')
    const b = formatKitchenAmount(1, 1, 'cup', metric)
    expect([b.unit, b.min]).toEqual(['ml', convertAmount(1, 'cup', 'ml')])
    expect(b.exactText).toBe('exactly 236.6 mL')
  })
})

describe('scaleRecipeIngredients', () => {
  const ing = (over: Partial<RecipeIngredientDraft>): RecipeIngredientDraft => ({
    key: 'k', position: 1, min: null, max: null, unit: null, item: 'x', prep: null, optional: false, toTaste: false, group: null,
    allergens: { eu: [], us: [] }, ...over,
  })
  it('scales 4 servings to 6 and shows them in US units, in recipe order', () => {
    const r = scaleRecipeIngredients([
      ing({ key: 'salt', position: 3, item: 'salt', toTaste: true }),
      ing({ key: 'flour', position: 1, min: 200, max: 200, unit: 'g', item: 'plain flour' }),
      ing({ key: 'milk', position: 2, min: 2, max: 3, unit: 'tbsp', item: 'milk', optional: true }),
    ], 4, 6, us)
    expect(r.servings).toBe(6)
    expect(r.ingredients.map((i) => [i.key, i.text, i.optional])).toEqual([
      ['flour', '11 oz', false], // 300 g = 10.58 oz, whole ounces from 4 oz
      ['milk', '3–4½ tbsp', true],
      ['salt', 'to taste', false],
    ])
    expect(r.ingredients[0]!.min).toBeCloseTo(300 / 28.349523125, 10)
  })
  it('refuses servings that are not above zero', () => {
    expect(() => scaleRecipeIngredients([], 4, 0, us)).toThrow(/above zero/)
  })
})

describe('properties', () => {
  const measured = UNIT_IDS
  const amount = fc.double({ min: 0.001, max: 20000, noNaN: true })
  it('never shows a zero, and the exact value is the amount converted into the unit shown', () => {
    fc.assert(
      fc.property(amount, fc.constantFrom(...measured), fc.constantFrom('us' as const, 'metric' as const), (v, unit, system) => {
        const a = formatKitchenAmount(v, v, unit, { system })
        expect(a.text).not.toMatch(/(^|–)0(?![.,]\d)/)
        expect(a.text.length).toBeGreaterThan(0)
        if (a.unit && unitKind(unit) !== 'count') expect(a.min! / convertAmount(v, unit, a.unit)).toBeCloseTo(1, 12)
        else expect(a.min).toBe(v)
      }),
      { numRuns: 500 },
    )
  })
  it('the rounded text reads back within the measuring steps: ≤ ⅓ off always, ≤ 5% for metric amounts of 10 g or 100 mL and more', () => {
    const volumes = UNIT_IDS.filter((u) => unitKind(u) === 'volume')
    const masses = UNIT_IDS.filter((u) => unitKind(u) === 'mass')
    fc.assert(
      fc.property(amount, fc.constantFrom(...volumes, ...masses), fc.constantFrom('us' as const, 'metric' as const), (v, unit, system) => {
        const a = formatKitchenAmount(v, v, unit, { system })
        const base = unitKind(unit) === 'volume' ? 'ml' : 'g'
        const exact = convertAmount(v, unit, base)
        // below twice the smallest step (¼ tsp = 1.23 mL; ¼ oz = 7.09 g) the rule is "never zero", not "close"
        fc.pre(exact >= (base === 'ml' ? 1.24 : 7.1))
        const back = parseQuantity(`${a.text} x`)
        const shown = convertAmount(back.min!, back.unit!, base)
        const err = Math.abs(shown - exact) / exact
        expect(err, `${v} ${unit} → ${a.text}`).toBeLessThanOrEqual(1 / 3 + 1e-9)
        if (system === 'metric' && exact >= (base === 'g' ? 10 : 100)) expect(err, `${v} ${unit} → ${a.text}`).toBeLessThanOrEqual(0.05)
      }),
      { numRuns: 1000 },
    )
  })
  it('scaling there and back returns the amount', () => {
    fc.assert(
      fc.property(amount, fc.integer({ min: 1, max: 48 }), fc.integer({ min: 1, max: 48 }), (v, a, b) => {
        expect(scaleAmount(scaleAmount(v, a, b), b, a)).toBeCloseTo(v, 9)
      }),
    )
  })
})
