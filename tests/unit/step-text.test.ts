// Step text with amounts that follow the scale (shared/utils/step-text.ts, step-render.ts).
// Conversions by NIST Handbook 44 Appendix C (oz = 28.349523125 g, cup = 236.5882365 mL); rounding
// as in scale.ts (common practice).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { renderStepText } from '../../shared/utils/step-render'
import {
  INGREDIENT_KEY, findStepTokens, ingredientKeyWords, makeIngredientKey, plainStepText, stepTokenProblems,
} from '../../shared/utils/step-text'

const ingredients = [
  { key: 'butter', min: 100, max: 100, unit: 'g' as const, item: 'butter', toTaste: false },
  { key: 'milk', min: 1, max: 1, unit: 'cup' as const, item: 'whole milk', toTaste: false },
  { key: 'eggs', min: 2, max: 3, unit: null, item: 'eggs', toTaste: false },
  { key: 'salt', min: null, max: null, unit: null, item: 'salt', toTaste: true },
  { key: 'chives', min: null, max: null, unit: null, item: 'chives', toTaste: false },
]
const render = (text: string, toServings = 4, system: 'us' | 'metric' = 'metric') =>
  renderStepText(text, { ingredients, fromServings: 4, toServings, system })

describe('findStepTokens', () => {
  it('reads {{key}}, {{key|item}}, {{key*1/2}} and {{key*0.25|item}}, with spaces allowed', () => {
    const t = findStepTokens('Add {{butter}}, then {{ milk | item }}, {{butter*1/2}} and {{eggs*0.25|item}}.')
    expect(t.map((x) => [x.key, x.factor, x.withItem])).toEqual([['butter', 1, false], ['milk', 1, true], ['butter', 0.5, false], ['eggs', 0.25, true]])
    expect(t[0]).toMatchObject({ raw: '{{butter}}', start: 4, end: 14 })
  })
  it('leaves text that is not a token alone', () => {
    expect(findStepTokens('Use {{ two words }} or {single} or {{}}')).toEqual([])
  })
  it('reads keys of letters, digits, "-" and "_" in every form of token', () => {
    const t = findStepTokens('{{red-onion}} {{sea_salt|item}} {{Egg_2-yolk*1/3}} {{ stock_1 * 0.5 | item }}')
    expect(t.map((x) => [x.key, x.factor, x.withItem])).toEqual([
      ['red-onion', 1, false], ['sea_salt', 1, true], ['Egg_2-yolk', 1 / 3, false], ['stock_1', 0.5, true],
    ])
  })
  it('reads no token with another character in the key, a share without a number or another word after |', () => {
    expect(findStepTokens('{{sea salt}} {{onion.red}} {{crème}} {{milk*}} {{milk*x}} {{milk|name}} {{milk|item|item}}')).toEqual([])
  })
  it('reads a share as a decimal or a fraction, spaces allowed around the slash', () => {
    expect(findStepTokens('{{milk*2}} {{milk*0.75}} {{milk*3 / 4}} {{milk*1.5/3}}').map((x) => x.factor)).toEqual([2, 0.75, 0.75, 0.5])
  })
})

describe('INGREDIENT_KEY', () => {
  it('accepts what the token grammar reads, 1 to 40 characters', () => {
    for (const key of ['milk', 'red-onion', 'sea_salt', 'Egg_2', 'a'.repeat(40)]) {
      expect(INGREDIENT_KEY.test(key)).toBe(true)
      expect(findStepTokens(`{{${key}}}`)[0]!.key).toBe(key)
    }
    for (const key of ['', 'a'.repeat(41), 'sea salt', 'crème', 'a.b', 'a|b']) expect(INGREDIENT_KEY.test(key)).toBe(false)
  })
})

describe('plainStepText', () => {
  it('reads each token as its key\'s words, "-" and "_" as spaces, and collapses spaces', () => {
    expect(plainStepText('Sweat {{onion|item}} in {{butter*1/2}}  gently.')).toBe('Sweat onion in butter gently.')
    expect(plainStepText('Add {{red-onion}} and {{sea_salt | item}}')).toBe('Add red onion and sea salt')
    expect(ingredientKeyWords('double__cream-2')).toBe('double cream 2')
  })
  it('leaves text that is not a token as written, as the prompter shows it', () => {
    expect(plainStepText('Stir {{sea salt}} and {{milk*x}} in')).toBe('Stir {{sea salt}} and {{milk*x}} in')
  })
})

describe('renderStepText', () => {
  it('renders the amount at the recipe\'s own servings', () => {
    expect(render('Melt {{butter}} in a pan.').text).toBe('Melt 100 g in a pan.')
  })
  it('follows the scale: 4 → 6 servings is ×1.5 (100 g → 150 g; 1 cup → 355 mL → 350 mL)', () => {
    expect(render('Melt {{butter}}, then whisk in {{milk|item}}.', 6).text).toBe('Melt 150 g, then whisk in 350 mL whole milk.')
  })
  it('renders a share: half of 150 g is 75 g; in US units 75 g = 2.65 oz → 2¾ oz', () => {
    expect(render('Add {{butter*1/2}} of the butter.', 6).text).toBe('Add 75 g of the butter.')
    expect(render('Add {{butter*1/2}} of the butter.', 6, 'us').text).toBe('Add 2¾ oz of the butter.')
  })
  it('renders ranges and counted items, and an ingredient with no amount as its item', () => {
    expect(render('Beat {{eggs|item}}.', 8).text).toBe('Beat 4–6 eggs.')
    expect(render('Season with {{salt}}.').text).toBe('Season with salt to taste.')
    expect(render('Scatter over {{chives|item}}.').text).toBe('Scatter over chives.')
  })
  it('marks the rendered amounts with their ingredient and exact value (for the hover)', () => {
    const r = render('Melt {{butter}} gently.', 6, 'us')
    expect(r.segments).toEqual([
      { text: 'Melt ' },
      { text: '5 oz', ingredientKey: 'butter', exactText: 'exactly 5.291 oz; converted from 150 g' }, // the hover names its source; 150 g / 28.349523125 = 5.2911 oz
      { text: ' gently.' },
    ])
  })
  it('leaves an unknown token as written and says what to fix', () => {
    const r = render('Fold in {{sugar}} and {{butter}}.')
    expect(r.text).toBe('Fold in {{sugar}} and 100 g.')
    expect(r.problems).toEqual([
      { token: '{{sugar}}', key: 'sugar', kind: 'missing', reason: 'No ingredient has the key "sugar"; use one of: butter, milk, eggs, salt, chives' },
    ])
  })
  it('reports a share of zero', () => {
    expect(stepTokenProblems('{{butter*0}}', ['butter'])[0]).toMatchObject({ key: 'butter', kind: 'share', reason: expect.stringMatching(/above zero/) })
    expect(render('Add {{butter*0}}.').text).toBe('Add {{butter*0}}.')
  })
  it('leaves text without tokens unchanged (property)', () => {
    fc.assert(
      fc.property(fc.string().filter((s) => !s.includes('{{')), (s) => {
        expect(render(s).text).toBe(s)
      }),
    )
  })
})

describe('makeIngredientKey', () => {
  it('makes a short slug from the item, unique among the keys taken', () => {
    expect(makeIngredientKey('Plain flour')).toBe('plain-flour')
    expect(makeIngredientKey('Crème fraîche (full-fat)')).toBe('creme-fraiche')
    expect(makeIngredientKey('onions', ['onions', 'onions-2'])).toBe('onions-3')
    expect(makeIngredientKey('!!!')).toBe('ingredient')
    expect(makeIngredientKey('extraordinarily long ingredient name here')).toBe('extraordinarily-long-ing')
  })
  it('always makes a key that the token syntax accepts (property)', () => {
    fc.assert(
      fc.property(fc.string(), (item) => {
        const key = makeIngredientKey(item)
        expect(findStepTokens(`{{${key}}}`)[0]!.key).toBe(key)
      }),
    )
  })
})
