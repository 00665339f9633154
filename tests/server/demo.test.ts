// The seeded demo studio through the built app: every demo recipe's cost per serving is complete (no
// line without a price, none "to taste" without an amount), and one is worked by hand.
// Formula: DESIGN.md, Σ (amount used ÷ package size × package price) ÷ servings, rounded once;
// salt's density USDA SR Legacy NDB 02047, 1 tsp = 6 g (shared/data/densities.ts).
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { demo, signedIn } from '../support/client'
import { demoRecipes } from '../../server/db/demo-recipes'

describe('the demo studio', async () => {
  await useBuiltApp()

  it('costs every demo recipe completely', async () => {
    const producer = await signedIn(demo.producer)
    const list = await producer.get('/api/studios/1/recipes')
    expect(list.status).toBe(200)
    const recipes: { id: number; title: string }[] = list.body.recipes
    expect(recipes.map((r) => r.title).sort()).toEqual(demoRecipes.map((r) => r.title).sort())
    for (const r of recipes) {
      const cost = await producer.get(`/api/recipes/${r.id}/cost`)
      expect(cost.status, r.title).toBe(200)
      expect(cost.body.lines.filter((l: { status: string }) => l.status !== 'priced'), r.title).toEqual([])
      expect([cost.body.missing, cost.body.problems, cost.body.unmeasured], r.title).toEqual([[], [], []])
      expect(cost.body.complete, r.title).toBe(true)
    }
  })

  it('costs the smoky butter bean stew as worked by hand', async () => {
    // 2 tbsp olive oil = 29.5735 ml (US tbsp 14.7868 ml, NIST HB 44 App. C) of 500 ml at 450p: 26.6162p
    // 1 onion of 3 at 60p: 20p;  3 cloves garlic of 12 at 45p: 11.25p
    // 1 tsp smoked paprika, stated as 2 g, of 40 g at 125p: 6.25p
    // 800 g chopped tomatoes of 400 g at 55p: 110p;  2 cans butter beans at 70p: 140p
    // 500 ml vegetable stock of 1 l at 110p: 55p;  1 tsp salt = 6 g of 500 g at 65p: 0.78p
    // Without the optional parsley: 369.8962p → 370p, ÷ 4 = 92.4740p → 92p a serving.
    // With the parsley (1 bunch at 75p): 444.8962p → 445p, ÷ 4 = 111.2240p → 111p a serving.
    const producer = await signedIn(demo.producer)
    const list = await producer.get('/api/studios/1/recipes')
    const stew = list.body.recipes.find((r: { title: string }) => r.title === 'Smoky butter bean and tomato stew')
    const cost = await producer.get(`/api/recipes/${stew.id}/cost`)
    expect(cost.body.minor).toMatchObject({ total: 370, totalWithOptional: 445, perServing: 92, perServingWithOptional: 111 })
    expect(cost.body.formatted.perServing).toBe('£0.92')
  })
})
