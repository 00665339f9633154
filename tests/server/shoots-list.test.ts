// The shoots of an episode and of a studio over the built app: a real rehearsal of the demo episode
// driven through the commands route at 16×, with markers of every kind, then the lists. Counts are
// worked from the markers sent; pickups still to record follow openPickups (take-log.ts: a pickup
// stays open until a later good take on the same step); the date is the start in the studio's time
// zone (Intl.DateTimeFormat, ECMA-402); kitchen length = 16 × real time (shoot-clock.ts).
import { beforeAll, describe, expect, it } from 'vitest'
import { dateTimeInZone } from '../../shared/utils/time-zone'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn, uniqueEmail } from '../support/client'

describe('shoots of an episode and of a studio', async () => {
  await useBuiltApp()
  let producer: Client
  let viewer: Client
  let rehearsalId: number
  let takeId: number
  let realMs: number

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    viewer = await signedIn(demo.viewer)
    const created = await producer.post('/api/episodes/1/shoots', { mode: 'rehearsal' })
    expect(created.status).toBe(201)
    rehearsalId = created.body.shoot.id
    const send = async (data: Record<string, unknown>) => {
      const r = await producer.post(`/api/shoots/${rehearsalId}/commands`, data)
      expect(r.status, `${JSON.stringify(data)}: ${JSON.stringify(r.body)}`).toBe(200)
    }
    const cook = (created.body.state.runOrder as { stepIds: string[] }[]).findIndex((s) => s.stepIds.length > 0)
    await send({ type: 'clock.speed', speed: 16 })
    await send({ type: 'step.jump', segment: cook, step: 0 })
    const t0 = Date.now()
    await send({ type: 'shoot.start' })
    await send({ type: 'rolling.set', rolling: true }) // chapters from here on, one per step change
    // Step 1: a pickup, then a good take on the same step (the pickup is recorded).
    await send({ type: 'marker.add', kind: 'pickup', text: 'again, closer' })
    await send({ type: 'marker.add', kind: 'good' })
    await send({ type: 'step.next' })
    // Step 2: a flub, a note and a pickup with no good take after it (still to record).
    await send({ type: 'marker.add', kind: 'flub' })
    await send({ type: 'marker.add', kind: 'note', text: 'steam on the lens' })
    await send({ type: 'marker.add', kind: 'pickup' })
    await send({ type: 'step.next' })
    // Step 3: a good take; the pickup of step 2 stays open.
    await send({ type: 'marker.add', kind: 'good' })
    await new Promise((r) => setTimeout(r, 600))
    await send({ type: 'shoot.end', cancelTimers: true })
    realMs = Date.now() - t0
    const take = await producer.post('/api/episodes/1/shoots', { mode: 'take' })
    expect(take.status).toBe(201)
    takeId = take.body.shoot.id
  })

  it('lists the episode\'s shoots newest first with mode, date in the studio\'s zone, length, markers and open pickups', async () => {
    const res = await viewer.get('/api/episodes/1/shoots')
    expect(res.status).toBe(200)
    const studio = (await producer.get('/api/studios/1')).body
    expect(res.body.timeZone).toBe(studio.timeZone)
    expect(res.body.shoots.map((s: { id: number }) => s.id).slice(0, 2)).toEqual([takeId, rehearsalId])
    const take = res.body.shoots[0]
    expect(take).toMatchObject({ mode: 'take', modeText: 'Recording', status: 'ready', started: false, lengthMs: 0, pickupsOpen: 0 })
    expect(take.links).toEqual({ desk: `/shoots/${takeId}/desk`, takes: `/shoots/${takeId}/takes`, report: null })
    const row = res.body.shoots[1]
    expect(row).toMatchObject({ mode: 'rehearsal', modeText: 'Rehearsal', status: 'ended', statusText: 'Ended', started: true })
    expect(row.markers).toEqual({ good: 2, flub: 1, pickup: 2, note: 1 })
    // Chapters are the shoot's own: one where rolling began, one at each of the two step changes while rolling.
    expect(row.chapters).toBe(3)
    expect(row.pickupsOpen).toBe(1)
    expect(row.links).toEqual({ desk: `/shoots/${rehearsalId}/desk`, takes: `/shoots/${rehearsalId}/takes`, report: `/shoots/${rehearsalId}/report` })
    // The date: the start, written in the studio's zone.
    const snapshot = (await producer.get(`/api/shoots/${rehearsalId}`)).body
    expect(row.at).toBe(new Date(snapshot.state.startedAtServerMs).toISOString())
    expect(row.dateText).toBe(dateTimeInZone(new Date(snapshot.state.startedAtServerMs), studio.locale, studio.timeZone))
    // Lengths: real time from start to end, and 16 × that on the shoot clock (to the millisecond's rounding).
    const real = snapshot.state.endedAtServerMs - snapshot.state.startedAtServerMs
    expect(row.realMs).toBe(real)
    expect(real).toBeLessThanOrEqual(realMs)
    expect(Math.abs(row.lengthMs - 16 * real)).toBeLessThanOrEqual(1)
  })

  it('lists the studio\'s shoots, the same rows', async () => {
    const res = await viewer.get('/api/studios/1/shoots')
    expect(res.status).toBe(200)
    const ids = res.body.shoots.map((s: { id: number }) => s.id)
    expect(ids).toContain(rehearsalId)
    expect(ids).toContain(takeId)
    expect(ids).toEqual([...ids].sort((a: number, b: number) => b - a))
    const byEpisode = (await viewer.get('/api/episodes/1/shoots')).body.shoots.find((s: { id: number }) => s.id === rehearsalId)
    expect(res.body.shoots.find((s: { id: number }) => s.id === rehearsalId)).toEqual(byEpisode)
  })

  it('refuses strangers and the signed-out in the one error shape', async () => {
    const outsider = new Client()
    expect((await outsider.post('/api/auth/signup', { name: 'Ola Brenn', email: uniqueEmail('lists'), password: 'a long enough phrase', studioName: 'Elsewhere' })).status).toBe(201)
    for (const path of ['/api/episodes/1/shoots', '/api/studios/1/shoots']) {
      const other = await outsider.get(path)
      expect(other.status).toBe(404)
      expect(other.body).toMatchObject({ statusCode: 404, data: { code: 'not-found' } })
      expect(other.body.message).toMatch(/^There is no such (episode|studio)/)
      const anon = await new Client().get(path)
      expect(anon.status).toBe(401)
      expect(anon.body.data.code).toBe('signed-out')
    }
    const bad = await viewer.get('/api/episodes/1x/shoots')
    expect(bad.status).toBe(400)
    expect(bad.body.data.code).toBe('invalid')
    expect(bad.body.message).toMatch(/episode number in it must be a whole number/)
  })
})
