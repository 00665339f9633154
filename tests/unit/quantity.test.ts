// Ingredient lines (shared/utils/quantity.ts, shared/utils/amount-text.ts). How recipes write
// amounts is common practice of English-language recipes; where an amount is converted (compound
// amounts) the check uses the NIST Handbook 44 Appendix C definitions (16 tbsp = 1 cup, 16 oz = 1 lb).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { formatIngredientLine, formatQuantityText, parseQuantity } from '../../shared/utils/quantity'
import { formatAmountExact, normaliseAmountText, readAmountAt } from '../../shared/utils/amount-text'
import { UNIT_IDS, type UnitId } from '../../shared/utils/units'

const amountOf = (line: string) => {
  const p = parseQuantity(line)
  return [p.min, p.max, p.unit]
}

describe('numbers (common practice)', () => {
  it('reads whole numbers and decimals with a point or a comma', () => {
    expect(amountOf('2 onions')).toEqual([2, 2, null])
    expect(amountOf('1.5 kg potatoes')).toEqual([1.5, 1.5, 'kg'])
    expect(amountOf('1,5 kg potatoes')).toEqual([1.5, 1.5, 'kg'])
    expect(amountOf('0,25 l milk')).toEqual([0.25, 0.25, 'l'])
    expect(amountOf('.5 tsp salt')).toEqual([0.5, 0.5, 'tsp'])
  })
  it('reads a comma before three digits as a thousands separator, except after 0', () => {
    expect(amountOf('1,000 g flour')).toEqual([1000, 1000, 'g'])
    expect(amountOf('0,250 kg butter')).toEqual([0.25, 0.25, 'kg'])
  })
  it('reads fractions: 1/2, ½, 1 1/2, 1½, 1-1/2, and the fraction slash', () => {
    expect(amountOf('1/2 cup milk')).toEqual([0.5, 0.5, 'cup'])
    expect(amountOf('½ cup milk')).toEqual([0.5, 0.5, 'cup'])
    expect(amountOf('1 1/2 cups milk')).toEqual([1.5, 1.5, 'cup'])
    expect(amountOf('1½ cups milk')).toEqual([1.5, 1.5, 'cup'])
    expect(amountOf('1-1/2 cups rice')).toEqual([1.5, 1.5, 'cup'])
    expect(amountOf('1⁄3 cup oil')[0]).toBeCloseTo(1 / 3, 15)
    expect(amountOf('2 ¾ cups stock')).toEqual([2.75, 2.75, 'cup'])
  })
  it('reads words: a, an, one, half, a quarter, two thirds, one and a half, a dozen', () => {
    expect(amountOf('a pinch of salt')).toEqual([1, 1, 'pinch'])
    expect(amountOf('an onion')).toEqual([1, 1, null])
    expect(amountOf('one lemon')).toEqual([1, 1, null])
    expect(amountOf('half a lemon')).toEqual([0.5, 0.5, null])
    expect(amountOf('a quarter cup cream')).toEqual([0.25, 0.25, 'cup'])
    expect(amountOf('a half cup cream')).toEqual([0.5, 0.5, 'cup'])
    expect(amountOf('two thirds cup oil')[0]).toBeCloseTo(2 / 3, 15)
    expect(amountOf('one and a half cups milk')).toEqual([1.5, 1.5, 'cup'])
    expect(amountOf('2 and a half cups milk')).toEqual([2.5, 2.5, 'cup'])
    expect(amountOf('a dozen eggs')).toEqual([12, 12, null])
    // half of a dozen is six, not half of an item called "dozen eggs"
    expect(parseQuantity('half a dozen eggs')).toMatchObject({ min: 6, max: 6, unit: null, item: 'eggs' })
    expect(amountOf('1 and 1/2 teaspoons salt')).toEqual([1.5, 1.5, 'tsp'])
    expect(amountOf('1 and ½ cups milk')).toEqual([1.5, 1.5, 'cup'])
    expect(amountOf('one and 3/4 cups stock')).toEqual([1.75, 1.75, 'cup'])
  })
  it('reads "a few", "a little", "a splash" as no amount, keeping the words', () => {
    expect(parseQuantity('a few sprigs of thyme')).toMatchObject({ min: null, item: 'a few sprigs of thyme' })
    expect(parseQuantity('a splash of milk')).toMatchObject({ min: null, item: 'a splash of milk' })
    expect(parseQuantity('a large onion')).toMatchObject({ min: 1, item: 'large onion' })
  })
  it('never reads a number out of a word (one in onions, a in apples)', () => {
    expect(parseQuantity('onions').min).toBeNull()
    expect(parseQuantity('apples').item).toBe('apples')
    expect(parseQuantity('halloumi, sliced').min).toBeNull()
  })
  it('reads ranges: 5-6, 5–6, 5 to 6, 1 or 2, ¼–½', () => {
    expect(amountOf('5-6 cloves garlic')).toEqual([5, 6, 'clove'])
    expect(amountOf('5–6 tbsp oil')).toEqual([5, 6, 'tbsp'])
    expect(amountOf('5 to 6 cups stock')).toEqual([5, 6, 'cup'])
    expect(amountOf('1 or 2 chillies')).toEqual([1, 2, null])
    expect(amountOf('¼–½ tsp chilli flakes')).toEqual([0.25, 0.5, 'tsp'])
    expect(amountOf('2 tomatoes')).toEqual([2, 2, null]) // "to" inside a word is not a range
  })
  it('reads a range that runs downwards the right way round, and says so', () => {
    const p = parseQuantity('6-5 eggs')
    expect([p.min, p.max]).toEqual([5, 6])
    expect(p.warnings[0]).toMatch(/runs downwards/)
  })
})

describe('compound amounts, added in the first unit (NIST Handbook 44 Appendix C: 16 tbsp = 1 cup, 16 oz = 1 lb)', () => {
  it('2 1/2 cups plus 2 tablespoons = 2.625 cups', () => {
    const p = parseQuantity('2 1/2 cups plus 2 tablespoons flour')
    expect([p.min, p.max, p.unit, p.item]).toEqual([2.625, 2.625, 'cup', 'flour'])
    expect(p.parts).toEqual([{ amount: 2.5, unit: 'cup' }, { amount: 2, unit: 'tbsp' }])
  })
  it('1 lb 4 oz = 1.25 lb; 2 tbsp + 1 tsp = 2⅓ tbsp', () => {
    expect(amountOf('1 lb 4 oz beef mince')).toEqual([1.25, 1.25, 'lb'])
    expect(parseQuantity('2 tbsp + 1 tsp olive oil').min).toBeCloseTo(7 / 3, 14)
  })
  it('keeps a second amount of another kind in the prep note, with a warning', () => {
    const p = parseQuantity('1 cup plus 10 g butter')
    expect([p.min, p.unit, p.item, p.prep]).toEqual([1, 'cup', 'butter', 'plus 10 g'])
    expect(p.warnings[0]).toMatch(/adds mass to volume/)
  })
})

describe('units: metric and US names, plurals and abbreviations (common practice)', () => {
  const cases: Array<[string, UnitId]> = [
    ['1 teaspoon', 'tsp'], ['2 tsps', 'tsp'], ['1 t', 'tsp'], ['1 T', 'tbsp'], ['2 Tbsp.', 'tbsp'], ['3 tablespoons', 'tbsp'],
    ['1 c.', 'cup'], ['2 cups', 'cup'], ['4 fl oz', 'floz'], ['4 fl. oz', 'floz'], ['2 fluid ounces', 'floz'], ['1 pt', 'pint'],
    ['2 quarts', 'quart'], ['1 gal', 'gallon'], ['250 ml', 'ml'], ['250 mL', 'ml'], ['25 cl', 'cl'], ['2 dl', 'dl'], ['1 litre', 'l'],
    ['1.5 liters', 'l'], ['1 L', 'l'], ['2 metric cups', 'metric-cup'], ['1 imperial pint', 'imp-pint'], ['1 UK pint', 'imp-pint'],
    ['500 g', 'g'], ['500g', 'g'], ['500 grams', 'g'], ['1 kg', 'kg'], ['1.5kg', 'kg'], ['2 kilos', 'kg'], ['200 mg', 'mg'],
    ['8 oz', 'oz'], ['8 ounces', 'oz'], ['2 lbs', 'lb'], ['1 pound', 'lb'], ['3 cloves', 'clove'], ['2 tins', 'can'],
    ['1 bunch', 'bunch'], ['2 pinches', 'pinch'], ['4 sprigs', 'sprig'],
  ]
  for (const [line, id] of cases) {
    it(`"${line} x" → ${id}`, () => expect(parseQuantity(`${line} x`).unit).toBe(id))
  }
  it('does not read a unit out of a word ("2 large eggs", "2 carrots", "1 T-bone steak")', () => {
    expect(amountOf('2 large eggs')).toEqual([2, 2, null])
    expect(amountOf('2 carrots')).toEqual([2, 2, null])
    expect(parseQuantity('1 T-bone steak')).toMatchObject({ unit: null, item: 'T-bone steak' })
  })
  it('follows the studio: bare cups as metric cups, bare pints as imperial pints', () => {
    expect(parseQuantity('1 cup rice', { cups: 'metric' }).unit).toBe('metric-cup')
    expect(parseQuantity('1 pint milk', { fluid: 'imperial' }).unit).toBe('imp-pint')
    expect(parseQuantity('10 fl oz milk', { fluid: 'imperial' }).unit).toBe('imp-floz')
    expect(parseQuantity('1 US pint milk', { fluid: 'imperial' }).unit).toBe('pint')
  })
})

describe('item, prep note, optional, to taste', () => {
  it('"2 onions, thinly sliced" → item onions, prep thinly sliced', () => {
    expect(parseQuantity('2 onions, thinly sliced')).toMatchObject({ min: 2, unit: null, item: 'onions', prep: 'thinly sliced', optional: false })
  })
  it('keeps a parenthesis with the item and splits at the first comma outside it', () => {
    expect(parseQuantity('1 (400 g) can chopped tomatoes')).toMatchObject({ min: 1, unit: 'can', item: 'chopped tomatoes (400 g)' })
    // a measure in the parenthesis after the unit is the author's own equivalent, kept as `stated`
    expect(parseQuantity('1 cup (250 ml) milk')).toMatchObject({ unit: 'cup', item: 'milk', stated: { min: 250, max: 250, unit: 'ml' } })
    expect(parseQuantity('1 cup (room temperature) milk')).toMatchObject({ unit: 'cup', item: 'milk (room temperature)', stated: null })
    expect(parseQuantity('2 peppers (red, yellow), diced')).toMatchObject({ item: 'peppers (red, yellow)', prep: 'diced' })
  })
  it('reads "of" after a unit, and a counted unit with no number as one', () => {
    expect(parseQuantity('2 cups of rice').item).toBe('rice')
    expect(parseQuantity('pinch of nutmeg')).toMatchObject({ min: 1, unit: 'pinch', item: 'nutmeg' })
  })
  it('sets the optional flag from "(optional)", ", optional" or "optional:"', () => {
    expect(parseQuantity('chopped parsley (optional)')).toMatchObject({ item: 'chopped parsley', optional: true, prep: null })
    expect(parseQuantity('1 tbsp capers, optional, to garnish')).toMatchObject({ item: 'capers', prep: 'to garnish', optional: true })
    expect(parseQuantity('optional: 1 tbsp capers')).toMatchObject({ min: 1, unit: 'tbsp', item: 'capers', optional: true })
  })
  it('"to taste" leaves no amount; with an amount it stays advice in the prep note', () => {
    expect(parseQuantity('salt, to taste')).toMatchObject({ min: null, max: null, unit: null, item: 'salt', toTaste: true })
    expect(parseQuantity('salt and pepper to taste')).toMatchObject({ item: 'salt and pepper', toTaste: true })
    expect(parseQuantity('1 tsp salt, or to taste')).toMatchObject({ min: 1, unit: 'tsp', item: 'salt', prep: 'or to taste', toTaste: false })
  })
  it('keeps size and approximation words in the prep note rather than losing them', () => {
    expect(parseQuantity('2 heaped tbsp cocoa')).toMatchObject({ min: 2, unit: 'tbsp', item: 'cocoa', prep: 'heaped' })
    expect(parseQuantity('about 2 cups stock')).toMatchObject({ min: 2, unit: 'cup', item: 'stock', prep: 'about' })
  })
  it('never drops what it cannot read: a line with no amount is all item', () => {
    expect(parseQuantity('Juice of 1 lemon')).toMatchObject({ min: null, item: 'Juice of 1 lemon' })
    expect(parseQuantity('2 cups').warnings[0]).toMatch(/names no ingredient/)
    expect(parseQuantity('').warnings.length).toBe(1)
  })
})

describe('writing amounts exactly', () => {
  it('uses vulgar fractions for halves, thirds, quarters and eighths, decimals otherwise', () => {
    expect(formatAmountExact(1.5)).toBe('1½')
    expect(formatAmountExact(2 / 3)).toBe('⅔')
    expect(formatAmountExact(2.375)).toBe('2⅜')
    expect(formatAmountExact(3)).toBe('3')
    expect(formatAmountExact(0.15)).toBe('0.15')
    expect(formatAmountExact(0.1 + 0.2)).toBe('0.3')
    expect(() => formatAmountExact(Number.NaN)).toThrow(/finite/)
  })
  it('writes amount and unit, with a range and plural', () => {
    expect(formatQuantityText(1, 2, 'cup')).toBe('1–2 cups')
    expect(formatQuantityText(0.5, 0.5, 'cup')).toBe('½ cup')
    expect(formatQuantityText(null, null, null)).toBe('')
    expect(formatIngredientLine({ min: null, max: null, unit: null, item: 'salt', toTaste: true })).toBe('salt, to taste')
    expect(formatIngredientLine({ min: 2, max: 2, unit: null, item: 'onions', prep: 'thinly sliced', optional: true })).toBe('2 onions, thinly sliced (optional)')
  })
  it('normalises text and reads one amount at a position', () => {
    expect(normaliseAmountText('1½–2  cups')).toBe('1 1/2 -2 cups')
    expect(readAmountAt('x 3/4 cup', 2)).toEqual({ value: 0.75, end: 5 })
    expect(readAmountAt('onions', 0)).toBeNull()
  })
})

describe('parse → format → parse (property)', () => {
  const items = ['onions', 'plain flour', 'olive oil', 'garlic', 'carrots', 'chopped tomatoes', 'butter', 'basmati rice', 'eggs', 'caster sugar', 'flat-leaf parsley', 'chicken thighs', 'lemon']
  const preps = [null, 'thinly sliced', 'finely chopped', 'at room temperature', 'beaten', 'peeled and diced']
  const nice = fc.oneof(
    fc.integer({ min: 1, max: 40 }),
    fc.integer({ min: 1, max: 80 }).map((n) => n / 8),
    fc.integer({ min: 1, max: 30 }).map((n) => n / 3),
    fc.integer({ min: 1, max: 999 }).map((n) => n / 100),
  )
  const ingredient = fc.record({
    amount: fc.option(fc.tuple(nice, fc.option(nice, { nil: null })), { nil: null }),
    unit: fc.option(fc.constantFrom(...UNIT_IDS), { nil: null }),
    item: fc.constantFrom(...items),
    prep: fc.constantFrom(...preps),
    optional: fc.boolean(),
    toTaste: fc.boolean(),
  }).map(({ amount, unit, item, prep, optional, toTaste }) => {
    if (!amount) return { min: null, max: null, unit: null, item, prep, optional, toTaste }
    const [a, b] = amount
    const [min, max] = b === null ? [a, a] : [Math.min(a, b), Math.max(a, b)]
    return { min, max, unit, item, prep, optional, toTaste: false }
  })
  it('reads back the same amount, unit, item, prep and flags', () => {
    fc.assert(
      fc.property(ingredient, (ing) => {
        const line = formatIngredientLine(ing)
        const p = parseQuantity(line)
        expect(p.unit, line).toBe(ing.unit)
        expect(p.item, line).toBe(ing.item)
        expect(p.prep, line).toBe(ing.prep)
        expect(p.optional, line).toBe(ing.optional)
        expect(p.toTaste, line).toBe(ing.toTaste)
        if (ing.min === null) expect(p.min).toBeNull()
        else {
          expect(p.min!, line).toBeCloseTo(ing.min, 9)
          expect(p.max!, line).toBeCloseTo(ing.max!, 9)
        }
        expect(formatIngredientLine(p), line).toBe(line)
      }),
      { numRuns: 500 },
    )
  })
})
