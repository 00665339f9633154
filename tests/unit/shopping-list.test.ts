// The shopping list (shared/utils/shopping-list.ts) and shop sections (shared/utils/shop-sections.ts).
// Unit factors: NIST Handbook 44 Appendix C / NIST SP 811 (1 tbsp = 14.78676478125 mL exactly,
// 1 cup = 236.5882365 mL, 1 kg = 1000 g), as units.ts. Densities: the recipe's own stated measure,
// else USDA SR Legacy (NDB 20081 all-purpose flour, 1 cup = 125 g), as density.ts. Package counts
// and money are worked by hand beside each check; the section table is common practice (shop-sections.ts).
import { describe, expect, it } from 'vitest'
import type { StudioPrice } from '../../shared/utils/cost'
import { buildShoppingList, itemKey, lineKey, type ShoppingIngredient, type ShoppingRecipe } from '../../shared/utils/shopping-list'
import { shopSection } from '../../shared/utils/shop-sections'

let n = 0
const ing = (min: number | null, unit: string | null, item: string, more: Partial<ShoppingIngredient> = {}): ShoppingIngredient =>
  ({ key: `i${++n}`, item, min, max: min, unit, optional: false, toTaste: false, priceId: null, ...more })
const recipe = (recipeId: number, title: string, ingredients: ShoppingIngredient[], servings = 4): ShoppingRecipe =>
  ({ recipeId, title, servings, ingredients })
const price = (id: string, item: string, packageSize: number, packageUnit: StudioPrice['packageUnit'], priceMinor: number, currency = 'GBP'): StudioPrice =>
  ({ id, item, packageSize, packageUnit, priceMinor, currency, shop: 'Marrow Lane Grocer' })
const list = (recipes: ShoppingRecipe[], prices: StudioPrice[] = [], servings: number | null = null) => buildShoppingList(recipes, { servings, prices, currency: 'GBP' })
const line = (l: ReturnType<typeof list>, item: string) => l.lines.find((x) => x.key === lineKey(item))!

describe('merging by item', () => {
  it('folds case and plurals but keeps different items apart', () => {
    expect(itemKey('Onions')).toBe('onion')
    expect(itemKey('chopped Tomatoes')).toBe('chopped tomato')
    expect(itemKey('berries')).toBe('berry')
    expect(itemKey('asparagus')).toBe('asparagus')
    const l = list([recipe(1, 'Stew', [ing(1, null, 'onion'), ing(400, 'g', 'chopped tomatoes')]), recipe(2, 'Salad', [ing(2, null, 'Onions'), ing(3, null, 'tomatoes')])])
    expect(l.lines.map((x) => x.key).sort()).toEqual(['chopped-tomato', 'onion', 'tomato'])
    expect(line(l, 'onion').text).toBe('3') // 1 + 2 onions
    expect(line(l, 'onion').uses.map((u) => u.recipeTitle)).toEqual(['Stew', 'Salad'])
  })

  it('adds the same unit in that unit and mixed units of a kind in g or mL (NIST exact factors)', () => {
    const l = list([
      recipe(1, 'A', [ing(2, 'tbsp', 'olive oil'), ing(500, 'g', 'rice'), ing(1, 'cup', 'milk')]),
      recipe(2, 'B', [ing(3, 'tbsp', 'olive oil'), ing(1, 'kg', 'rice'), ing(100, 'ml', 'milk')]),
    ])
    expect(line(l, 'olive oil').text).toBe('5 tbsp') // 2 + 3 tbsp
    expect(line(l, 'rice').amounts).toEqual([expect.objectContaining({ max: 1500, unit: 'g', text: '1.5 kg' })]) // 500 g + 1000 g
    // 1 cup = 236.5882365 mL (NIST HB 44) + 100 mL = 336.5882365 mL, shown to 3 figures
    expect(line(l, 'milk').amounts[0]!.max).toBeCloseTo(336.5882365, 9)
    expect(line(l, 'milk').text).toBe('337 mL')
  })

  it('adds grams to cups only through a density and names it: USDA SR Legacy NDB 20081, 1 cup flour = 125 g', () => {
    const l = list([recipe(1, 'Bread', [ing(200, 'g', 'plain flour')]), recipe(2, 'Cake', [ing(1, 'cup', 'plain flour')])])
    const flour = line(l, 'plain flour')
    expect(flour.amounts).toHaveLength(1)
    expect(flour.amounts[0]!.max).toBeCloseTo(325, 9) // 200 g + 125 g
    expect(flour.notes[0]).toMatch(/^1 cup counted as 125 g \(density: USDA SR Legacy NDB 20081/)
  })

  it("prefers the recipe's own stated measure: 1 tsp (2 g) smoked paprika + 10 g = 12 g", () => {
    const l = list([recipe(1, 'Stew', [ing(1, 'tsp', 'smoked paprika', { stated: { min: 2, max: 2, unit: 'g' } })]), recipe(2, 'Rub', [ing(10, 'g', 'smoked paprika')])])
    expect(line(l, 'smoked paprika').amounts[0]!.max).toBeCloseTo(12, 9)
    expect(line(l, 'smoked paprika').notes[0]).toBe("1 tsp counted as 2 g (density: Stew's own measure: 1 tsp = 2 g)")
  })

  it('refuses to add grams to cups without a density and says so: two amounts', () => {
    const l = list([recipe(1, 'A', [ing(200, 'g', 'couscous')]), recipe(2, 'B', [ing(1, 'cup', 'couscous')])])
    const c = line(l, 'couscous')
    expect(c.amounts.map((a) => a.text)).toEqual(['200 g', '1 cup'])
    expect(c.text).toBe('200 g + 1 cup')
    expect(c.notes).toEqual(['not added: 200 g and 1 cup need a density; none is known for couscous'])
  })

  it('keeps different counted units apart', () => {
    const l = list([recipe(1, 'A', [ing(3, 'clove', 'garlic')]), recipe(2, 'B', [ing(1, 'head', 'garlic')])])
    expect(line(l, 'garlic').amounts.map((a) => a.text)).toEqual(['3 cloves', '1 head'])
    expect(line(l, 'garlic').notes[0]).toMatch(/^not added: 3 cloves and 1 head are counted in different units/)
  })

  it('scales to the servings on set, ranges at their upper end', () => {
    const l = list([recipe(1, 'A', [ing(1, null, 'lemon', { max: 2 })], 2)], [], 4)
    expect(line(l, 'lemon').amounts[0]).toMatchObject({ min: 2, max: 4, text: '2–4' }) // × 4/2
  })

  it('marks optional lines, to-taste lines without amount', () => {
    const l = list([
      recipe(1, 'A', [ing(1, 'bunch', 'parsley', { optional: true }), ing(null, null, 'salt', { toTaste: true }), ing(1, null, 'lime', { optional: true })]),
      recipe(2, 'B', [ing(1, null, 'lime')]),
    ])
    expect(line(l, 'parsley').optional).toBe(true)
    expect(line(l, 'lime').optional).toBe(false) // required in B
    expect(line(l, 'salt')).toMatchObject({ toTaste: true, text: '', amounts: [] })
    expect(line(l, 'salt').uses[0]!.text).toBe('to taste')
  })
})

describe('packages and cost', () => {
  const prices = [
    price('tom', 'Chopped tomatoes', 400, 'g', 55),
    price('oil', 'Olive oil', 500, 'ml', 450),
    price('oni', 'Onions', 3, 'each', 60),
    price('par', 'Parsley', 1, 'bunch', 75),
  ]
  const recipes = [
    recipe(1, 'Stew', [ing(800, 'g', 'chopped tomatoes', { priceId: 'tom' }), ing(2, 'tbsp', 'olive oil', { priceId: 'oil' }), ing(1, null, 'onion', { priceId: 'oni' })]),
    recipe(2, 'Sauce', [
      ing(100, 'g', 'chopped tomatoes', { priceId: 'tom' }), ing(3, 'tbsp', 'olive oil', { priceId: 'oil' }), ing(3, null, 'onions', { priceId: 'oni' }),
      ing(1, 'bunch', 'parsley', { priceId: 'par', optional: true }),
    ]),
  ]
  const l = list(recipes, prices)

  it('rounds up to whole packages of the linked price', () => {
    // 800 + 100 = 900 g; ⌈900 / 400⌉ = 3 tins; 3 × 55 = 165p; used 900/400 × 55 = 123.75p; left 1200 − 900 = 300 g
    expect(line(l, 'chopped tomatoes')).toMatchObject({ packages: { count: 3, text: '3 × 400 g' }, basketMinor: 165, usedExact: 123.75, usedMinor: 124 })
    expect(line(l, 'chopped tomatoes').leftover!.text).toBe('300 g')
    // 5 tbsp = 73.93382390625 mL (NIST); 1 × 500 mL; used 73.93382390625/500 × 450 = 66.540441515625p; left 426.06617609375 mL
    const oil = line(l, 'olive oil')
    expect(oil).toMatchObject({ packages: { count: 1, text: '1 × 500 mL' }, basketMinor: 450, usedMinor: 67 })
    expect(oil.usedExact).toBeCloseTo(66.540441515625, 9)
    expect(oil.leftover!.text).toBe('426 mL')
    // 1 + 3 = 4 onions; ⌈4/3⌉ = 2 packs of 3; 120p; used 4/3 × 60 = 80p; 2 left
    expect(line(l, 'onion')).toMatchObject({ packages: { count: 2, text: '2 × pack of 3' }, basketMinor: 120, usedMinor: 80, leftover: { text: '2' } })
    expect(line(l, 'parsley').packages!.text).toBe('1 × 1 bunch')
  })

  it('costs the basket (whole packages) and what is used, with and without optional lines', () => {
    // basket: 165 + 450 + 120 + 75 = 810p; without parsley 735p
    // used: 123.75 + 66.540441515625 + 80 + 75 = 345.290441515625 → 345p; without parsley 270.29… → 270p
    expect(l.totals).toMatchObject({ basketMinor: 810, basketRequiredMinor: 735, usedMinor: 345, usedRequiredMinor: 270 })
    expect(l.totals.leftovers.map((x) => `${x.item}: ${x.text}`)).toEqual(['onion: 2', 'chopped tomatoes: 300 g', 'olive oil: 426 mL']) // produce, tins, dry goods
  })

  it('names what it cannot count: no price, a unit that does not convert, another currency', () => {
    const x = list([recipe(1, 'A', [ing(1, 'cup', 'couscous', { priceId: 'cc' }), ing(2, null, 'eggs'), ing(1, 'g', 'saffron', { priceId: 'sa' })])],
      [price('cc', 'Couscous', 500, 'g', 100), price('sa', 'Saffron', 1, 'g', 650, 'EUR')])
    expect(line(x, 'couscous').packageNote).toMatch(/^packages not counted: No density is known for "couscous"/)
    expect(line(x, 'egg').packageNote).toBe('no price is linked to it in the studio price list')
    expect(line(x, 'saffron').packageNote).toBe('its price is in EUR, the studio costs in GBP')
    expect(x.totals.basketMinor).toBe(0)
    expect(x.totals.notCosted.map((c) => c.key)).toEqual(['egg', 'couscous', 'saffron']) // dairy and eggs, dry goods, other
  })
})

describe('shop sections (common practice keyword table)', () => {
  it.each([
    ['butter bean', 'can', 'tins-jars'], ['butter bean', null, 'tins-jars'], ['butter', null, 'dairy-eggs'], ['plain yoghurt', null, 'dairy-eggs'],
    ['smoked paprika', null, 'spices'], ['black pepper', null, 'spices'], ['red pepper', null, 'produce'], ['onion', null, 'produce'],
    ['chicken thigh', null, 'meat-fish'], ['frozen pea', null, 'frozen'], ['sourdough loaf', null, 'bakery'], ['green lentil', null, 'dry-goods'],
    ['olive oil', null, 'dry-goods'], ['saffron', null, 'other'], ['chopped tomato', null, 'tins-jars'], ['tomato', null, 'produce'],
  ] as const)('%s (%s) → %s', (name, unit, section) => {
    expect(shopSection(name, unit)).toBe(section)
  })

  it('groups the list by section in shop order', () => {
    const l = list([recipe(1, 'A', [ing(1, null, 'onion'), ing(200, 'g', 'yoghurt'), ing(1, 'can', 'butter beans'), ing(1, 'tsp', 'salt')])])
    expect(l.sections.map((s) => [s.id, s.keys])).toEqual([['produce', ['onion']], ['dairy-eggs', ['yoghurt']], ['tins-jars', ['butter-bean']], ['spices', ['salt']]])
  })
})
