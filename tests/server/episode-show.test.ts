// The episode as a show over the built server: the run order written whole (a reorder is atomic, a
// stale version is refused with the current order), the script's live fields written from the data
// (a price change reaches the next snapshot and an open shoot's screens), claims checked, the planned
// runtime at the presenter's pace, and bad input refused with the field's label.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { useBuiltApp } from '../support/app'
import { demo, signedIn, type Client } from '../support/client'
import { connect, emitAck, waitFor, type TestSocket } from '../support/sockets'

type Segment = { id: string; kind: string; title: string; recipeId?: number | null; script: unknown[]; closing?: unknown[]; shot?: string }
type ShowSegment = {
  id: string; kind: string; title: string; words: number; readMs: number; cookMs: number; totalMs: number; missing: string[]
  script: { text: string }; closing: { text: string; parts: { text: string; missing?: string }[] } | null
  claims: { text: string; kind: string; verdict: string; detail: string }[]
}

describe('the episode as a show', async () => {
  await useBuiltApp()
  let producer: Client
  let episodeId: number
  let studioId: number
  const sockets: TestSocket[] = []
  afterAll(() => sockets.forEach((s) => s.disconnect()))

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    const list = await producer.get(`/api/studios/${studioId}/episodes`)
    episodeId = list.body.episodes.find((e: { title: string }) => e.title === 'Thursday supper special').id
  })

  const show = async () => (await producer.get(`/api/episodes/${episodeId}/show`)).body as { segments: ShowSegment[]; runtime: { totalMs: number; targetMs: number; overMs: number }; pace: { wpm: number } }
  const episode = async () => (await producer.get(`/api/episodes/${episodeId}`)).body as { version: number; segments: Segment[] }
  const bodyOf = (s: Segment) => ({
    id: s.id, kind: s.kind, title: s.title, ...(s.recipeId ? { recipeId: s.recipeId } : {}), script: s.script,
    ...(s.kind === 'recipe' ? { closing: s.closing } : {}),
  })

  it('the demo show: live fields written from the data, the intro\'s claim checked, the runtime at the presenter\'s pace plus the cook plan', async () => {
    const s = await show()
    expect(s.segments.map((x) => x.kind)).toEqual(['intro', 'recipe', 'recipe', 'sponsor', 'recipe', 'outro'])
    const [intro, stew] = s.segments
    expect(intro!.script.text).toContain('three dinners, each for 4, each under £1.50 a serving')
    // Worked by hand in tests/unit/demo-cost.test.ts: the stew is 92p a serving, £1.11 with the parsley.
    expect(stew!.closing!.text).toBe('That is the stew: £0.92 a serving, or £1.11 with the parsley.')
    expect(intro!.claims).toEqual([expect.objectContaining({ text: 'under £1.50 a serving', verdict: 'true' })])
    expect(s.segments.find((x) => x.kind === 'recipe' && x.title.startsWith('Roast'))!.script.text).toContain('200 °C, 400 °F')
    // Read time: words × 60 000 ÷ 160 (the demo presenter's pace), to the millisecond.
    expect(s.pace.wpm).toBe(160)
    for (const x of s.segments) expect(x.readMs).toBe(Math.round((x.words * 60_000) / 160))
    // Cook time: the recipe segments share the cook plan's length exactly.
    const plan = (await producer.get(`/api/episodes/${episodeId}/plan`)).body as { makespan: number }
    const cook = s.segments.reduce((sum, x) => sum + x.cookMs, 0)
    expect(cook).toBe(Math.round(plan.makespan * 1000))
    expect(s.runtime.totalMs).toBe(cook + s.segments.reduce((sum, x) => sum + x.readMs, 0))
    expect(s.runtime.targetMs).toBe(75 * 60_000)
    expect(s.runtime.overMs).toBe(s.runtime.totalMs - 75 * 60_000)
  })

  it('a reorder is written whole, and a stale version is refused with the current order', async () => {
    const before = await episode()
    const reversed = [...before.segments].reverse().map(bodyOf)
    const saved = await producer.patch(`/api/episodes/${episodeId}`, { version: before.version, segments: reversed })
    expect(saved.status, JSON.stringify(saved.body)).toBe(200)
    expect(saved.body.version).toBe(before.version + 1)
    expect((await episode()).segments.map((s) => s.id)).toEqual(reversed.map((s) => s.id))

    // The editor that read the old version: refused, told the current order, nothing written.
    const stale = await producer.patch(`/api/episodes/${episodeId}`, { version: before.version, segments: before.segments.map(bodyOf) })
    expect(stale.status).toBe(409)
    expect(stale.body.data.current.segments.map((s: Segment) => s.id)).toEqual(reversed.map((s) => s.id))
    expect((await episode()).segments.map((s) => s.id)).toEqual(reversed.map((s) => s.id))

    // Two editors at once on the same version: one is written, the other refused; never a mix.
    const now = await episode()
    const a = before.segments.map(bodyOf)
    const b = [...a.slice(1), a[0]!]
    const [ra, rb] = await Promise.all([
      producer.patch(`/api/episodes/${episodeId}`, { version: now.version, segments: a }),
      producer.patch(`/api/episodes/${episodeId}`, { version: now.version, segments: b }),
    ])
    expect([ra.status, rb.status].sort()).toEqual([200, 409])
    const won = ra.status === 200 ? a : b
    expect((await episode()).segments.map((s) => s.id)).toEqual(won.map((s) => s.id))

    // A run order refused half-way (a recipe of no studio of ours) changes nothing.
    const current = await episode()
    const bad = [...current.segments.map(bodyOf), { id: 'stray', kind: 'recipe', title: 'Stray', recipeId: 999_999, script: [] }]
    const refused = await producer.patch(`/api/episodes/${episodeId}`, { version: current.version, segments: bad })
    expect(refused.status).toBe(400)
    const after = await episode()
    expect(after.version).toBe(current.version)
    expect(after.segments.map((s) => s.id)).toEqual(current.segments.map((s) => s.id))
    // Back to the demo's order for the tests that follow.
    expect((await producer.patch(`/api/episodes/${episodeId}`, { version: after.version, segments: before.segments.map(bodyOf) })).status).toBe(200)
  })

  it('bad input: a 400 that names the field by its label and says what to fix', async () => {
    const { version, segments } = await episode()
    const untitled = segments.map(bodyOf)
    untitled[1] = { ...untitled[1]!, title: '  ' }
    let r = await producer.patch(`/api/episodes/${episodeId}`, { version, segments: untitled })
    expect(r.status).toBe(400)
    expect(r.body.message).toBe('Segment 2, title: give the segment a title.')
    expect(r.body.data.field).toBe('segments.1.title')

    const badField = segments.map(bodyOf)
    badField[0] = { ...badField[0]!, script: [{ text: 'Hot oven at ' }, { field: { kind: 'oven', celsius: 900 } }] }
    r = await producer.patch(`/api/episodes/${episodeId}`, { version, segments: badField })
    expect(r.status).toBe(400)
    expect(r.body.message).toBe('Segment 1, script line 2, live field, oven temperature: write at most 300 °C.')

    r = await producer.patch(`/api/episodes/${episodeId}`, { version, servings: 0 })
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/^Servings on set: write a whole number of servings from 1 to 200/)
    r = await producer.patch(`/api/episodes/${episodeId}`, { version, shootDate: '2026-02-30' })
    expect(r.body.message).toMatch(/^Shoot date: choose a day from the calendar/)
    expect((await episode()).version).toBe(version)
  })

  it('a claim the data does not bear out is flagged, naming the recipe and its figure', async () => {
    const { version, segments } = await episode()
    const body = segments.map(bodyOf)
    body[0] = { ...body[0]!, script: [{ text: 'Three dinners, each under £1 a serving, each ready in 20 minutes.' }] }
    expect((await producer.patch(`/api/episodes/${episodeId}`, { version, segments: body })).status).toBe(200)
    const intro = (await show()).segments[0]!
    const cost = intro.claims.find((c) => c.text.includes('£1'))!
    // The stew with its parsley is £1.11 a serving: over £1.
    expect(cost.verdict).toBe('false')
    expect(cost.detail).toContain('Smoky butter bean and tomato stew')
    expect(cost.detail).toContain('£1.11')
    // The demo recipes take 45, 35 and 55 minutes start to finish.
    expect(intro.claims.find((c) => c.kind === 'time')).toMatchObject({ verdict: 'false' })
    const now = await episode()
    expect((await producer.patch(`/api/episodes/${episodeId}`, { version: now.version, segments: segments.map(bodyOf) })).status).toBe(200)
  })

  it('a price change reaches the next snapshot and an open shoot\'s screens; a missing price is flagged in words, never a raw field', async () => {
    const made = await producer.post(`/api/episodes/${episodeId}/shoots`, { mode: 'rehearsal' })
    expect(made.status).toBe(201)
    const shootId = made.body.shoot.id as number
    const closingOf = (snap: Pick<ShootSnapshot, 'show'>) => snap.show!.segments['segment-stew']!.closing!.text
    expect(closingOf(made.body)).toBe('That is the stew: £0.92 a serving, or £1.11 with the parsley.')

    const host = await connect(await signedIn(demo.host))
    sockets.push(host)
    const scripts: Array<Pick<ShootSnapshot, 'show'>> = []
    host.on('shoot:script', (m) => scripts.push(m))
    expect((await emitAck(host, 'shoot:join', { shootId })).ok).toBe(true)

    // Butter beans from 70p to £1.40 a can: two cans for four servings add 35p a serving (2 × 70p ÷ 4).
    const prices = (await producer.get(`/api/studios/${studioId}/prices`)).body.prices as Array<Record<string, unknown> & { id: number; item: string }>
    const beans = prices.find((p) => p.item === 'Butter beans')!
    const { id: _id, ...rest } = beans
    const changed = await producer.patch(`/api/studios/${studioId}/prices/${beans.id}`, {
      item: rest.item, packageSize: rest.packageSize, packageUnit: rest.packageUnit, currency: rest.currency, shop: rest.shop, boughtOn: rest.boughtOn,
      priceMinor: 140,
    })
    expect(changed.status, JSON.stringify(changed.body)).toBe(200)
    const pushed = await waitFor(() => scripts.at(-1))
    expect(closingOf(pushed)).toBe('That is the stew: £1.27 a serving, or £1.46 with the parsley.')
    const snap = await emitAck<ShootSnapshot & { ok: boolean }>(host, 'shoot:snapshot', { shootId })
    expect(closingOf(snap)).toBe('That is the stew: £1.27 a serving, or £1.46 with the parsley.')

    // The parsley's price gone: the figure with the parsley is unknown, said in words and flagged.
    const parsley = prices.find((p) => p.item === 'Parsley')!
    expect((await producer.delete(`/api/studios/${studioId}/prices/${parsley.id}`)).status).toBeLessThan(300)
    const later = await waitFor(() => (scripts.length >= 2 ? scripts.at(-1) : undefined))
    const closing = later.show!.segments['segment-stew']!.closing!
    const placeholder = '[cost unknown: Parsley has no price]'
    expect(closing.text).toBe(`That is the stew: £1.27 a serving, or ${placeholder} with the parsley.`)
    expect(closing.parts.find((p) => p.missing)?.missing).toBe('Parsley has no price')
    expect(later.show!.segments['segment-stew']!.missing).toEqual(['Parsley has no price'])
    expect(closing.text).not.toMatch(/[{}]|"kind"/)
    expect(later.show!.flags).toBeGreaterThan(0)
  })

  it('the presenter\'s reading pace: set by the producer or the host, not by the camera operator; it times the show', async () => {
    const hostId = (await producer.get(`/api/episodes/${episodeId}`)).body.hostId as number
    const host = await signedIn(demo.host)
    const camera = await signedIn(demo.camera)
    expect((await camera.patch(`/api/studios/${studioId}/members/${hostId}`, { readingWpm: 100 })).status).toBe(403)
    const bad = await host.patch(`/api/studios/${studioId}/members/${hostId}`, { readingWpm: 20 })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^Reading pace: write a reading pace from 80 to 260 words a minute/)
    expect((await host.patch(`/api/studios/${studioId}/members/${hostId}`, { readingWpm: 120 })).status).toBe(200)
    const s = await show()
    expect(s.pace.wpm).toBe(120)
    for (const x of s.segments) expect(x.readMs).toBe(Math.round((x.words * 60_000) / 120))
    expect((await producer.patch(`/api/studios/${studioId}/members/${hostId}`, { readingWpm: 160 })).status).toBe(200)
  })
})
