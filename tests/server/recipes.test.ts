// Recipes through the built app: saving with optimistic locking, scaling, cost per serving,
// schema.org import (three input kinds) and export, and the refusals.
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { rootDir, useBuiltApp } from '../support/app'
import { appOrigin, Client, demo, signedIn } from '../support/client'

const fixture = readFileSync(resolve(rootDir, 'tests/fixtures/recipe-fennel-orzo.jsonld'), 'utf8')

// NIST Handbook 44, Appendix C: 1 lb = 453.59237 g exactly; US cup = 8 fl oz = 1/16 gal of 231 in³
// = 236.5882365 mL exactly.
const GRAMS_PER_POUND = 453.59237
const ML_PER_US_CUP = 236.5882365

describe('recipes', async () => {
  await useBuiltApp()
  let producer: Client
  let studioId: number
  let spaghettiPrice: number
  let basilPrice: number

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    spaghettiPrice = (await producer.post(`/api/studios/${studioId}/prices`, { item: 'Spaghetti', packageSize: 500, packageUnit: 'g', priceMinor: 95, currency: 'GBP', shop: 'Corner Grocer', boughtOn: '2026-11-20' })).body.id
    basilPrice = (await producer.post(`/api/studios/${studioId}/prices`, { item: 'Basil', packageSize: 1, packageUnit: 'bunch', priceMinor: 80, currency: 'GBP' })).body.id
  })

  const pasta = () => ({
    title: 'Weeknight spaghetti',
    servings: 4,
    tags: ['pasta'],
    ingredients: [
      { key: 'spaghetti', min: 400, max: 400, unit: 'g', item: 'spaghetti', priceId: spaghettiPrice },
      { key: 'milk', min: 1, max: 1, unit: 'cup', item: 'whole milk', allergens: { eu: ['milk'], us: ['milk'] } },
      { key: 'basil', min: 1, max: 1, unit: 'bunch', item: 'basil', optional: true, priceId: basilPrice },
      { key: 'salt', min: null, max: null, unit: null, item: 'salt', toTaste: true },
    ],
    steps: [
      { name: ' Pasta water ', text: 'Boil {{spaghetti}} in salted water.', handsOn: false, durationMin: 540, durationMax: 600, station: 'burner', cautions: ['boiling'] },
      { text: 'Warm {{milk}} and toss it through.', handsOn: true, after: [1], script: ['Now the milk goes in.'] },
    ],
  })

  it('creates, reads and saves a recipe, keeping step ids across saves', async () => {
    const created = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ version: 1, title: 'Weeknight spaghetti', servings: 4 })
    expect(created.body.steps.map((s: { position: number }) => s.position)).toEqual([1, 2])
    // The short name is kept trimmed; a step without one has null.
    expect(created.body.steps.map((s: { name: string | null }) => s.name)).toEqual(['Pasta water', null])
    expect(created.body.allergens.eu).toEqual([expect.objectContaining({ id: 'milk', items: ['whole milk'] })])
    const stepIds = created.body.steps.map((s: { id: number }) => s.id)

    const edited = { ...pasta(), version: 1, title: 'Weeknight spaghetti, milky', steps: created.body.steps.map((s: object) => ({ ...s, photo: undefined })) }
    const saved = await producer.patch(`/api/recipes/${created.body.id}`, edited)
    expect(saved.status).toBe(200)
    expect(saved.body.version).toBe(2)
    expect(saved.body.steps.map((s: { id: number }) => s.id)).toEqual(stepIds)
  })

  it('refuses a save made from an older version, with a clear message and the newer recipe', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    const host = await signedIn(demo.host)
    const first = await host.patch(`/api/recipes/${r.id}`, { ...pasta(), version: 1, title: 'Saved by the host' })
    expect(first.status).toBe(200)
    const second = await producer.patch(`/api/recipes/${r.id}`, { ...pasta(), version: 1, title: 'Saved by the producer' })
    expect(second.status).toBe(409)
    expect(second.body.statusMessage).toMatch(/Someone else saved this recipe/)
    expect(second.body.data.current).toMatchObject({ version: 2, title: 'Saved by the host' })
    expect((await producer.get(`/api/recipes/${r.id}`)).body.title).toBe('Saved by the host')
  })

  it('scales to 6 servings: exact numbers in the unit shown, kitchen-rounded text, step text following', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    const us = await producer.get(`/api/recipes/${r.id}/scaled?servings=6&units=us`)
    expect(us.status).toBe(200)
    const spaghetti = us.body.ingredients.find((i: { item: string }) => i.item === 'spaghetti')
    // 400 g × 6/4 = 600 g = 600 / 453.59237 lb.
    expect(spaghetti.unit).toBe('lb')
    expect(spaghetti.min).toBeCloseTo(600 / GRAMS_PER_POUND, 9)
    expect(spaghetti.text).toBe('1 lb 5 oz')
    const milk = us.body.ingredients.find((i: { item: string }) => i.item === 'whole milk')
    expect(milk).toMatchObject({ unit: 'cup', min: 1.5, max: 1.5, text: '1½ cups' })
    expect(us.body.ingredients.find((i: { item: string }) => i.item === 'salt')).toMatchObject({ min: null, max: null, text: 'to taste' })
    expect(us.body.steps[1].text).toBe('Warm 1½ cups and toss it through.')

    const metric = await producer.get(`/api/recipes/${r.id}/scaled?servings=6&units=metric`)
    const metricMilk = metric.body.ingredients.find((i: { item: string }) => i.item === 'whole milk')
    // 1.5 US cups = 354.88235475 mL.
    expect(metricMilk.unit).toBe('ml')
    expect(metricMilk.min).toBeCloseTo(1.5 * ML_PER_US_CUP, 9)
    expect(metric.body.ingredients.find((i: { item: string }) => i.item === 'spaghetti')).toMatchObject({ unit: 'g', min: 600, text: '600 g' })
  })

  it('costs per serving with and without the optional basil (DESIGN: Σ used ÷ package × price ÷ servings)', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    const cost = await producer.get(`/api/recipes/${r.id}/cost`)
    expect(cost.status).toBe(200)
    // Spaghetti 400 g of a 500 g pack at £0.95 = 76p; basil 1 bunch at 80p; 4 servings.
    expect(cost.body).toMatchObject({ currency: 'GBP', total: 0.76, totalWithOptional: 1.56, perServing: 0.19, perServingWithOptional: 0.39 })
    expect(cost.body.formatted.perServing).toBe('£0.19')
    expect(cost.body.missing.map((m: { item: string }) => m.item)).toEqual(['whole milk'])
    expect(cost.body.lines.find((l: { item: string }) => l.item === 'spaghetti')).toMatchObject({ status: 'priced', cost: 0.76 })
    // For 6 servings the total grows, the per-serving figure stays.
    const six = await producer.get(`/api/recipes/${r.id}/cost?servings=6`)
    expect(six.body).toMatchObject({ total: 1.14, perServing: 0.19 })
  })

  it('flags a recipe over the studio budget per serving', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, { ...pasta(), title: 'Budget check' })
    expect((await producer.patch(`/api/studios/${studioId}`, { budgetPerServingMinor: 30 })).status).toBe(200)
    const cost = await producer.get(`/api/recipes/${r.id}/cost`)
    expect(cost.body.budget).toMatchObject({ perServing: 0.3, over: false, overWithOptional: true })
    const list = await producer.get(`/api/studios/${studioId}/recipes?q=Budget`)
    expect(list.body.recipes).toEqual([expect.objectContaining({ title: 'Budget check', cost: expect.objectContaining({ perServing: 0.19, overBudget: false }) })])
    await producer.patch(`/api/studios/${studioId}`, { budgetPerServingMinor: null })
  })

  it('imports pasted JSON-LD, an HTML page with the recipe inside @graph, and an uploaded file', async () => {
    const pasted = await producer.call('POST', `/api/studios/${studioId}/recipes/import`, fixture, { 'content-type': 'application/ld+json' })
    expect(pasted.status).toBe(201)
    expect(pasted.body.recipe).toMatchObject({ title: 'Fennel and lemon orzo', servings: 4, times: { prep: 600, cook: 1200, total: 1800 } })
    expect(pasted.body.recipe.ingredients.map((i: { item: string }) => i.item)).toContain('orzo')
    expect(pasted.body.recipe.ingredients.find((i: { item: string }) => i.item === 'parmesan')).toMatchObject({ optional: true, min: 30, unit: 'g', prep: 'grated' })
    expect(pasted.body.recipe.steps.find((s: { durationMin: number | null }) => s.durationMin === 720)).toBeTruthy()

    const html = `<!doctype html><html><head><title>Orzo</title><script type="application/ld+json">${JSON.stringify({ '@context': 'https://schema.org', '@graph': [{ '@type': 'WebPage', name: 'A page' }, JSON.parse(fixture)] })}</script></head><body>Hi</body></html>`
    const page = await producer.call('POST', `/api/studios/${studioId}/recipes/import`, html, { 'content-type': 'text/html' })
    expect(page.status).toBe(201)
    expect(page.body.recipe.title).toBe('Fennel and lemon orzo')

    const form = new FormData()
    form.append('file', new Blob([fixture], { type: 'application/ld+json' }), 'orzo.jsonld')
    const res = await fetch((await import('@nuxt/test-utils/e2e')).url(`/api/studios/${studioId}/recipes/import`), { method: 'POST', body: form, headers: { cookie: producer.cookie, origin: appOrigin() } })
    expect(res.status).toBe(201)
    expect((await res.json()).recipe.title).toBe('Fennel and lemon orzo')
  })

  it('previews an import without saving, listing what it could not read', async () => {
    const before = (await producer.get(`/api/studios/${studioId}/recipes`)).body.recipes.length
    const preview = await producer.call('POST', `/api/studios/${studioId}/recipes/import?preview=1`, JSON.stringify({ '@context': 'https://schema.org', '@type': 'Recipe', name: 'No yield soup', recipeIngredient: ['2 carrots'], cookTime: 'soon' }), { 'content-type': 'application/json' })
    expect(preview.status).toBe(200)
    expect(preview.body.draft.title).toBe('No yield soup')
    expect(preview.body.problems.map((p: { field: string }) => p.field)).toEqual(expect.arrayContaining(['recipeYield', 'cookTime']))
    expect((await producer.get(`/api/studios/${studioId}/recipes`)).body.recipes.length).toBe(before)
    const nothing = await producer.call('POST', `/api/studios/${studioId}/recipes/import`, '<html><body>no recipe here</body></html>', { 'content-type': 'text/html' })
    expect(nothing.status).toBe(400)
    expect(nothing.body.statusMessage).toMatch(/^The HTML page has no <script type="application\/ld\+json"> block/)
    expect(nothing.body.data.field).toBe('body')
  })

  it('reads step times from the text as suggestions, saved as read until confirmed, and keeps a stated equivalent', async () => {
    const page = JSON.stringify({
      '@context': 'https://schema.org', '@type': 'Recipe', name: 'Coconut sugar cake', recipeYield: '8',
      recipeIngredient: ['½ cup (100g) coconut sugar', '1 cup / 240 ml milk'],
      recipeInstructions: ['Preheat the oven to 180°C.', 'Bake for 25 to 30 minutes.', 'Leave to cool for at least 1 hour.', 'Dust with sugar.'],
    })
    const preview = await producer.call('POST', `/api/studios/${studioId}/recipes/import?preview=1`, page, { 'content-type': 'application/ld+json' })
    expect(preview.status).toBe(200)
    expect(preview.body.draft.steps.map((s: Record<string, unknown>) => [s.durationMin, s.durationMax, s.handsOn, s.station, s.readFromText])).toEqual([
      [null, null, true, 'oven', ['station']],
      [1500, 1800, false, 'oven', ['duration', 'handsOn', 'station']],
      [3600, 3600, false, null, ['duration', 'handsOn']],
      [null, null, true, null, []],
    ])
    // step 2 confirmed in the preview; the others stay marked
    const saved = await producer.call('POST', `/api/studios/${studioId}/recipes/import?confirmed=2`, page, { 'content-type': 'application/ld+json' })
    expect(saved.status).toBe(201)
    const r = saved.body.recipe
    expect(r.steps.map((s: { readFromText: string[] }) => s.readFromText)).toEqual([['station'], [], ['duration', 'handsOn'], []])
    expect(r.ingredients[0]).toMatchObject({ min: 0.5, unit: 'cup', item: 'coconut sugar', stated: { min: 100, max: 100, unit: 'g' } })
    expect(r.ingredients[1]).toMatchObject({ min: 1, unit: 'cup', item: 'milk', stated: { min: 240, max: 240, unit: 'ml' } })
    expect((await producer.call('POST', `/api/studios/${studioId}/recipes/import?confirmed=first`, page, { 'content-type': 'application/ld+json' })).status).toBe(400)

    // shown metric as the recipe states it, with where it came from
    const metric = await producer.get(`/api/recipes/${r.id}/scaled?units=metric&servings=16`)
    expect(metric.body.ingredients[0]).toMatchObject({ text: '200 g', source: 'stated', sourceText: 'stated in the recipe beside 1 cup' })
    expect(metric.body.ingredients[1]).toMatchObject({ text: '480 mL', source: 'stated' })

    // costed with the author's density: 100 g of a 1 kg bag at £3.00 is 30p (no USDA density is known for coconut sugar)
    const bag = (await producer.post(`/api/studios/${studioId}/prices`, { item: 'Coconut sugar', packageSize: 1, packageUnit: 'kg', priceMinor: 300, currency: 'GBP' })).body.id
    const withPrice = { ...r, ingredients: r.ingredients.map((i: Record<string, unknown>, n: number) => ({ ...i, priceId: n === 0 ? bag : null })) }
    delete withPrice.id
    const patched = await producer.patch(`/api/recipes/${r.id}`, { ...withPrice, steps: r.steps.map(({ photo: _p, ...s }: Record<string, unknown>) => s) })
    expect(patched.status).toBe(200)
    expect(patched.body.ingredients[0].stated).toEqual({ min: 100, max: 100, unit: 'g' })
    const cost = await producer.get(`/api/recipes/${r.id}/cost`)
    expect(cost.body.lines[0]).toMatchObject({ status: 'priced', costMinor: 30 })
    expect(cost.body.lines[0].amountUsed).toBeCloseTo(0.1, 9)
    expect(cost.body.lines[0].conversion).toBe('the recipe\'s own measure: ½ cup = 100 g')

    // the cook plan names the step with no time and the steps still read from the text
    const episode = await producer.post(`/api/studios/${studioId}/episodes`, { title: 'Cake day', recipeIds: [r.id] })
    const plan = await producer.get(`/api/episodes/${episode.body.id}/plan`)
    expect(plan.status).toBe(200)
    expect(plan.body.timeNotices.map((n: { label: string; kind: string }) => [n.label, n.kind])).toEqual([
      ['Preheat the oven to 180°C', 'no-time'], ['Leave to cool for at least 1 hour', 'read-from-text'], ['Dust with sugar', 'no-time'],
    ])
  })

  it('exports application/ld+json that imports back to the same recipe', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    const exported = await producer.get(`/api/recipes/${r.id}/export`)
    expect(exported.status).toBe(200)
    expect(exported.headers.get('content-type')).toContain('application/ld+json')
    expect(exported.body['@type']).toBe('Recipe')
    const again = await producer.call('POST', `/api/studios/${studioId}/recipes/import`, JSON.stringify(exported.body), { 'content-type': 'application/ld+json' })
    const strip = (x: typeof r) => ({
      ...x, id: 0, version: 0, updatedAt: 0,
      ingredients: x.ingredients.map((i: Record<string, unknown>) => ({ ...i, id: 0, priceId: null })),
      steps: x.steps.map((s: Record<string, unknown>) => ({ ...s, id: 0 })),
    })
    expect(strip(again.body.recipe)).toEqual(strip(r))
  })

  it('bad input is a 400 naming the field by its label on the form (the key in data.field), and nothing saved is lost', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    const cases: [unknown, string, string][] = [
      [{ ...pasta(), servings: -1 }, 'servings', 'Servings: write a number above 0, such as 4.'],
      [{ ...pasta(), title: 'x'.repeat(5000) }, 'title', 'Title: write at most 160 characters.'],
      [{ ...pasta(), ingredients: [{ ...pasta().ingredients[0], unit: 'bucket' }] }, 'ingredients.0.unit', 'Ingredient 1, unit: choose one of: tsp, tbsp'],
      [{ ...pasta(), steps: [{ text: 'First', after: [2] }, { text: 'Second' }] }, 'steps.0.after', 'Step 1, waits for: choose only steps before step 1, not step 2.'],
      [{ ...pasta(), steps: [{ text: 'x', station: 'grill' }] }, 'steps.0.station', 'Step 1, station: choose burner, oven or counter, or leave it empty.'],
      [{ ...pasta(), steps: [{ text: 'x', name: 'The big pot of salted water for the pasta' }] }, 'steps.0.name', 'Step 1, short name: keep it to 40 characters'],
      [{ ...pasta(), ingredients: [pasta().ingredients[0], pasta().ingredients[0]] }, 'ingredients.1.key', 'Ingredient 2, name in the steps: another ingredient is also called'],
    ]
    for (const [body, field, words] of cases) {
      const res = await producer.patch(`/api/recipes/${r.id}`, { ...(body as object), version: 1 })
      expect(res.status, field).toBe(400)
      expect(res.body.statusMessage.startsWith(words), res.body.statusMessage).toBe(true)
      expect(res.body.data.field, field).toBe(field)
    }
    expect((await producer.get(`/api/recipes/${r.id}/scaled?servings=0`)).status).toBe(400)
    expect((await producer.get(`/api/recipes/${r.id}/scaled?units=imperial`)).status).toBe(400)
    expect((await producer.get(`/api/recipes/${r.id}`)).body).toMatchObject({ version: 1, title: 'Weeknight spaghetti' })
  })

  it('a price of another studio cannot be linked', async () => {
    const other = new Client()
    await other.post('/api/auth/signup', { name: 'Other', email: `other-${Date.now()}@example.test`, password: 'another studio here', studioName: 'Other Kitchen' })
    const otherStudio = (await other.get('/api/me')).body.memberships[0].studioId
    const foreign = (await other.post(`/api/studios/${otherStudio}/prices`, { item: 'Rice', packageSize: 1, packageUnit: 'kg', priceMinor: 200, currency: 'GBP' })).body.id
    const res = await producer.post(`/api/studios/${studioId}/recipes`, { ...pasta(), ingredients: [{ ...pasta().ingredients[0], priceId: foreign }] })
    expect(res.status).toBe(400)
    expect(res.body.statusMessage).toBe("Ingredient 1, price: choose a price from this studio's price list; the one linked is not in it.")
    expect(res.body.data.field).toBe('ingredients.0.priceId')
    // And another studio's recipe is not found.
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    expect((await other.get(`/api/recipes/${r.id}`)).status).toBe(404)
  })

  it('camera and viewer read recipes but may not edit or delete; the host may', async () => {
    const { body: r } = await producer.post(`/api/studios/${studioId}/recipes`, pasta())
    for (const who of [demo.camera, demo.viewer]) {
      const c = await signedIn(who)
      expect((await c.get(`/api/recipes/${r.id}`)).status).toBe(200)
      expect((await c.patch(`/api/recipes/${r.id}`, { ...pasta(), version: 1 })).status).toBe(403)
      expect((await c.delete(`/api/recipes/${r.id}`)).status).toBe(403)
    }
    expect((await (await signedIn(demo.host)).delete(`/api/recipes/${r.id}`)).status).toBe(204)
    expect((await producer.get(`/api/recipes/${r.id}`)).status).toBe(404)
  })

  it('a price list CSV adds the good rows and reports the bad ones by line', async () => {
    const csv = 'item,package size,unit,price,currency,shop,date\nChickpeas,400,g,0.65,GBP,Corner Grocer,2026-11-02\nLemons,4,each,1.20,GBP,,\nMystery,,g,1.00,GBP,,\n'
    const res = await producer.call('POST', `/api/studios/${studioId}/prices/import`, csv, { 'content-type': 'text/csv' })
    expect(res.status).toBe(201)
    expect(res.body.added.map((p: { item: string }) => p.item)).toEqual(['Chickpeas', 'Lemons'])
    expect(res.body.added[0]).toMatchObject({ priceMinor: 65, packageSize: 400, packageUnit: 'g', boughtOn: '2026-11-02' })
    expect(res.body.errors).toEqual([expect.objectContaining({ line: 4 })])
    // No good row: a refusal in the one error shape, naming the first problem, every row in its data.
    const none = await producer.call('POST', `/api/studios/${studioId}/prices/import`, 'item,package size,unit,price,currency\nMystery,,g,1.00,GBP\n,1,kg,2.00,GBP\n', { 'content-type': 'text/csv' })
    expect(none.status).toBe(400)
    expect(none.body.statusMessage).toMatch(/^No price was added\. Line 2.*\(1 more problems are listed by line\)$/)
    expect(none.body.data.errors.map((e: { line: number }) => e.line)).toEqual([2, 3])
  })

  it('ids in addresses are digits only: " 1", "0x10" and "1e0" name no row', async () => {
    for (const id of ['%201', '0x10', '1e0', '01', '1.0']) {
      const res = await producer.get(`/api/recipes/${id}`)
      expect(res.status, id).toBe(400)
      expect(res.body.statusMessage).toBe('This address names no recipe: the recipe number in it must be a whole number such as 12. Check the link.')
    }
  })

  it('an address under /api that no route answers, or not for its method, is a 404 in the one error shape', async () => {
    for (const [method, path] of [['POST', '/api/no-such-thing'], ['DELETE', `/api/studios/${studioId}/prices/`], ['DELETE', `/api/studios/${studioId}/prices/%3Fx`]]) {
      const res = await producer.call(method!, path!, method === 'POST' ? {} : undefined)
      expect(res.status, path).toBe(404)
      expect(res.body.data.code).toBe('not-found')
      expect(res.body.statusMessage).toMatch(/^There is nothing at this address to (send to|delete); check the link, or the number in it\.$/)
    }
  })
})
