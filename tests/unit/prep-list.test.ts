// The prep list (shared/utils/prep-list.ts): ordered by the planned start of the first step that uses
// each ingredient, from a small hand-made plan (seconds from the start of the cook, written by hand
// below); day-before rules and cautions are the module's common-practice table.
import { describe, expect, it } from 'vitest'
import { buildPrepList, type PrepIngredient, type PrepRecipe } from '../../shared/utils/prep-list'

const ing = (key: string, item: string, prep: string | null, allergens: PrepIngredient['allergens'] = { eu: [], us: [] }): PrepIngredient =>
  ({ key, item, prep, allergens })

const stew: PrepRecipe = {
  recipeId: 1, title: 'Stew',
  ingredients: [
    ing('olive-oil', 'olive oil', null), ing('onion', 'onion', 'finely chopped'), ing('garlic', 'garlic', 'sliced'),
    ing('beans', 'butter beans', 'drained'), ing('parsley', 'parsley', 'chopped'),
  ],
  steps: [
    { id: 11, position: 1, text: 'Chop {{onion|item}} finely.' },
    { id: 12, position: 2, text: 'Warm {{olive-oil|item}} in a wide pan and soften the onion.' },
    { id: 13, position: 3, text: 'Stir in the garlic for a minute.' },
    { id: 14, position: 4, text: 'Add the beans and simmer.' },
    { id: 15, position: 5, text: 'Scatter the parsley.' },
  ],
}
const roast: PrepRecipe = {
  recipeId: 2, title: 'Roast',
  ingredients: [ing('squash', 'butternut squash', 'peeled and cut into chunks'), ing('prawns', 'prawns', 'thawed', { eu: ['crustaceans'], us: ['crustacean-shellfish'] })],
  steps: [
    { id: 21, position: 1, text: 'Roast {{squash|item}} until soft.' },
    { id: 22, position: 2, text: 'Fry the prawns.' },
  ],
}
// The hand-made plan: stew steps at 0, 300, 900, 960, 2400 s; roast at 120 and 1500 s.
const starts = new Map([[11, 0], [12, 300], [13, 900], [14, 960], [15, 2400], [21, 120], [22, 1500]])

describe('buildPrepList', () => {
  const list = buildPrepList([stew, roast], starts)

  it('orders prep by the planned start of the first step that uses it', () => {
    // onion 0 s (step 1), squash 120 s, garlic 900 s, butter beans 960 s ("the beans"), prawns 1500 s, parsley 2400 s
    expect(list.map((t) => [t.item, t.neededAt])).toEqual([
      ['onion', 0], ['butternut squash', 120], ['garlic', 900], ['butter beans', 960], ['prawns', 1500], ['parsley', 2400],
    ])
  })

  it('names one bowl or tray per step that uses it', () => {
    expect(list.find((t) => t.key === 'onion')!.containers).toEqual(['bowl for step 1: Chop onion finely.', 'bowl for step 2: Warm olive oil in a wide pan and soften…'])
    expect(list.find((t) => t.key === 'squash')!.containers).toEqual(['tray for step 1: Roast squash until soft.'])
  })

  it('says what can be done the day before, and why', () => {
    const when = Object.fromEntries(list.map((t) => [t.key, t.when]))
    expect(when).toEqual({ onion: 'on-the-day', squash: 'either', garlic: 'on-the-day', prawns: 'day-before', parsley: 'on-the-day', beans: 'on-the-day' })
    expect(list.find((t) => t.key === 'prawns')!.whenWhy).toMatch(/thaw in the fridge overnight/)
  })

  it('gives the cautions of the prep: knives, raw fish, allergens', () => {
    const prawns = list.find((t) => t.key === 'prawns')!
    expect(prawns.cautions).toEqual([
      'Raw meat or fish: its own board and knife, kept chilled, hands washed after; follow local food-safety rules.',
      'Allergens: Crustaceans, Crustacean shellfish. Keep it apart and label the bowl.',
    ])
    expect(list.find((t) => t.key === 'onion')!.cautions[0]).toMatch(/^Knife:/)
    expect(list.find((t) => t.key === 'beans')!.cautions).toEqual([])
  })

  it('leaves a prep no step names without a time, after the timed ones', () => {
    const lone = buildPrepList([{ ...stew, ingredients: [...stew.ingredients, ing('lime', 'lime', 'zested')] }], starts)
    expect(lone.at(-1)).toMatchObject({ key: 'lime', neededAt: null, firstStep: null, containers: [], when: 'on-the-day' })
  })

  it('keeps recipe order without a plan', () => {
    expect(buildPrepList([stew, roast]).map((t) => t.key)).toEqual(['onion', 'garlic', 'beans', 'parsley', 'squash', 'prawns'])
  })
})
