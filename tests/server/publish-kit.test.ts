// The publish kit over the built server: a recording of the demo episode rolled, stepped and ended
// through the commands API; its take log gives the description's chapter lines; a recipe published
// at a chosen address opens for a signed-out visitor with schema.org JSON-LD that Hobline's own
// importer reads back into the same recipe, and whose Clip offsets equal the take log's chapter
// times; an unpublished address answers 404; roles and bad input are refused with what to fix.
import { setTimeout as sleep } from 'node:timers/promises'
import { beforeAll, describe, expect, it } from 'vitest'
import { url } from '@nuxt/test-utils/e2e'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn, type Json } from '../support/client'

type Marker = { kind: string; recordingMs: number | null; stepRef: { segmentId: string; stepId: string | null } }

describe('the publish kit', async () => {
  await useBuiltApp()
  let producer: Client
  let studioId: number
  let episodeId: number
  let shootId: number
  let stew: { id: number; title: string }
  let state: {
    markers: Marker[]; runOrder: { id: string; title: string; stepIds: string[] }[]; recordedMs: number
    plan: { steps: { id: string; recipeTitle: string }[] }
  }

  const command = async (body: Json) => {
    const r = await producer.post(`/api/shoots/${shootId}/commands`, body)
    expect(r.status, JSON.stringify(r.body)).toBe(200)
  }

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    const episodes = (await producer.get(`/api/studios/${studioId}/episodes`)).body.episodes
    episodeId = episodes.find((e: { title: string }) => e.title === 'Thursday supper special').id
    const made = await producer.post(`/api/episodes/${episodeId}/shoots`, { mode: 'take' })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    shootId = made.body.shoot.id
    // Roll, start on the intro, step through the run order a beat at a time, then stop and end.
    await command({ type: 'rolling.set', rolling: true })
    await command({ type: 'shoot.start' })
    for (let i = 0; i < 10; i++) {
      await sleep(120)
      await command({ type: 'step.next' })
    }
    await sleep(120)
    await command({ type: 'rolling.set', rolling: false })
    await command({ type: 'shoot.end', cancelTimers: true })
    state = (await producer.get(`/api/shoots/${shootId}`)).body.state
    // The demo's stew (it has a photo); the recording reached its steps.
    const recipeIds = (await producer.get(`/api/episodes/${episodeId}`)).body.segments.map((seg: Json) => seg.recipeId).filter(Boolean) as number[]
    for (const id of recipeIds) {
      const r = (await producer.get(`/api/recipes/${id}`)).body
      if (r.title.includes('stew')) stew = { id, title: r.title }
    }
    expect(stew, 'the demo episode cooks the stew').toBeTruthy()
  })

  it('the chosen recording\'s chapter lines come from its take log: one per segment, at its first chapter', async () => {
    const chapters = state.markers.filter((m) => m.kind === 'chapter')
    expect(chapters.length).toBe(11) // the roll's own, then one per step change while rolling
    expect(chapters[0]!.recordingMs).toBeLessThan(1000)
    const kit = await producer.patch(`/api/episodes/${episodeId}/publish`, { shootId, videoUrl: 'https://video.example/watch?v=supper' })
    expect(kit.status, JSON.stringify(kit.body)).toBe(200)
    expect(kit.body.takes.map((t: { id: number }) => t.id)).toContain(shootId)
    // Expected lines worked from the state: the first chapter of each part of the show (a talk
    // segment, or a recipe of the cook plan's interleaved segment), m:ss rounded down.
    const titles = new Map(state.runOrder.map((s) => [s.id, s.title]))
    const recipeOf = new Map(state.plan.steps.map((s) => [s.id, s.recipeTitle]))
    const firsts = new Map<string, number>()
    for (const c of chapters) {
      const part = (c.stepRef.stepId && recipeOf.get(c.stepRef.stepId)) || titles.get(c.stepRef.segmentId)!
      if (!firsts.has(part)) firsts.set(part, c.recordingMs!)
    }
    expect(firsts.size).toBeGreaterThan(2) // the intro and at least two recipes reached
    const expected = [...firsts].map(([part, ms]) => `${Math.floor(ms / 60_000)}:${String(Math.floor(ms / 1000) % 60).padStart(2, '0')} ${part}`)
    expect(kit.body.chapters.map((c: { line: string }) => c.line)).toEqual(expected)
    expect(kit.body.chaptersStartAtZero).toBe(true)
    expect(kit.body.description).toContain(`Chapters\n${expected.join('\n')}\n`)
    // Each recipe's cost with and without its optional ingredients, worked by hand in tests/unit/demo-cost.test.ts.
    expect(kit.body.description).toContain('£0.92 a serving (£1.11 with the optional')
    expect(kit.body.description).toMatch(/Prices seen at .*Marrow Lane Grocer/)
  })

  it('a published recipe opens signed out, with JSON-LD that imports back into the same recipe and Clips at the chapter times', async () => {
    const published = await producer.put(`/api/episodes/${episodeId}/publish/recipes/${stew.id}`, { slug: 'Smoky-Supper-Stew' })
    expect(published.status, JSON.stringify(published.body)).toBe(200)
    const row = published.body.recipes.find((r: { recipeId: number }) => r.recipeId === stew.id)
    expect(row.page.slug).toBe('smoky-supper-stew')

    const html = await (await fetch(url('/r/smoky-supper-stew'))).text()
    expect(html).toContain(stew.title)
    const block = /<script[^>]*type="application\/ld\+json"[^>]*>([\s\S]*?)<\/script>/.exec(html)
    expect(block, 'a JSON-LD data block in the page').not.toBeNull()
    const ld = JSON.parse(block![1]!)
    expect(ld['@type']).toBe('Recipe')
    expect(JSON.stringify(ld)).not.toContain('hobline:script') // the production's own lines stay private
    // The photo opens signed out too, from the page's own address.
    const photo = await fetch(url(`/api/published/recipes/smoky-supper-stew/photo`))
    expect(photo.status).toBe(200)
    expect(photo.headers.get('content-type')).toMatch(/^image\//)
    expect(ld.image[0]).toMatch(/\/api\/published\/recipes\/smoky-supper-stew\/photo$/)

    // Clip offsets equal the take log's chapter times of the stew's segment (first visit of each step), to the millisecond.
    const stewSteps = new Set(state.plan.steps.filter((s) => s.recipeTitle === stew.title).map((s) => s.id))
    const seen = new Set<string>()
    const expectedOffsets = state.markers
      .filter((m) => m.kind === 'chapter' && stewSteps.has(String(m.stepRef.stepId)) && !seen.has(String(m.stepRef.stepId)) && seen.add(String(m.stepRef.stepId)))
      .map((m) => m.recordingMs! / 1000)
    expect(ld.video['@type']).toBe('VideoObject')
    expect(ld.video.contentUrl).toBe('https://video.example/watch?v=supper')
    expect(expectedOffsets.length).toBeGreaterThan(0)
    expect(ld.video.hasPart.map((c: { startOffset: number }) => c.startOffset)).toEqual(expectedOffsets)
    expect(ld.video.hasPart.every((c: { '@type': string }) => c['@type'] === 'Clip')).toBe(true)

    // Hobline's own importer reads the page's JSON-LD back into the same recipe (the private lines aside).
    const again = await producer.call('POST', `/api/studios/${studioId}/recipes/import?preview=1`, JSON.stringify(ld), { 'content-type': 'application/ld+json' })
    expect(again.status, JSON.stringify(again.body)).toBe(200)
    const original = (await producer.get(`/api/recipes/${stew.id}`)).body
    const imported = again.body.body
    expect(imported.title).toBe(original.title)
    expect(imported.servings).toBe(original.servings)
    const ingredientFacts = (list: Json[]) => list.map((i) => [i.item, i.min, i.max, i.unit, i.prep, i.optional, i.allergens])
    const stepFacts = (list: Json[]) => list.map((st) => [st.name, st.text, st.durationMin, st.durationMax, st.handsOn, st.station, st.after, st.cautions])
    expect(ingredientFacts(imported.ingredients)).toEqual(ingredientFacts(original.ingredients))
    expect(stepFacts(imported.steps)).toEqual(stepFacts(original.steps))
  })

  it('an unpublished recipe answers 404, and taking a page down closes its address', async () => {
    expect((await fetch(url('/api/published/recipes/no-such-page'))).status).toBe(404)
    expect((await fetch(url('/r/no-such-page'))).status).toBe(404)
    const down = await producer.delete(`/api/episodes/${episodeId}/publish/recipes/${stew.id}`)
    expect(down.status).toBe(200)
    expect((await fetch(url('/api/published/recipes/smoky-supper-stew'))).status).toBe(404)
  })

  it('random addresses are unguessable; bad or taken addresses are refused with what to fix; only a producer publishes', async () => {
    const kit = (await producer.get(`/api/episodes/${episodeId}/publish`)).body
    const [a, b] = kit.recipes as { recipeId: number }[]
    const first = await producer.put(`/api/episodes/${episodeId}/publish/recipes/${a!.recipeId}`, {})
    const slug = first.body.recipes.find((r: Json) => r.recipeId === a!.recipeId).page.slug as string
    expect(slug).toMatch(/^[a-z0-9]{12,}$/)
    const bad = await producer.put(`/api/episodes/${episodeId}/publish/recipes/${b!.recipeId}`, { slug: 'Not a slug!' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.field).toBe('slug')
    expect(bad.body.statusMessage).toMatch(/^Address: use 3 to 64 lower-case letters/)
    const taken = await producer.put(`/api/episodes/${episodeId}/publish/recipes/${b!.recipeId}`, { slug })
    expect(taken.status).toBe(409)
    expect(taken.body.statusMessage).toContain('is taken by another published recipe')
    const badUrl = await producer.patch(`/api/episodes/${episodeId}/publish`, { videoUrl: 'video.example/abc' })
    expect(badUrl.status).toBe(400)
    expect(badUrl.body.statusMessage).toMatch(/^Video address: write the finished video's full address/)
    const rehearsal = (await producer.post(`/api/episodes/${episodeId}/shoots`, { mode: 'rehearsal' })).body
    const rehearsalId = rehearsal.shoot.id
    const notTake = await producer.patch(`/api/episodes/${episodeId}/publish`, { shootId: rehearsalId })
    expect(notTake.status).toBe(400)
    expect(notTake.body.statusMessage).toContain('a rehearsal has no footage')
    const host = await signedIn(demo.host)
    expect((await host.put(`/api/episodes/${episodeId}/publish/recipes/${a!.recipeId}`, {})).status).toBe(403)
    const viewer = await signedIn(demo.viewer)
    const seen = await viewer.get(`/api/episodes/${episodeId}/publish`)
    expect(seen.status).toBe(200)
    expect(seen.body.description).toContain('Chapters')
    // Nothing saved was lost by the refusals: the random address still opens.
    expect((await new Client().get(`/api/published/recipes/${slug}`)).status).toBe(200)
  })
})
