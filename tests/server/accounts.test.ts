// Sign-up, sign-in, the session cookie, /api/me, sign-out, the password rule.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn, uniqueEmail } from '../support/client'

describe('accounts', async () => {
  await useBuiltApp()

  it('sign-up makes a user and a studio with them as its producer, and signs them in', async () => {
    const client = new Client()
    const email = uniqueEmail('owner')
    const res = await client.post('/api/auth/signup', { name: 'Mirela Banks', email, password: 'a long enough phrase', studioName: 'Hillside Pantry' })
    expect(res.status).toBe(201)
    expect(res.body.user).toMatchObject({ name: 'Mirela Banks', email })
    expect(res.body.memberships).toEqual([{ studioId: expect.any(Number), studioName: 'Hillside Pantry', role: 'producer' }])
    const me = await client.get('/api/me')
    expect(me.status).toBe(200)
    expect(me.body.user.email).toBe(email)
    expect(me.body.studioId).toBe(res.body.memberships[0].studioId)
  })

  it('the session cookie is sealed, HttpOnly, SameSite=Lax and Secure in the built app', async () => {
    const client = new Client()
    const raw = await fetch(new URL('/api/auth/login', (await import('@nuxt/test-utils/e2e')).url('/')), {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: demo.viewer, password: 'hob-demo-2026' }),
    })
    expect(raw.status).toBe(200)
    const cookie = raw.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(cookie).toMatch(/Secure/i)
    // Sealed: the cookie value does not show the e-mail or the user id in clear.
    expect(decodeURIComponent(cookie)).not.toContain('viewer@brackenford.test')
    expect(client.cookie).toBe('')
  })

  it('sign-in rotates the session: the session id before sign-in is not the one after', async () => {
    const client = new Client()
    const before = await client.get('/api/_auth/session')
    const login = await client.post('/api/auth/login', { email: demo.host, password: 'hob-demo-2026' })
    expect(login.status).toBe(200)
    const after = await client.get('/api/_auth/session')
    expect(after.body.user.email).toBe(demo.host)
    expect(after.body.id).toEqual(expect.any(String))
    expect(after.body.id).not.toBe(before.body.id)
    const again = await client.post('/api/auth/login', { email: demo.host, password: 'hob-demo-2026' })
    expect(again.status).toBe(200)
    expect((await client.get('/api/_auth/session')).body.id).not.toBe(after.body.id)
  })

  it('sign-out ends the session', async () => {
    const client = await signedIn(demo.host)
    expect((await client.get('/api/me')).status).toBe(200)
    expect((await client.post('/api/auth/logout')).status).toBe(204)
    expect((await client.get('/api/me')).status).toBe(401)
  })

  it('a wrong password is a 401 that says what to check', async () => {
    const res = await new Client().post('/api/auth/login', { email: demo.camera, password: 'not the password' })
    expect(res.status).toBe(401)
    expect(res.body.statusMessage).toMatch(/do not match/)
  })

  it('the password rule: length and not the e-mail, with a message naming the field', async () => {
    const email = uniqueEmail('rule')
    const short = await new Client().post('/api/auth/signup', { name: 'A', email, password: 'short', studioName: 'S' })
    expect(short.status).toBe(400)
    expect(short.body.statusMessage).toBe('Password: use at least 10 characters for the password.')
    expect(short.body.data.field).toBe('password')
    const local = email.split('@')[0]
    const same = await new Client().post('/api/auth/signup', { name: 'A', email, password: `${local}!!`, studioName: 'S' })
    expect(same.status).toBe(400)
    expect(same.body.statusMessage).toMatch(/^Password: .*e-mail/)
  })

  it('a second sign-up with the same address is a 409, and nothing is overwritten', async () => {
    const res = await new Client().post('/api/auth/signup', { name: 'X', email: demo.producer, password: 'another long password', studioName: 'Other' })
    expect(res.status).toBe(409)
    expect((await signedIn(demo.producer)).cookie).not.toBe('')
  })

  it('/api/me lists every studio of the member, and the switcher remembers one', async () => {
    const client = await signedIn(demo.producer)
    const me = await client.get('/api/me')
    expect(me.body.memberships).toEqual([{ studioId: expect.any(Number), studioName: 'Brackenford Test Kitchen', role: 'producer' }])
    const studioId = me.body.memberships[0].studioId
    expect((await client.put('/api/me/studio', { studioId })).status).toBe(200)
    expect((await client.put('/api/me/studio', { studioId: 999999 })).status).toBe(404)
  })
})
