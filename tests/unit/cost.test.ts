// Cost per serving (shared/utils/cost.ts) and money (shared/utils/money.ts).
// The formula is DESIGN.md's: Σ (amount used ÷ package size × package price) ÷ servings, in
// integer minor units rounded once at the end. Minor-unit digits are ISO 4217's (GBP 2, JPY 0,
// KWD 3), from one table (shared/data/iso4217-minor-units.ts); conversions by NIST Handbook 44
// Appendix C; the flour density is
// USDA SR Legacy NDB 20081 (1 cup = 125 g, checked against SR Legacy). Worked examples are computed by hand.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { costRecipe, type CostedIngredient, type StudioPrice } from '../../shared/utils/cost'
import { currencyMinorDigits, formatMoney, isCurrencyCode, minorToDecimal, parseMoneyToMinor, roundMinor } from '../../shared/utils/money'

const price = (id: string, item: string, packageSize: number, packageUnit: StudioPrice['packageUnit'], priceMinor: number, currency = 'GBP'): StudioPrice =>
  ({ id, item, packageSize, packageUnit, priceMinor, currency })
const ing = (key: string, min: number | null, unit: CostedIngredient['unit'], priceId: string | null, optional = false, max = min): CostedIngredient =>
  ({ key, item: key, min, max, unit, optional, priceId })

// Brackenford Test Kitchen's invented price list.
const prices = [
  price('p-flour', 'plain flour', 1.5, 'kg', 115),
  price('p-butter', 'butter', 250, 'g', 210),
  price('p-eggs', 'eggs', 6, null, 189),
  price('p-milk', 'milk', 1, 'l', 95),
  price('p-parsley', 'parsley', 1, 'bunch', 70),
  price('p-garlic', 'garlic', 1, 'head', 45),
  price('p-saffron', 'saffron', 1, 'g', 650, 'EUR'),
]

describe('costRecipe: worked example (4 servings, GBP)', () => {
  const recipe = [
    ing('plain flour', 250, 'g', 'p-flour'), //   250 / 1500 × 115 = 19.1667p
    ing('butter', 100, 'g', 'p-butter'), //       100 / 250 × 210  = 84p
    ing('eggs', 2, null, 'p-eggs'), //            2 / 6 × 189      = 63p
    ing('milk', 1, 'cup', 'p-milk'), //           0.2365882365 L / 1 × 95 = 22.4759p
    ing('parsley', 1, 'bunch', 'p-parsley', true), // optional: 70p
    ing('salt', null, null, null), //             no amount: not costed
    ing('sugar', 2, 'tbsp', null), //             no price: listed as missing
  ]
  const cost = costRecipe(recipe, prices, { currency: 'GBP', servings: 4 })
  it('costs each line exactly', () => {
    const by = Object.fromEntries(cost.lines.map((l) => [l.key, l]))
    expect(by['plain flour']!.costExact).toBeCloseTo((250 / 1500) * 115, 10)
    expect(by['plain flour']!.amountUsed).toBeCloseTo(0.25, 12)
    expect(by.butter!.costExact).toBeCloseTo(84, 10)
    expect(by.eggs!.costExact).toBeCloseTo(63, 10)
    expect(by.milk!.costExact).toBeCloseTo(0.2365882365 * 95, 10)
    expect(by.parsley!.costExact).toBe(70)
    expect(by.salt!.status).toBe('no-amount')
    expect(by.sugar!.status).toBe('no-price')
  })
  it('gives per serving without optional: 188.6426p / 4 = 47.16 → 47p; with optional: 258.6426p / 4 = 64.66 → 65p', () => {
    expect(cost.perServingMinor).toBe(47)
    expect(cost.perServingWithOptionalMinor).toBe(65)
    expect(cost.totalMinor).toBe(189)
    expect(cost.totalWithOptionalMinor).toBe(259)
  })
  it('lists missing prices and says the figure is incomplete', () => {
    expect(cost.missing.map((l) => l.key)).toEqual(['sugar'])
    expect(cost.missing[0]!.message).toMatch(/"sugar" has no price/)
    expect(cost.complete).toBe(false)
    expect(cost.currency).toBe('GBP')
    expect(cost.minorDigits).toBe(2)
  })
  it('scales totals to other servings; per-serving figures stay the same', () => {
    const six = costRecipe(recipe, prices, { currency: 'GBP', servings: 4, forServings: 6 })
    expect(six.servings).toBe(6)
    expect(six.totalMinor).toBe(283) // 188.6426 × 1.5 = 282.96
    expect(six.perServingMinor).toBe(47)
    expect(six.lines.find((l) => l.key === 'butter')!.costMinor).toBe(126)
  })
})

describe('"to taste" lines', () => {
  // Issue 14: a "to taste" line with no amount cannot be costed, so the cost is a lower bound, not complete.
  const priced = [ing('butter', 100, 'g', 'p-butter')]
  it('a required "salt, to taste" leaves the cost incomplete and says why', () => {
    const cost = costRecipe([...priced, { ...ing('salt', null, null, null), toTaste: true }], prices, { currency: 'GBP', servings: 4 })
    expect(cost.lines[1]!.status).toBe('to-taste')
    expect(cost.unmeasured.map((l) => l.key)).toEqual(['salt'])
    expect(cost.unmeasured[0]!.message).toMatch(/"salt" is to taste/)
    expect(cost.complete).toBe(false)
    expect(cost.totalMinor).toBe(84)
  })
  it('an optional to-taste line, or one with an amount, keeps it complete', () => {
    expect(costRecipe([...priced, { ...ing('chilli flakes', null, null, null, true), toTaste: true }], prices, { currency: 'GBP', servings: 4 }).complete).toBe(true)
    expect(costRecipe([...priced, { ...ing('butter', 10, 'g', 'p-butter'), key: 'b2', toTaste: true }], prices, { currency: 'GBP', servings: 4 }).complete).toBe(true)
    expect(costRecipe(priced, prices, { currency: 'GBP', servings: 4 }).complete).toBe(true)
  })
})

describe('costRecipe rules', () => {
  it('takes "each" and numeric price ids as the studio stores them', () => {
    const p = [{ id: 7, item: 'lemons', packageSize: 4, packageUnit: 'each' as const, priceMinor: 120, currency: 'GBP' }]
    const c = costRecipe([{ key: 'lemon', item: 'lemon', min: 1, max: 1, unit: null, optional: false, priceId: 7 }], p, { currency: 'GBP', servings: 1 })
    expect(c.totalMinor).toBe(30)
  })
  it('rounds once at the end, not per line: three lines of 0.4p make 1p, not 0p', () => {
    const p = [price('p', 'x', 10, 'g', 4)]
    const c = costRecipe([ing('a', 1, 'g', 'p'), ing('b', 1, 'g', 'p'), ing('c', 1, 'g', 'p')], p, { currency: 'GBP', servings: 1 })
    expect(c.lines.map((l) => l.costMinor)).toEqual([0, 0, 0])
    expect(c.totalMinor).toBe(1)
  })
  it('converts volume to mass through the SR Legacy density: 2 cups flour = 250 g (NDB 20081) → 19.17p', () => {
    const c = costRecipe([ing('plain flour', 2, 'cup', 'p-flour')], prices, { currency: 'GBP', servings: 1 })
    expect(c.lines[0]!.amountUsed).toBeCloseTo(0.25, 10)
    expect(c.totalMinor).toBe(19)
  })
  it('uses a density the user entered', () => {
    const p = [price('p-alm', 'almond flour', 200, 'g', 300)]
    const i = [ing('almond flour', 1, 'cup', 'p-alm')]
    const c = costRecipe(i, p, { currency: 'GBP', servings: 1, densities: [{ item: 'almond flour', grams: 96, amount: 1, unit: 'cup' }] })
    expect(c.totalMinor).toBe(144) // 96 / 200 × 300
  })
  it('lists what cannot be converted, naming the item, and leaves it out of the figures', () => {
    const p = [price('p-alm', 'almond flour', 200, 'g', 300), ...prices]
    const c = costRecipe([ing('almond flour', 1, 'cup', 'p-alm'), ing('garlic', 2, 'clove', 'p-garlic'), ing('eggs', 100, 'g', 'p-eggs')], p, { currency: 'GBP', servings: 1 })
    expect(c.lines.map((l) => l.status)).toEqual(['cannot-convert', 'cannot-convert', 'cannot-convert'])
    expect(c.problems[0]!.message).toMatch(/No density is known for "almond flour"/)
    expect(c.problems[1]!.message).toBe('"garlic" is used in cloves but priced per head; use the same unit in both')
    expect(c.problems[2]!.message).toMatch(/"eggs" is measured in g but priced by the piece/)
    expect(c.totalMinor).toBe(0)
    expect(c.complete).toBe(false)
  })
  it('refuses a price in another currency for the line, saying what to enter', () => {
    const c = costRecipe([ing('saffron', 0.1, 'g', 'p-saffron')], prices, { currency: 'GBP', servings: 1 })
    expect(c.lines[0]).toMatchObject({ status: 'other-currency' })
    expect(c.lines[0]!.message).toMatch(/in EUR, the studio costs in GBP; enter a GBP price/)
  })
  it('costs a range at its upper end by default, or as asked', () => {
    const i = [ing('eggs', 2, null, 'p-eggs', false, 3)]
    expect(costRecipe(i, prices, { currency: 'GBP', servings: 1 }).totalMinor).toBe(95) // 3/6 × 189 = 94.5 → 95 (half away from zero)
    expect(costRecipe(i, prices, { currency: 'GBP', servings: 1, rangeAt: 'min' }).totalMinor).toBe(63)
    expect(costRecipe(i, prices, { currency: 'GBP', servings: 1, rangeAt: 'mid' }).totalMinor).toBe(79) // 2.5/6 × 189 = 78.75
  })
  it('flags a recipe over its budget per serving, with and without optional ingredients', () => {
    const i = [ing('butter', 100, 'g', 'p-butter'), ing('parsley', 1, 'bunch', 'p-parsley', true)]
    const c = costRecipe(i, prices, { currency: 'GBP', servings: 2, budgetPerServingMinor: 50 })
    expect([c.perServingMinor, c.perServingWithOptionalMinor]).toEqual([42, 77])
    expect(c.budget).toEqual({ perServingMinor: 50, over: false, overWithOptional: true })
    expect(costRecipe(i, prices, { currency: 'GBP', servings: 2 }).budget).toBeNull()
  })
  it('refuses bad servings, fractional minor units and an unknown currency', () => {
    expect(() => costRecipe([], prices, { currency: 'GBP', servings: 0 })).toThrow(/above zero/)
    expect(() => costRecipe([], [price('p', 'x', 1, 'g', 1.5)], { currency: 'GBP', servings: 1 })).toThrow(/whole number of minor units/)
    expect(() => costRecipe([], prices, { currency: 'XXQ', servings: 1 })).toThrow(/ISO 4217/)
  })
  it('per-serving cost does not depend on the servings costed for (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1000 }), fc.integer({ min: 1, max: 24 }), fc.integer({ min: 1, max: 24 }), (grams, servings, forServings) => {
        const a = costRecipe([ing('butter', grams, 'g', 'p-butter')], prices, { currency: 'GBP', servings })
        const b = costRecipe([ing('butter', grams, 'g', 'p-butter')], prices, { currency: 'GBP', servings, forServings })
        expect(b.perServingMinor).toBe(a.perServingMinor)
        expect(Math.abs(b.totalMinor - ((grams / 250) * 210 * forServings) / servings)).toBeLessThanOrEqual(0.5 + 1e-9)
      }),
    )
  })
})

describe('money', () => {
  it('takes minor-unit digits from the ISO 4217 table: GBP 2, EUR 2, JPY 0, KWD 3', () => {
    expect(currencyMinorDigits('GBP')).toBe(2)
    expect(currencyMinorDigits('EUR')).toBe(2)
    expect(currencyMinorDigits('JPY')).toBe(0)
    expect(currencyMinorDigits('KWD')).toBe(3)
    expect(isCurrencyCode('USD')).toBe(true)
    expect(isCurrencyCode('usd')).toBe(false)
    expect(isCurrencyCode('XYZ')).toBe(false)
  })
  it('formats money in the studio locale with Intl.NumberFormat', () => {
    expect(formatMoney(123450, 'GBP', 'en-GB')).toBe('£1,234.50')
    expect(formatMoney(123450, 'EUR', 'de-DE')).toBe('1.234,50\u00a0€')
    expect(formatMoney(1234, 'JPY', 'en-US')).toBe('¥1,234')
    expect(formatMoney(47, 'EUR', 'fr-FR')).toBe('0,47\u00a0€')
    expect(formatMoney(1250, 'KWD', 'en')).toBe('KWD\u00a01.250')
  })
  it('turns minor units into decimals for the API', () => {
    expect(minorToDecimal(249, 'GBP')).toBe(2.49)
    expect(minorToDecimal(250, 'JPY')).toBe(250)
    expect(minorToDecimal(1250, 'KWD')).toBe(1.25)
    expect(() => minorToDecimal(2.5, 'GBP')).toThrow(/whole number/)
  })
  it('reads prices exactly, with a point or a comma, and refuses what does not fit the currency', () => {
    expect(parseMoneyToMinor('2.49', 'GBP')).toBe(249)
    expect(parseMoneyToMinor('2,49', 'EUR')).toBe(249)
    expect(parseMoneyToMinor('1,234.50', 'GBP')).toBe(123450)
    expect(parseMoneyToMinor('1.234,50', 'EUR')).toBe(123450)
    expect(parseMoneyToMinor('1,234', 'GBP')).toBe(123400)
    expect(parseMoneyToMinor('3', 'GBP')).toBe(300)
    expect(parseMoneyToMinor('0.1', 'GBP')).toBe(10)
    expect(parseMoneyToMinor('250', 'JPY')).toBe(250)
    expect(parseMoneyToMinor('1.250', 'KWD')).toBe(1250)
    expect(() => parseMoneyToMinor('250.5', 'JPY')).toThrow(/JPY has no decimal places/)
    expect(parseMoneyToMinor('2.499', 'GBP')).toBe(249900) // three digits after one separator group thousands (2.499 = 2499)
    expect(() => parseMoneyToMinor('2.4999', 'GBP')).toThrow(/GBP has 2 decimal places/)
    expect(() => parseMoneyToMinor('£2.49', 'GBP')).toThrow(/write it like 2\.49/)
    expect(() => parseMoneyToMinor('-1', 'GBP')).toThrow(/negative/)
    expect(() => parseMoneyToMinor('2.4.9', 'GBP')).toThrow(/do not group thousands/)
  })
  it('minor → decimal text → minor is exact (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e12 }), fc.constantFrom('GBP', 'JPY', 'KWD', 'EUR'), (minor, currency) => {
        const d = currencyMinorDigits(currency)
        const text = d ? `${Math.floor(minor / 10 ** d)}.${String(minor % 10 ** d).padStart(d, '0')}` : String(minor)
        expect(parseMoneyToMinor(text, currency)).toBe(minor)
      }),
    )
  })
  it('rounds half away from zero, ignoring float noise', () => {
    expect(roundMinor(2.5)).toBe(3)
    expect(roundMinor(0.1 * 3 * 10 + 4.5 - 3)).toBe(5) // 4.5 after noise
    expect(roundMinor(-2.5)).toBe(-3)
  })
})
