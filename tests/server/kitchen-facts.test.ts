// Kitchen facts through the built app (issue 14): allergen certainty stored per ingredient and used by
// "Free of"; the studio's fluid measures (Weights and Measures Act 1985: imperial pint 568.26125 mL)
// in import, price lists and the scaled view; "to taste" lines leave the cost incomplete; the export
// carries the certainty.
import { beforeAll, describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import type { Client } from '../support/client'
import { demo, signedIn } from '../support/client'

describe('kitchen facts', async () => {
  await useBuiltApp()
  let producer: Client
  let studioId: number
  let producerName: string

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    const me = (await producer.get('/api/me')).body
    studioId = me.memberships[0].studioId
    producerName = me.user?.name ?? me.name
  })

  const milk = { eu: ['milk'], us: ['milk'] }
  const none = { eu: [], us: [] }
  const recipe = (title: string, state: 'checked' | 'suggested') => ({
    title, servings: 2, tags: [],
    ingredients: [
      { key: 'rice', min: 200, max: 200, unit: 'g', item: 'long-grain rice', allergens: none, allergenState: 'checked' },
      { key: 'water', min: 1, max: 1, unit: 'imp-pint', item: 'water', allergens: none, allergenState: state },
    ],
    steps: [{ text: 'Simmer {{rice}} in {{water}}.', handsOn: false }],
  })

  it('stores who checked an ingredient\'s allergens and when, keeps it across an unchanged save, and shows suggestions as such', async () => {
    const before = Date.now()
    const created = await producer.post(`/api/studios/${studioId}/recipes`, {
      title: 'Rice pudding', servings: 4, tags: [],
      ingredients: [
        { key: 'milk', min: 1, max: 1, unit: 'l', item: 'whole milk', allergens: milk, allergenState: 'checked' },
        { key: 'butter', min: 20, max: 20, unit: 'g', item: 'butter', allergens: milk },
      ],
      steps: [{ text: 'Warm {{milk}} with {{butter}}.', handsOn: true }],
    })
    expect(created.status).toBe(201)
    const [m, b] = created.body.ingredients
    expect(m).toMatchObject({ allergenState: 'checked', allergensCheckedBy: producerName })
    expect(Date.parse(m.allergensCheckedAt)).toBeGreaterThanOrEqual(before - 1000)
    expect(b).toMatchObject({ allergenState: 'suggested', allergensCheckedBy: null, allergensCheckedAt: null })
    expect(created.body.allergens.eu[0]).toMatchObject({ id: 'milk', items: ['whole milk', 'butter'], unchecked: ['butter'] })
    expect(created.body.allergens.unchecked).toEqual(['butter'])

    const again = await producer.patch(`/api/recipes/${created.body.id}`, { ...created.body, version: 1, steps: created.body.steps.map((s: object) => ({ ...s, photo: undefined })) })
    expect(again.status).toBe(200)
    expect(again.body.ingredients[0].allergensCheckedAt).toBe(m.allergensCheckedAt)

    const exported = await producer.get(`/api/recipes/${created.body.id}/export`)
    const list = Object.entries(exported.body).find(([k]) => k.endsWith(':ingredients'))![1] as Array<Record<string, unknown>>
    expect(list[0]).toMatchObject({ allergenState: 'checked', allergensCheckedBy: producerName })
    expect(list[1]).toMatchObject({ allergenState: 'suggested', allergenCertainty: 'suggested from the name, not checked' })
  })

  it('refuses an unknown allergen state with a 400 that says what to write', async () => {
    const bad = recipe('Bad state', 'checked')
    bad.ingredients[0]!.allergenState = 'probably' as never
    const res = await producer.post(`/api/studios/${studioId}/recipes`, bad)
    expect(res.status).toBe(400)
    expect(res.body.statusMessage).toBe('Ingredient 1, allergens checked: choose suggested, checked or none-declared.')
  })

  it('"Free of" counts only checked ingredients and says how many are unchecked', async () => {
    const sure = (await producer.post(`/api/studios/${studioId}/recipes`, recipe('Plain rice, checked', 'checked'))).body
    const unsure = (await producer.post(`/api/studios/${studioId}/recipes`, recipe('Plain rice, unchecked', 'suggested'))).body
    const res = await producer.get(`/api/studios/${studioId}/recipes?without=milk`)
    expect(res.status).toBe(200)
    const ids = res.body.recipes.map((r: { id: number }) => r.id)
    expect(ids).toContain(sure.id)
    expect(ids).not.toContain(unsure.id)
    expect(res.body.notChecked).toContainEqual({ id: unsure.id, title: 'Plain rice, unchecked', unchecked: 1 })
    const all = await producer.get(`/api/studios/${studioId}/recipes`)
    expect(all.body.recipes.find((r: { id: number }) => r.id === unsure.id).allergensUnchecked).toBe(1)
  })

  it('a UK studio reads a bare pint as the imperial pint (568.26 mL) in imports and price lists, and says so', async () => {
    const settings = (await producer.get(`/api/studios/${studioId}`)).body
    expect(settings).toMatchObject({ locale: 'en-GB', fluidMeasure: 'imperial', fluidMeasureChosen: false })
    const ld = JSON.stringify({ '@context': 'https://schema.org', '@type': 'Recipe', name: 'Milk jelly', recipeYield: '4', recipeIngredient: ['1 pint whole milk'] })
    const preview = await producer.call('POST', `/api/studios/${studioId}/recipes/import?preview=1`, ld, { 'content-type': 'application/ld+json' })
    expect(preview.status).toBe(200)
    expect(preview.body.body.ingredients[0]).toMatchObject({ min: 1, unit: 'imp-pint' })
    const saved = await producer.call('POST', `/api/studios/${studioId}/recipes/import`, ld, { 'content-type': 'application/ld+json' })
    const scaled = await producer.get(`/api/recipes/${saved.body.recipe.id}/scaled?units=metric`)
    // Weights and Measures Act 1985: 1 pint = 568.26125 mL, shown to 10 mL as 570 mL.
    expect(scaled.body.fluidMeasure).toBe('imperial')
    expect(scaled.body.ingredients[0].text).toBe('570 mL')
    expect(scaled.body.ingredients[0].exactText).toBe('exactly 568.3 mL')

    const csv = 'item,package size,unit,price,currency\nMilk,4,pints,1.45,GBP\n'
    const prices = await producer.call('POST', `/api/studios/${studioId}/prices/import`, csv, { 'content-type': 'text/csv' })
    expect(prices.status).toBe(201)
    expect(prices.body.added[0]).toMatchObject({ packageUnit: 'imp-pint' })

    const us = await producer.patch(`/api/studios/${studioId}`, { fluidMeasure: 'us' })
    expect(us.status).toBe(200)
    expect(us.body).toMatchObject({ fluidMeasure: 'us', fluidMeasureChosen: true })
    const usPreview = await producer.call('POST', `/api/studios/${studioId}/recipes/import?preview=1`, ld, { 'content-type': 'application/ld+json' })
    expect(usPreview.body.body.ingredients[0]).toMatchObject({ unit: 'pint' })
    const bad = await producer.patch(`/api/studios/${studioId}`, { fluidMeasure: 'pub' })
    expect(bad.status).toBe(400)
    expect(bad.body.statusMessage).toMatch(/^What a bare “pint” means: choose us .* imperial/)
    expect((await producer.patch(`/api/studios/${studioId}`, { fluidMeasure: null })).body).toMatchObject({ fluidMeasure: 'imperial', fluidMeasureChosen: false })
  })

  it('a "to taste" line leaves the cost incomplete and says why', async () => {
    const r = (await producer.post(`/api/studios/${studioId}/recipes`, {
      title: 'Salted water', servings: 1, tags: [],
      ingredients: [{ key: 'salt', min: null, max: null, unit: null, item: 'sea salt', toTaste: true }],
      steps: [{ text: 'Season {{salt}}.', handsOn: true }],
    })).body
    const cost = await producer.get(`/api/recipes/${r.id}/cost`)
    expect(cost.status).toBe(200)
    expect(cost.body.complete).toBe(false)
    expect(cost.body.unmeasured).toEqual([expect.objectContaining({ key: 'salt', message: expect.stringMatching(/"sea salt" is to taste/) })])
  })
})
