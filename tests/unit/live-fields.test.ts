// Live fields of a show's script (shared/utils/live-fields.ts). Sources beside each check: money in
// ISO 4217 minor units written by Intl (money.ts); °C → °F by NIST SP 811 (t/°F = 1.8 t/°C + 32), said
// to the nearest 25 °F as oven dials and the cookbook °C/°F/gas-mark tables mark them (common practice,
// tables cited from memory); amounts scaled value × to ÷ from servings and written by scale.ts
// (grams by NIST Handbook 44 Appendix C: 1 oz = 28.349523125 g). Worked by hand.
import { describe, expect, it } from 'vitest'
import { costRecipe } from '../../shared/utils/cost'
import { gapWords, ovenSpoken, renderScript, showRecipeCost, totalTimeSpoken, type ShowData } from '../../shared/utils/live-fields'
import type { ScriptPiece } from '../../shared/utils/show-segments'

const data = (over: Partial<ShowData> = {}): ShowData => ({
  servings: 6,
  display: { system: 'metric' },
  locale: 'en-GB',
  currency: 'GBP',
  budgetPerServingMinor: 200,
  recipes: [
    {
      id: 1, title: 'Lentil soup', servings: 4, totalSeconds: 4200,
      ingredients: [
        { key: 'lentils', item: 'red lentils', min: 250, max: 250, unit: 'g' },
        { key: 'stock', item: 'stock', text: '1.5 L' },
        { key: 'salt', item: 'salt', min: null, max: null, unit: null, toTaste: true },
        { key: 'bay', item: 'bay leaf', min: null, max: null, unit: null },
      ],
      cost: { perServingMinor: 185, perServingWithOptionalMinor: 210, complete: true, gaps: [] },
    },
    {
      id: 2, title: 'Herb rice', servings: 4, totalSeconds: null, ingredients: [],
      cost: { perServingMinor: 95, perServingWithOptionalMinor: 95, complete: false, gaps: [{ item: 'Parsley', optional: true, status: 'no-price' }] },
    },
  ],
  ...over,
})

const t = (text: string): ScriptPiece => ({ text })

describe('renderScript: every kind of live field', () => {
  it('writes servings, budget, cost with and without optional, amount, oven and total time', () => {
    const r = renderScript([
      t('For '), { field: { kind: 'servings' } }, t(', under '), { field: { kind: 'budget' } },
      t('. Soup: '), { field: { kind: 'cost', recipeId: 1, withOptional: false } },
      t(' a serving, '), { field: { kind: 'cost', recipeId: 1, withOptional: true } },
      t(' with the garnish. '), { field: { kind: 'amount', recipeId: 1, ingredientKey: 'lentils' } },
      t(' of lentils, '), { field: { kind: 'amount', recipeId: 1, ingredientKey: 'stock' } },
      t(' of stock, oven at '), { field: { kind: 'oven', celsius: 220 } },
      t(', ready in '), { field: { kind: 'total-time', recipeId: 1 } }, t('.'),
    ], data())
    // 250 g × 6 ÷ 4 = 375 g; 185p = £1.85 (ISO 4217: GBP has 2 minor digits); 220 °C = 428 °F → 425 °F; 4200 s = 70 min.
    expect(r.text).toBe('For 6, under £2.00. Soup: £1.85 a serving, £2.10 with the garnish. 375 g of lentils, 1.5 L of stock, oven at 220 °C, 425 °F, ready in 1 h 10 min.')
    expect(r.missing).toEqual([])
    expect(r.parts.filter((p) => p.field).map((p) => p.field!.kind)).toEqual(['servings', 'budget', 'cost', 'cost', 'amount', 'amount', 'oven', 'total-time'])
  })

  it('writes an amount in the shoot\'s units: 250 g for 4 → 375 g for 6 = 13.23 oz → "13 oz" (whole ounces from 4 oz)', () => {
    const r = renderScript([{ field: { kind: 'amount', recipeId: 1, ingredientKey: 'lentils' } }], data({ display: { system: 'us' } }))
    expect(r.text).toBe('13 oz')
  })

  it('writes "to taste" for an ingredient the cook seasons by taste, and money in the studio\'s locale', () => {
    expect(renderScript([{ field: { kind: 'amount', recipeId: 1, ingredientKey: 'salt' } }], data()).text).toBe('to taste')
    // Intl with de-DE: comma decimal, symbol after (CLDR).
    const euro = renderScript([{ field: { kind: 'budget' } }], data({ currency: 'EUR', locale: 'de-DE', budgetPerServingMinor: 250 }))
    expect(euro.text.replace(/\s/g, ' ')).toBe('2,50 €')
  })
})

describe('renderScript: missing data is a placeholder in plain words, flagged and listed', () => {
  it('an optional ingredient without a price leaves the with-optional cost unknown, not the one without', () => {
    const r = renderScript([
      { field: { kind: 'cost', recipeId: 2, withOptional: false } }, t(' / '), { field: { kind: 'cost', recipeId: 2, withOptional: true } },
    ], data())
    expect(r.text).toBe('£0.95 / [cost unknown: Parsley has no price]')
    expect(r.missing).toEqual(['Parsley has no price'])
    expect(r.parts[2]).toMatchObject({ missing: 'Parsley has no price', field: { kind: 'cost' } })
    expect(r.parts[0]!.missing).toBeUndefined()
  })

  it('a recipe deleted from under its fields: every recipe field says so, the rest still render', () => {
    const d = data()
    d.recipes = d.recipes.filter((r) => r.id !== 1)
    const r = renderScript([
      { field: { kind: 'cost', recipeId: 1, withOptional: false } }, t(' '),
      { field: { kind: 'amount', recipeId: 1, ingredientKey: 'lentils' } }, t(' '),
      { field: { kind: 'total-time', recipeId: 1 } }, t(' '), { field: { kind: 'servings' } },
    ], d)
    expect(r.text).toBe('[cost unknown: the recipe is no longer in the studio] [amount unknown: the recipe is no longer in the studio] '
      + '[total time unknown: the recipe is no longer in the studio] 6')
    expect(r.missing).toHaveLength(3)
  })

  it('no budget, an ingredient gone, an ingredient with no amount, no total time, no cost at all', () => {
    const d = data({ budgetPerServingMinor: null })
    d.recipes[1]!.cost = null
    const r = renderScript([
      { field: { kind: 'budget' } }, { field: { kind: 'amount', recipeId: 1, ingredientKey: 'onion' } },
      { field: { kind: 'amount', recipeId: 1, ingredientKey: 'bay' } }, { field: { kind: 'total-time', recipeId: 2 } },
      { field: { kind: 'cost', recipeId: 2, withOptional: false } },
    ], d)
    expect(r.missing).toEqual([
      'no budget per serving is set for the episode', 'Lentil soup no longer has that ingredient', 'bay leaf has no amount',
      'Herb rice has no total time', 'Herb rice has not been costed',
    ])
    expect(r.text).not.toMatch(/[{}]|"kind"/)
  })

  it('a required ingredient without a price leaves both figures unknown', () => {
    const d = data()
    d.recipes[1]!.cost!.gaps.push({ item: 'Rice', optional: false, status: 'no-price' }, { item: 'Salt', optional: false, status: 'to-taste' })
    const r = renderScript([{ field: { kind: 'cost', recipeId: 2, withOptional: false } }], d)
    expect(r.missing).toEqual(['Rice has no price; Salt is to taste with no amount'])
  })
})

describe('showRecipeCost: the cost fragment from costRecipe', () => {
  it('keeps both figures and lists every line not in them, optional or not', () => {
    const cost = costRecipe([
      { key: 'rice', item: 'Rice', min: 300, max: 300, unit: 'g', optional: false, priceId: 'r' },
      { key: 'parsley', item: 'Parsley', min: 1, max: 1, unit: 'bunch', optional: true, priceId: null },
    ], [{ id: 'r', item: 'Rice', packageSize: 1, packageUnit: 'kg', priceMinor: 200, currency: 'GBP' }], { currency: 'GBP', servings: 4 })
    // 300 / 1000 × 200 = 60p ÷ 4 = 15p a serving (cost.ts formula, worked by hand).
    expect(showRecipeCost(cost)).toEqual({ perServingMinor: 15, perServingWithOptionalMinor: 15, complete: false, gaps: [{ item: 'Parsley', optional: true, status: 'no-price' }] })
    expect(gapWords(showRecipeCost(cost).gaps)).toBe('Parsley has no price')
    expect(gapWords([{ item: 'Parsley', optional: true, status: 'no-price' }, { item: 'lemon', optional: true, status: 'no-price' }])).toBe('Parsley and lemon have no price')
  })
})

describe('ovenSpoken: °C as set, °F to the nearest 25 °F (NIST SP 811 conversion; cookbook table from memory)', () => {
  it.each([
    [140, 284, 275], [150, 302, 300], [160, 320, 325],
    // 170 °C is 338 °F: nearer 350 than 325 (some printed tables give 325 °F, gas mark 3, for it).
    [170, 338, 350], [180, 356, 350], [190, 374, 375], [200, 392, 400], [220, 428, 425], [230, 446, 450], [240, 464, 475],
  ])('%i °C is exactly %i °F, said as %i °F', (c, exact, said) => {
    const o = ovenSpoken(c)
    expect(o.exactF).toBeCloseTo(exact, 9)
    expect(o.fahrenheit).toBe(said)
    expect(o.text).toBe(`${c} °C, ${said} °F`)
  })
})

describe('totalTimeSpoken', () => {
  it('whole minutes from a minute, in duration.ts\'s words', () => {
    expect(totalTimeSpoken(4200)).toBe('1 h 10 min')
    expect(totalTimeSpoken(1770)).toBe('30 min') // 29.5 min rounds half up
    expect(totalTimeSpoken(45)).toBe('45 s')
  })
})
