// A signed-in member opens another studio (POST /api/studios): they become its producer and the app
// works in it; signed out it is refused (401); bad input is refused (400) with a message that names the
// field by the form's label (Studio name, Locale, Currency) and says what to write.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn, uniqueEmail } from '../support/client'

describe('opening another studio', async () => {
  await useBuiltApp()

  it('makes the signed-in member the new studio\'s producer, and the app works in it', async () => {
    const viewer = await signedIn(demo.viewer)
    const res = await viewer.post('/api/studios', { name: '  Lowfield Supper Club ', locale: 'de-DE', currency: 'eur' })
    expect(res.status).toBe(201)
    expect(res.body.studio).toEqual({ id: expect.any(Number), name: 'Lowfield Supper Club', locale: 'de-DE', currency: 'EUR', timeZone: 'UTC' })
    const id = res.body.studio.id
    expect(res.body.memberships).toEqual([
      { studioId: 1, studioName: 'Brackenford Test Kitchen', role: 'viewer' },
      { studioId: id, studioName: 'Lowfield Supper Club', role: 'producer' },
    ])
    const me = await viewer.get('/api/me')
    expect(me.body.studioId).toBe(id)
    // A producer there: the settings (crew.manage) open and change.
    const settings = await viewer.get(`/api/studios/${id}`)
    expect(settings.status).toBe(200)
    expect(settings.body).toMatchObject({ name: 'Lowfield Supper Club', locale: 'de-DE', currency: 'EUR' })
    expect((await viewer.patch(`/api/studios/${id}`, { unitSystem: 'metric' })).status).toBe(200)
    // Still a viewer in the demo studio.
    expect((await viewer.patch('/api/studios/1', { unitSystem: 'metric' })).status).toBe(403)
  })

  it('a member who signed up opens a second studio; sign-up and this make studios the same way', async () => {
    const client = new Client()
    const email = uniqueEmail('second')
    const made = await client.post('/api/auth/signup', { name: 'Odile Fairbrother', email, password: 'a long enough phrase', studioName: 'First Hob' })
    expect(made.status).toBe(201)
    const first = await client.get(`/api/studios/${made.body.memberships[0].studioId}`)
    const second = await client.post('/api/studios', { name: 'Second Hob', locale: 'en-GB', currency: 'GBP' })
    expect(second.status).toBe(201)
    const again = await client.get(`/api/studios/${second.body.studio.id}`)
    expect(again.body).toEqual({ ...first.body, id: second.body.studio.id, name: 'Second Hob' })
    expect(second.body.memberships.map((m: { role: string }) => m.role)).toEqual(['producer', 'producer'])
  })

  it('refuses a signed-out caller (401)', async () => {
    const res = await new Client().post('/api/studios', { name: 'Nobody\'s Kitchen', locale: 'en-GB', currency: 'GBP' })
    expect(res.status).toBe(401)
    expect(res.body.statusMessage).toMatch(/Sign in/)
  })

  it.each([
    [{ name: '   ', locale: 'en-GB', currency: 'GBP' }, 'name', /studio name/i],
    [{ locale: 'en-GB', currency: 'GBP' }, 'name', /studio name/i],
    [{ name: 'x'.repeat(121), locale: 'en-GB', currency: 'GBP' }, 'name', /^Studio name: write at most 120 characters/],
    [{ name: 'Bad Locale Kitchen', locale: 'english', currency: 'GBP' }, 'locale', /language and country from the list/],
    [{ name: 'Bad Locale Kitchen', locale: 'en-gb', currency: 'GBP' }, 'locale', /^Language and country: /],
    [{ name: 'Bad Money Kitchen', locale: 'en-GB', currency: 'QQQ' }, 'currency', /currency from the list/],
    [{ name: 'Bad Money Kitchen', locale: 'en-GB' }, 'currency', /currency/i],
    [{ name: 'Bad Clock Kitchen', locale: 'en-GB', currency: 'GBP', timeZone: 'Mars/Olympus_Mons' }, 'timeZone', /time zone from the list/],
  ])('refuses %j (400) naming %s by its label', async (body, field, message) => {
    const producer = await signedIn(demo.producer)
    const before = (await producer.get('/api/me')).body.memberships.length
    const res = await producer.post('/api/studios', body)
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe(field)
    expect(res.body.statusMessage).toMatch(message)
    expect((await producer.get('/api/me')).body.memberships).toHaveLength(before)
  })
})
