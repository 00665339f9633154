// The demo episode's shopping list over HTTP (built app, real SQLite file): lines and costs against
// figures worked by hand from the demo prices (server/db/demo-recipes.ts; servings 4 = each recipe's
// own), the CSV read back with an independent parser (papaparse; written with csv-stringify), the
// crew's check-offs (producers and hosts tick; camera and viewer are refused), bad keys, and the prep list.
// Unit factors: NIST Handbook 44 Appendix C (1 tbsp = 14.78676478125 mL, 1 tsp = 4.92892159375 mL).
// Densities: the recipes' own stated measures (1 tsp paprika = 2 g, 3 tbsp tahini = 45 g) and
// USDA SR Legacy NDB 02047 for salt (1 tsp = 6 g).
import Papa from 'papaparse'
import { beforeAll, describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { demo, signedIn, type Client } from '../support/client'

type Line = {
  key: string; item: string; section: string; text: string; optional: boolean; packages: { text: string } | null; basketMinor: number | null
  usedExact: number | null; usedMinor: number | null; leftover: { text: string } | null; check: { by: string } | null
  basket: string | null; used: string | null
}

describe('shopping list', async () => {
  await useBuiltApp()
  let producer: Client
  let host: Client
  let camera: Client
  let viewer: Client
  let episodeId: number

  beforeAll(async () => {
    ;[producer, host, camera, viewer] = await Promise.all([signedIn(demo.producer), signedIn(demo.host), signedIn(demo.camera), signedIn(demo.viewer)])
    const list = await producer.get('/api/studios/1/episodes')
    episodeId = list.body.episodes.find((e: { title: string }) => e.title === 'Thursday supper special').id
  })

  // [key, amount, packages, basket (pence), used exact (pence)], worked by hand:
  const worked: [string, string, string, number, number][] = [
    ['butternut-squash', '1', '1 × 1', 120, 120],
    ['garlic', '3 cloves', '1 × 12 cloves', 45, 3 / 12 * 45], // 11.25
    ['lemon', '1', '1 × 1', 30, 30],
    ['mint', '1 bunch', '1 × 1 bunch', 75, 75],
    ['onion', '1', '1 × pack of 3', 60, 1 / 3 * 60], // 20
    ['parsley', '1 bunch', '1 × 1 bunch', 75, 75],
    ['plain-yoghurt', '350 g', '1 × 500 g', 135, 350 / 500 * 135], // 94.5
    ['butter-bean', '2 cans', '2 × 1 can', 140, 140],
    ['chopped-tomato', '800 g', '2 × 400 g', 110, 110],
    ['tahini', '3 tbsp', '1 × 300 g', 275, 45 / 300 * 275], // 41.25 (3 tbsp = 45 g as stated)
    ['green-lentil', '200 g', '1 × 500 g', 160, 200 / 500 * 160], // 64
    ['olive-oil', '5 tbsp', '1 × 500 mL', 450, 5 * 14.78676478125 / 500 * 450], // 2 + 3 tbsp = 73.93382390625 mL → 66.540441515625
    ['self-raising-flour', '250 g', '1 × 1.5 kg', 110, 250 / 1500 * 110], // 18.333…
    ['vegetable-stock', '500 mL', '1 × 1 L', 110, 500 / 1000 * 110], // 55
    ['salt', '2¼ tsp', '1 × 500 g', 65, 2.25 * 6 / 500 * 65], // 1 + ¼ + 1 tsp = 13.5 g → 1.755
    ['smoked-paprika', '1 tsp', '1 × 40 g', 125, 2 / 40 * 125], // 6.25
  ]

  it('lists the demo episode merged by item, in shop sections, with packages and costs worked by hand', async () => {
    const res = await viewer.get(`/api/episodes/${episodeId}/shopping`)
    expect(res.status).toBe(200)
    const lines = res.body.lines as Line[]
    expect(lines.map((l) => l.key)).toEqual(worked.map((w) => w[0]))
    for (const [key, text, packages, basket, used] of worked) {
      const l = lines.find((x) => x.key === key)!
      expect({ key, text: l.text, packages: l.packages?.text, basket: l.basketMinor }).toEqual({ key, text, packages, basket })
      expect(l.usedExact).toBeCloseTo(used, 9)
    }
    expect(res.body.sections.map((s: { id: string }) => s.id)).toEqual(['produce', 'dairy-eggs', 'tins-jars', 'dry-goods', 'spices'])
    expect(lines.find((l) => l.key === 'parsley')!.optional).toBe(true)
    // basket: Σ whole packages = 2085p = £20.85, without the optional parsley 2010p; used: Σ shares = 928.8788p → £9.29, without parsley → £8.54
    expect(res.body.totals).toMatchObject({ basketMinor: 2085, basketRequiredMinor: 2010, usedMinor: 929, usedRequiredMinor: 854, basket: '£20.85', used: '£9.29' })
    expect(res.body.totals.leftovers.map((x: { item: string; text: string }) => `${x.item}: ${x.text}`)).toContain('olive oil: 426 mL')
    expect(res.body.totals.notCosted).toEqual([])
  })

  it('downloads as CSV that an independent parser reads back to the same lines', async () => {
    const res = await camera.call('GET', `/api/episodes/${episodeId}/shopping.csv`, undefined, { accept: 'text/csv' })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="shopping-list-episode-\d+\.csv"/)
    const parsed = Papa.parse<Record<string, string>>(String(res.body), { header: true, skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    expect(parsed.meta.fields).toEqual(['Section', 'Item', 'Amount', 'Optional', 'To taste', 'Buy', 'Shop', 'Basket', 'Used', 'Left over', 'Ticked by', 'Notes'])
    const json = (await camera.get(`/api/episodes/${episodeId}/shopping`)).body.lines as Line[]
    expect(parsed.data.slice(0, -1).map((r) => [r.Item, r.Amount, r.Buy, r.Basket, r.Used]))
      .toEqual(json.map((l) => [l.item, l.text, l.packages!.text, l.basket, l.used]))
    expect(parsed.data.find((r) => r.Item === 'parsley')!.Optional).toBe('yes')
    expect(parsed.data.find((r) => r.Item === 'olive oil')).toMatchObject({ Section: 'Dry goods', Shop: 'Marrow Lane Grocer', 'Left over': '426 mL' })
    expect(parsed.data.at(-1)).toMatchObject({ Item: 'Total', Basket: '£20.85', Used: '£9.29' })
  })

  it('a host ticks a line for the whole crew; the version changes; unticking clears it', async () => {
    const before = (await viewer.get(`/api/episodes/${episodeId}/shopping`)).body.version
    const ticked = await host.put(`/api/episodes/${episodeId}/shopping/checks/garlic`, { ticked: true })
    expect(ticked.status).toBe(200)
    const seen = (await viewer.get(`/api/episodes/${episodeId}/shopping`)).body
    expect(seen.version).not.toBe(before)
    expect(seen.lines.find((l: Line) => l.key === 'garlic').check).toMatchObject({ by: expect.any(String) })
    const csv = Papa.parse<Record<string, string>>(String((await viewer.get(`/api/episodes/${episodeId}/shopping.csv`)).body), { header: true })
    expect(csv.data.find((r) => r.Item === 'garlic')!['Ticked by']).toBe(seen.lines.find((l: Line) => l.key === 'garlic').check.by)
    const off = await producer.put(`/api/episodes/${episodeId}/shopping/checks/garlic`, { ticked: false })
    expect(off.status).toBe(200)
    expect(off.body.lines.find((l: Line) => l.key === 'garlic').check).toBeNull()
    expect(off.body.version).not.toBe(seen.version)
  })

  it('refuses camera and viewer, bad keys and bad bodies in the one error shape', async () => {
    for (const c of [camera, viewer]) {
      const r = await c.put(`/api/episodes/${episodeId}/shopping/checks/garlic`, { ticked: true })
      expect(r.status).toBe(403)
      expect(r.body.data.code).toBe('forbidden')
      expect(r.body.statusMessage).toMatch(/may not tick the shopping list\. Ask the studio's producer\.$/)
    }
    const unknown = await host.put(`/api/episodes/${episodeId}/shopping/checks/caviar`, { ticked: true })
    expect(unknown.status).toBe(404)
    expect(unknown.body.statusMessage).toBe('There is no such line on this shopping list; the recipes may have changed. Open the list again.')
    const bad = await host.put(`/api/episodes/${episodeId}/shopping/checks/Not%20a%20key`, { ticked: true })
    expect(bad.status).toBe(400)
    expect(bad.body.data).toMatchObject({ code: 'invalid', field: 'key' })
    expect(bad.body.statusMessage).toMatch(/^Shopping list line: /)
    const body = await host.put(`/api/episodes/${episodeId}/shopping/checks/garlic`, { ticked: 'yes' })
    expect(body.status).toBe(400)
    expect(body.body.statusMessage).toBe('Ticked: write true or false.')
    expect((await viewer.get(`/api/episodes/${episodeId}/shopping`)).body.lines.find((l: Line) => l.key === 'garlic').check).toBeNull()
  })

  it('the prep list follows the cook plan: in order of first need, each prep with its bowl', async () => {
    const res = await camera.get(`/api/episodes/${episodeId}/prep`)
    expect(res.status).toBe(200)
    expect(res.body.planProblem).toBeNull()
    const tasks = res.body.tasks as { item: string; prep: string; neededAt: number | null; containers: string[]; when: string }[]
    expect(tasks[0]!.neededAt).toBe(0) // the cook starts with a prep
    expect(tasks.find((t) => t.item === 'onion')).toMatchObject({ prep: 'finely chopped', when: 'on-the-day' })
    const times = tasks.map((t) => t.neededAt).filter((t): t is number => t !== null)
    expect(times).toEqual([...times].sort((a, b) => a - b))
    expect(tasks.find((t) => t.item === 'onion')!.containers[0]).toBe('bowl for step 1: Chop onion finely and slice the garlic.')
    expect(tasks.find((t) => t.item === 'butternut squash')!.when).toBe('either')
  })
})
