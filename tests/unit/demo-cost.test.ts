// The demo studio's dishes (server/db/demo-recipes.ts) cost completely: every ingredient line has a
// price the cost code can use, so the demo shows a whole cost per serving, not a lower bound.
// The lines are read with the app's own parser and costed with shared/utils/cost.ts, as the seed
// and the cost route do (tests/server/demo.test.ts checks the same through the built app).
// Formula: DESIGN.md, Σ (amount used ÷ package size × package price) ÷ servings, rounded once.
// Salt's density: USDA SR Legacy NDB 02047, "Salt, table", 1 tsp = 6 g (shared/data/densities.ts).
import { describe, expect, it } from 'vitest'
import { costRecipe, type StudioPrice } from '../../shared/utils/cost'
import { parseQuantity } from '../../shared/utils/quantity'
import { statedDensities } from '../../shared/utils/stated-density'
import type { UnitId } from '../../shared/utils/units'
import { demoPrices, demoRecipes } from '../../server/db/demo-recipes'
import { demoStudio } from '../../server/db/demo'

const prices: StudioPrice[] = demoPrices.map(([item, packageSize, packageUnit, priceMinor, shop]) => ({
  id: item, item, packageSize, packageUnit: packageUnit as UnitId | 'each', priceMinor, currency: demoStudio.currency, shop,
}))

function costDemo(title: string) {
  const recipe = demoRecipes.find((r) => r.title === title)!
  const ingredients = recipe.lines.map(([line, priceId]) => ({ ...parseQuantity(line), key: line, priceId }))
  return costRecipe(ingredients, prices, { currency: demoStudio.currency, servings: recipe.servings, densities: statedDensities(ingredients) })
}

describe('the demo recipes', () => {
  it.each(demoRecipes.map((r) => r.title))('"%s" has a price on every line and a complete cost per serving', (title) => {
    const cost = costDemo(title)
    expect(cost.lines.filter((l) => l.status !== 'priced')).toEqual([])
    expect(cost.missing).toEqual([])
    expect(cost.problems).toEqual([])
    expect(cost.unmeasured).toEqual([])
    expect(cost.complete).toBe(true)
    expect(cost.perServingMinor).toBeGreaterThan(0)
  })

  it('every price a demo line names is in the demo price list', () => {
    const items = new Set(demoPrices.map(([item]) => item))
    for (const r of demoRecipes) for (const [line, price] of r.lines) expect(items.has(price), `${r.title}: ${line}`).toBe(true)
  })

  it('costs the pan flatbreads as worked by hand', () => {
    // 250 g self-raising flour of a 1.5 kg bag at 110p:  250 ÷ 1500 × 110 = 18.3333p
    // 350 g plain yoghurt of a 500 g pot at 135p:        350 ÷ 500 × 135  = 94.5p
    // 1 bunch mint at 75p:                               1 ÷ 1 × 75       = 75p
    // ¼ tsp salt = 1.5 g (1 tsp = 6 g, NDB 02047), of a 500 g box at 65p: 1.5 ÷ 500 × 65 = 0.195p
    // Total 188.0283p → 188p; for 4 servings 188.0283 ÷ 4 = 47.0071p → 47p a serving.
    const cost = costDemo('Pan flatbreads with mint yoghurt')
    expect(cost.lines.map((l) => l.costExact)).toEqual([
      expect.closeTo(250 / 1500 * 110, 9), expect.closeTo(94.5, 9), expect.closeTo(75, 9), expect.closeTo(0.195, 9),
    ])
    expect(cost.totalMinor).toBe(188)
    expect(cost.perServingMinor).toBe(47)
  })
})
