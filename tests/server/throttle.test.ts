// The attempt limits (server/utils/throttle.ts): a point is used BEFORE the password or code is
// checked, so parallel guesses cannot all be checked; a tripped limit is a 429 in the one error shape
// that says when to try again, and it recovers when its window has passed. The window is 6 s here
// (NUXT_AUTH_THROTTLE_WINDOW_SECONDS); the product default is 15 minutes. Every client here is
// 127.0.0.1, and X-Forwarded-For is not believed (no NUXT_TRUSTED_PROXIES).
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, linkIn, signedIn, uniqueEmail, type Reply } from '../support/client'
import { latestMailText } from '../support/mail'

const WINDOW_MS = 6000
const waitForWindow = () => new Promise((r) => setTimeout(r, WINDOW_MS + 300))

function expectTooMany(reply: Reply, message: RegExp) {
  expect(reply.status).toBe(429)
  expect(reply.body.data.code).toBe('too-many')
  expect(reply.body.statusMessage).toMatch(message)
  expect(reply.body.statusMessage).toMatch(/Try again in \d+ seconds?\.$/)
  expect(Number(reply.headers.get('retry-after'))).toBeGreaterThan(0)
  expect(Number(reply.headers.get('retry-after'))).toBeLessThanOrEqual(WINDOW_MS / 1000)
}

describe('attempt limits', async () => {
  const { databasePath } = await useBuiltApp({
    env: {
      NUXT_AUTH_THROTTLE_WINDOW_SECONDS: String(WINDOW_MS / 1000),
      NUXT_AUTH_LOGIN_PER_EMAIL: '3',
      NUXT_AUTH_LOGIN_PER_ADDRESS: '200',
      NUXT_AUTH_JOIN_PER_ADDRESS: '4',
      NUXT_AUTH_RESET_PER_EMAIL: '3',
      NUXT_AUTH_RESET_PER_ADDRESS: '8',
      NUXT_AUTH_SIGNUP_PER_ADDRESS: '2',
    },
  })

  it('50 parallel wrong passwords for one account: exactly 3 are checked (401), the other 47 refused before the check (429)', async () => {
    const replies = await Promise.all(Array.from({ length: 50 }, () => new Client().post('/api/auth/login', { email: demo.host, password: 'a wrong guess' })))
    const statuses = replies.map((r) => r.status)
    // Each 401 is one scrypt check that found the password wrong; a 429 never reached the check.
    expect(statuses.filter((s) => s === 401)).toHaveLength(3)
    expect(statuses.filter((s) => s === 429)).toHaveLength(47)
    for (const reply of replies.filter((r) => r.status === 429)) expectTooMany(reply, /^Too many sign-in attempts for host@brackenford\.test\./)
    // While the limit holds, even the right password is not checked.
    expect((await new Client().post('/api/auth/login', { email: demo.host, password: 'hob-demo-2026' })).status).toBe(429)
    await waitForWindow()
    expect((await new Client().post('/api/auth/login', { email: demo.host, password: 'hob-demo-2026' })).status).toBe(200)
  })

  it('per e-mail: the fourth wrong try is refused even with the right password; another account is not affected', async () => {
    const client = new Client()
    for (let i = 0; i < 3; i++) expect((await client.post('/api/auth/login', { email: demo.camera, password: 'wrong password' })).status).toBe(401)
    expectTooMany(await client.post('/api/auth/login', { email: demo.camera, password: 'hob-demo-2026' }), /^Too many sign-in attempts for camera@brackenford\.test\./)
    expect((await client.post('/api/auth/login', { email: demo.viewer, password: 'hob-demo-2026' })).status).toBe(200)
    await waitForWindow()
    expect((await client.post('/api/auth/login', { email: demo.camera, password: 'hob-demo-2026' })).status).toBe(200)
  })

  it('join codes: wrong guesses from one address are limited, and recover', async () => {
    const client = new Client()
    for (let i = 0; i < 4; i++) expect((await client.post('/api/join', { code: `ZZZ99${i}` })).status).toBe(404)
    expectTooMany(await client.post('/api/join', { code: 'ZZZ995' }), /^Too many join-code attempts from this device\./)
    await waitForWindow()
    expect((await client.post('/api/join', { code: 'ZZZ996' })).status).toBe(404)
  })

  it('accepting an invite spends the sign-in attempts of the invited address before its password is checked', async () => {
    const producer = await signedIn(demo.producer)
    const studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    const email = uniqueEmail('invited')
    // An account made by a first invite, then removed, then invited again: the second invite asks for its password.
    await producer.post(`/api/studios/${studioId}/invites`, { email, role: 'camera' })
    const first = linkIn(await latestMailText(databasePath, email), '/invite/')
    const made = await new Client().post(`/api/invites/${first.split('/').pop()}/accept`, { name: 'Ines Marlow', password: 'ines own password' })
    expect(made.status).toBe(200)
    expect((await producer.delete(`/api/studios/${studioId}/members/${made.body.user.id}`)).status).toBe(204)
    await producer.post(`/api/studios/${studioId}/invites`, { email, role: 'camera' })
    const second = linkIn(await latestMailText(databasePath, email), '/invite/').split('/').pop()
    // Two wrong sign-ins first: the invite shares the address's sign-in limit (3), so one guess is left.
    for (let i = 0; i < 2; i++) expect((await new Client().post('/api/auth/login', { email, password: 'a guessed password' })).status).toBe(401)
    const guesses = await Promise.all(Array.from({ length: 10 }, () => new Client().post(`/api/invites/${second}/accept`, { name: 'X', password: 'a guessed password' })))
    expect(guesses.map((g) => g.status).sort()).toEqual([401, ...Array(9).fill(429)])
    expect(guesses.find((g) => g.status === 401)!.body.data.field).toBe('password')
    for (const g of guesses.filter((g) => g.status === 429)) expectTooMany(g, /^Too many sign-in attempts for invited-/)
    await waitForWindow()
    expect((await new Client().post(`/api/invites/${second}/accept`, { name: 'X', password: 'ines own password' })).status).toBe(200)
  })

  it('reset requests: three mails per e-mail, eight requests per address whatever X-Forwarded-For says', async () => {
    for (let i = 0; i < 3; i++) expect((await new Client().post('/api/auth/password-reset', { email: demo.viewer })).status).toBe(202)
    expectTooMany(await new Client().post('/api/auth/password-reset', { email: demo.viewer }), /^Too many reset mails for viewer@brackenford\.test\./)
    // Four used by the address so far (the refused one too); four more, each claiming another address, pass.
    for (let i = 0; i < 4; i++) {
      const reply = await new Client().call('POST', '/api/auth/password-reset', { email: uniqueEmail('nobody') }, { 'x-forwarded-for': `203.0.113.${i + 1}` })
      expect(reply.status).toBe(202)
    }
    const refused = await new Client().call('POST', '/api/auth/password-reset', { email: uniqueEmail('nobody') }, { 'x-forwarded-for': '198.51.100.7' })
    expectTooMany(refused, /^Too many reset requests from this network\./)
    await waitForWindow()
    expect((await new Client().post('/api/auth/password-reset', { email: demo.viewer })).status).toBe(202)
  })

  it('sign-up: two new accounts per address in the window, then a 429', async () => {
    const signUp = () => new Client().post('/api/auth/signup', { name: 'New Cook', email: uniqueEmail('new'), password: 'a long new password', studioName: 'New Kitchen' })
    expect((await signUp()).status).toBe(201)
    expect((await signUp()).status).toBe(201)
    expectTooMany(await signUp(), /^Too many new accounts from this network\./)
  })
})
