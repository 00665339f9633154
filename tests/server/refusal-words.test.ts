// Every refusal is in a crew's words (DEVELOPERS.md, "Errors"): the messages the built app answers
// to a pass of the generated-input campaign (HOBLINE_WORDS_RUNS payloads per route and per shoot
// command, 25 by default; tests/support/campaign-targets.ts) and to hand-picked refusals (ids in
// addresses that name nothing, unknown addresses, the wrong content type, an oversized body, bad
// queries, strangers and other sites, socket commands the shoot refuses) must pass the wording
// check of tests/support/refusal-words.ts: no request key in front, no dotted path, no camelCase or
// snake_case identifier, no route parameter, zod or JavaScript wording. `field` and
// `data.issues[].field` keep the request's keys, for programs.
import { url } from '@nuxt/test-utils/e2e'
import fc from 'fast-check'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { SHOOT_COMMAND_TYPES } from '../../shared/types/shoot'
import { shootCommandSchema } from '../../shared/utils/shoot-schema'
import { jsonBodies } from '../support/campaign-payloads'
import { campaignIds, commandBases, type Ids, LIMITS_LIFTED, send, targets } from '../support/campaign-targets'
import { useBuiltApp } from '../support/app'
import { Client, demo, type Json, signedIn } from '../support/client'
import { wordsProblem } from '../support/refusal-words'
import { connect, emitAck, type TestSocket } from '../support/sockets'

const RUNS = Number(process.env.HOBLINE_WORDS_RUNS || 25)
const SEED = Number(process.env.HOBLINE_CAMPAIGN_SEED || 20261202)

interface Heard { where: string; message: string }

describe('refusals in a crew\'s words', async () => {
  await useBuiltApp({ env: LIMITS_LIFTED })
  const heard: Heard[] = []
  let producer: Client
  let viewer: Client
  let socket: TestSocket
  let ids: Ids

  /** Keeps a refusal's message and every issue's message; the answer must be a refusal. */
  function hear(where: string, status: number, body: Json) {
    expect(status, `${where}: ${JSON.stringify(body)?.slice(0, 300)}`).toBeGreaterThanOrEqual(400)
    expect(status, where).toBeLessThan(500)
    heard.push({ where, message: String(body?.statusMessage) })
    for (const issue of body?.data?.issues ?? []) heard.push({ where: `${where} (issue)`, message: String(issue.message) })
  }

  function hearAck(where: string, reply: { ok: boolean; error?: { message: string } }) {
    expect(reply.ok, `${where}: ${JSON.stringify(reply)}`).toBe(false)
    heard.push({ where, message: String(reply.error?.message) })
  }

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    viewer = await signedIn(demo.viewer)
    ids = await campaignIds(producer)
    socket = await connect(producer)
    expect(await emitAck(socket, 'shoot:join', { shootId: ids.shoot })).toMatchObject({ ok: true })
  })
  afterAll(() => socket?.disconnect())

  it(`a campaign pass: ${RUNS} generated payloads for every mutating route`, async () => {
    for (const target of targets) {
      for (const p of fc.sample(target.payloads(ids), { numRuns: RUNS, seed: SEED })) {
        const reply = await send(producer, target.method, p.path, p.body)
        hear(`${target.method} ${target.file}`, reply.status, reply.body as Json)
      }
    }
  }, 120_000)

  it(`a campaign pass: ${RUNS} generated payloads for every shoot command, over the socket`, async () => {
    for (const type of SHOOT_COMMAND_TYPES) {
      const applies = (c: unknown) => (c as { shootId?: unknown } | null)?.shootId === ids.shoot && shootCommandSchema.safeParse(c).success
      const arb = jsonBodies({ shootId: ids.shoot, type, ...commandBases[type] }).filter((c) => !applies(c))
      for (const p of fc.sample(arb, { numRuns: RUNS, seed: SEED })) hearAck(`socket ${type}`, await emitAck(socket, 'shoot:command', p))
    }
  }, 120_000)

  it('hand-picked: addresses, types, sizes, queries, strangers, other sites', async () => {
    const studio = `/api/studios/${ids.studio}`
    const anon = new Client()
    const cases: [string, () => Promise<{ status: number; body: Json }>][] = [
      ['recipe id not a number', () => producer.get('/api/recipes/abc')],
      ['studio id not a number', () => producer.get('/api/studios/twelve/prices')],
      ['price id not a number', () => producer.delete(`${studio}/prices/1.5`)],
      ['crew member id not a number', () => producer.patch(`${studio}/members/x`, { role: 'viewer' })],
      ['invite id not a number', () => producer.delete(`${studio}/invites/0`)],
      ['mail id not a number', () => producer.get(`${studio}/outbox/-3`)],
      ['step id not a number', () => producer.delete(`/api/recipes/${ids.recipe}/steps/NaN/photo`)],
      ['join code id not a number', () => producer.delete(`/api/shoots/${ids.shoot}/join-codes/studioId`)],
      ['episode id not a number', () => producer.get('/api/episodes/recipeIds/plan')],
      ['shoot id not a number', () => producer.get('/api/shoots/shootId')],
      ['unknown address', () => producer.get('/api/recipeBook/1')],
      ['unknown method', () => producer.put(`/api/recipes/${ids.recipe}`, {})],
      ['no such recipe', () => producer.get('/api/recipes/99999999')],
      ['form post', () => producer.call('POST', `${studio}/recipes`, 'title=Soup', { 'content-type': 'application/x-www-form-urlencoded' })],
      ['text body', () => producer.call('POST', `${studio}/episodes`, '{"title":"Soup"}', { 'content-type': 'text/plain' })],
      ['broken JSON', () => producer.call('POST', `${studio}/episodes`, '{"title":', { 'content-type': 'application/json' })],
      ['a list, not an object', () => producer.post(`${studio}/episodes`, [1, 2])],
      ['over 2 MB', () => producer.post(`${studio}/recipes`, { title: 'x'.repeat(2.5 * 1024 * 1024), servings: 2 })],
      ['import over 512 KB', () => producer.call('POST', `${studio}/recipes/import?preview=1`, '<p>'.repeat(200_000), { 'content-type': 'text/html' })],
      ['import not JSON', () => producer.call('POST', `${studio}/recipes/import?preview=1`, '{"@type": "Recipe", "name": ', { 'content-type': 'application/ld+json' })],
      ['import with a bad step time', () => producer.call('POST', `${studio}/recipes/import?preview=1`, JSON.stringify({
        '@context': 'https://schema.org', '@type': 'Recipe', 'name': 'x'.repeat(200), 'recipeYield': '2', 'recipeIngredient': ['1 cup flour'],
      }), { 'content-type': 'application/ld+json' })],
      ['empty price list', () => producer.call('POST', `${studio}/prices/import`, ' ', { 'content-type': 'text/csv' })],
      ['price list of bad rows', () => producer.call('POST', `${studio}/prices/import`, 'item,package size,unit,price,currency\nSalt,-1,kgs,free,XX\n', { 'content-type': 'text/csv' })],
      ['plan query', () => producer.get(`/api/episodes/${ids.episode}/plan?hands=99`)],
      ['plan query, parallel', () => producer.get(`/api/episodes/${ids.episode}/plan?parallel=yes`)],
      ['cost query', () => producer.get(`/api/recipes/${ids.recipe}/cost?servings=lots`)],
      ['scaled query', () => producer.get(`/api/recipes/${ids.recipe}/scaled?units=imperial`)],
      ['recipe search', () => producer.get(`${studio}/recipes?q=${'x'.repeat(101)}`)],
      ['outbox page', () => producer.get(`${studio}/outbox?limit=0`)],
      ['photo size', () => producer.get(`/api/photos/studio-${ids.studio}/recipe-${ids.recipe}/a.jpg?size=huge`)],
      ['photo address', () => producer.get('/api/photos/..%2F..%2Fetc%2Fpasswd')],
      ['photo as JSON', () => producer.post(`/api/recipes/${ids.recipe}/photo`, { photo: 'x' })],
      ['step time as text', () => producer.post(`${studio}/recipes`, { title: 'Soup', servings: 2, steps: [{ text: 'Boil', durationMin: 'ten' }] })],
      ['step waits for a later step', () => producer.post(`${studio}/recipes`, { title: 'Soup', servings: 2, steps: [{ text: 'Boil', after: [2] }, { text: 'Eat' }] })],
      ['ingredient price of another studio', () => producer.post(`${studio}/recipes`, {
        title: 'Soup', servings: 2, ingredients: [{ key: 'salt', min: 1, max: 1, unit: 'g', item: 'salt', priceId: 99999999 }],
      })],
      ['price size zero', () => producer.post(`${studio}/prices`, { item: 'Salt', packageSize: 0, packageUnit: 'kg', priceMinor: 65, currency: 'GBP' })],
      ['price currency', () => producer.post(`${studio}/prices`, { item: 'Salt', packageSize: 1, packageUnit: 'kg', priceMinor: 65, currency: 'pounds' })],
      ['settings kitchen', () => producer.patch(studio, { kitchen: { hands: 0, burners: 1, ovens: 1, racksPerOven: 1, parallelRecipes: true } })],
      ['settings name', () => producer.patch(studio, { name: '' })],
      ['episode recipes twice', () => producer.post(`${studio}/episodes`, { title: 'Twice', recipeIds: [ids.recipe, ids.recipe] })],
      ['episode recipe ids', () => producer.post(`${studio}/episodes`, { title: 'Bad', recipeIds: ['soup'] })],
      ['stale recipe version', () => producer.patch(`/api/recipes/${ids.recipe}`, { version: ids.version + 50, title: 'Campaign stew', servings: 4 })],
      ['join code minutes', () => producer.post(`/api/shoots/${ids.shoot}/join-codes`, { role: 'camera', minutes: 9999 })],
      ['shoot mode', () => producer.post(`/api/episodes/${ids.episode}/shoots`, { mode: 'live' })],
      ['command over HTTP, unknown type', () => producer.post(`/api/shoots/${ids.shoot}/commands`, { type: 'timer.explode' })],
      ['command over HTTP, refused by the shoot', () => producer.post(`/api/shoots/${ids.shoot}/commands`, { type: 'step.previous' })],
      ['switch studio', () => producer.put('/api/me/studio', { studioId: 'mine' })],
      ['sign-up', () => anon.post('/api/auth/signup', { name: '', email: 'chef', password: 'x', studioName: '' })],
      ['sign-up, short password', () => anon.post('/api/auth/signup', { name: 'Ada', email: 'ada-words@example.test', password: 'short', studioName: 'Ada Kitchen' })],
      ['sign-up, taken address', () => anon.post('/api/auth/signup', { name: 'Ada', email: demo.host, password: 'a long enough password', studioName: 'Ada Kitchen' })],
      ['sign-in, wrong password', () => anon.post('/api/auth/login', { email: demo.host, password: 'not the password at all' })],
      ['join, unknown code', () => anon.post('/api/join', { code: 'QQQ-QQQ' })],
      ['invite, member already', () => producer.post(`${studio}/invites`, { email: demo.host, role: 'host' })],
      ['invite, role', () => producer.post(`${studio}/invites`, { email: 'new-words@example.test', role: 'director' })],
      ['stranger', () => anon.get(`${studio}/prices`)],
      ['viewer may not edit', () => viewer.post(`${studio}/prices`, { item: 'Salt', packageSize: 1, packageUnit: 'kg', priceMinor: 65, currency: 'GBP' })],
      ['another site', () => producer.call('POST', `${studio}/episodes`, { title: 'x' }, { origin: 'https://elsewhere.example.net' })],
      ['reset link never given', () => anon.post('/api/auth/password-reset/not-a-token', { password: 'a long enough password' })],
      ['invite link never given', () => anon.get('/api/invites/not-a-token')],
    ]
    for (const [where, call] of cases) {
      const reply = await call()
      hear(where, reply.status, reply.body)
    }
  }, 60_000)

  it('hand-picked over the socket: no shoot named, another shoot, commands the shoot refuses', async () => {
    hearAck('join with no shoot', await emitAck(socket, 'shoot:join', {}))
    hearAck('join another shoot', await emitAck(socket, 'shoot:join', { shootId: 99999999 }))
    hearAck('snapshot with the shoot as text', await emitAck(socket, 'shoot:snapshot', { shootId: String(ids.shoot) }))
    const command = (c: Record<string, unknown>) => emitAck<{ ok: boolean; error?: { message: string } }>(socket, 'shoot:command', { shootId: ids.shoot, ...c })
    hearAck('unknown command', await command({ type: 'timer.explode' }))
    hearAck('no command', await command({}))
    hearAck('timer with no name', await command({ type: 'timer.start', label: ' ', durationMs: 60_000 }))
    hearAck('timer too long', await command({ type: 'timer.start', label: 'Stock', durationMs: 90_000_000 }))
    hearAck('speed too fast', await command({ type: 'clock.speed', speed: 99 }))
    hearAck('note with no text', await command({ type: 'marker.add', kind: 'note' }))
    hearAck('before the start: previous step', await command({ type: 'step.previous' }))
    hearAck('before the start: pause', await command({ type: 'shoot.pause' }))
    hearAck('unknown timer', await command({ type: 'timer.pause', timerId: 'nope' }))
    hearAck('unknown wait', await command({ type: 'wait.start', stepId: 'nope' }))
  })

  it('every message passes the wording check; the keys stay in `field`', async () => {
    console.log(`\n${heard.length} refusal messages heard (${new Set(heard.map((h) => h.message)).size} distinct)\n`)
    // HOBLINE_WORDS_PRINT=1 lists every distinct message, to read them as a person would.
    if (process.env.HOBLINE_WORDS_PRINT) console.log([...new Set(heard.map((h) => h.message))].sort().join('\n'))
    expect(heard.length).toBeGreaterThan(RUNS * targets.length)
    const wrong = [...new Map(heard.map((h) => [h.message, h])).values()]
      .map((h) => ({ ...h, problem: wordsProblem(h.message) }))
      .filter((h) => h.problem)
      .map((h) => `${h.where}: ${h.problem}: "${h.message.slice(0, 240)}"`)
    expect(wrong).toEqual([])

    // The message is for people, the key for programs: a form places the message by `field`.
    const step = await producer.post(`/api/studios/${ids.studio}/recipes`, { title: 'Soup', servings: 2, steps: [{ text: 'a' }, { text: 'b' }, { text: 'c', durationMin: 'ten' }] })
    expect(step.status).toBe(400)
    expect(step.body.statusMessage).toBe('Step 3, shortest time: write a whole number of seconds, such as 900 for 15 minutes, or leave it empty.')
    expect(step.body.data).toMatchObject({ code: 'invalid', field: 'steps.2.durationMin', issues: [{ field: 'steps.2.durationMin' }] })
    const id = await producer.get('/api/recipes/abc')
    expect(id.body).toMatchObject({ statusCode: 400, data: { field: 'id' } })
    expect(id.body.statusMessage).toBe('This address names no recipe: the recipe number in it must be a whole number such as 12. Check the link.')
    const form = await fetch(url(`/api/studios/${ids.studio}/episodes`), { method: 'POST', headers: { origin: new URL(url('/')).origin, cookie: producer.cookie, 'content-type': 'text/plain' }, body: '{}' })
    expect((await form.json()).data).toMatchObject({ code: 'unsupported-type', field: 'body' })
  })
})
