// Sessions that end at once: each account has a session version that every session carries from
// its sign-in, and the one guard (server/utils/guard.ts) refuses a session whose version is behind:
// the next request answers 401 and clears the cookie, and a socket with that cookie is refused.
// Password hashes are scrypt at OWASP's cost, and an older hash is made again at sign-in.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, linkIn, signedIn, uniqueEmail, type Reply } from '../support/client'
import { latestMailText } from '../support/mail'
import { insertShoot } from '../support/shoot-row'
import { connect, emitAck, type TestSocket } from '../support/sockets'
import { queryFile } from '../support/sqlite'

/** The 401 of an ended session: the one error shape, and a Set-Cookie that empties the session cookie. */
function expectEnded(reply: Reply) {
  expect(reply.status).toBe(401)
  expect(reply.body.data.code).toBe('signed-out')
  expect(reply.body.statusMessage).toMatch(/^This session was ended \(signed out everywhere, a new password, or removed from a studio\)\. Sign in again\.$/)
  const cleared = reply.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))
  expect(cleared, 'a Set-Cookie clearing the session').toBeTruthy()
  expect(cleared).toMatch(/^nuxt-session=;|Max-Age=0|Expires=Thu, 01 Jan 1970/i)
}

async function newAccount(label: string, password = 'a long first password') {
  const email = uniqueEmail(label)
  const client = new Client()
  expect((await client.post('/api/auth/signup', { name: 'Sessions Cook', email, password, studioName: 'Sessions Kitchen' })).status).toBe(201)
  return { email, password, client }
}

describe('sessions', async () => {
  const { databasePath } = await useBuiltApp()

  it('a password reset ends a second browser\'s session at its next request', async () => {
    const { email, password } = await newAccount('reset')
    const second = await signedIn(email, password)
    expect((await second.get('/api/me')).status).toBe(200)
    expect((await new Client().post('/api/auth/password-reset', { email })).status).toBe(202)
    const token = linkIn(await latestMailText(databasePath, email), '/reset/').split('/').pop()
    expect((await new Client().post(`/api/auth/password-reset/${token}`, { password: 'a long second password' })).status).toBe(200)

    const stale = second.cookie
    expectEnded(await second.get('/api/me'))
    // The cleared cookie is gone from the jar, and the old one stays refused if replayed.
    expect((await second.get('/api/me')).status).toBe(401)
    expect((await new Client().call('GET', '/api/me', undefined, { cookie: stale })).status).toBe(401)
    expect((await signedIn(email, 'a long second password').then((c) => c.get('/api/me'))).status).toBe(200)
  })

  it('sign out everywhere ends the other sessions, keeps this one, and ends their sockets', async () => {
    const { email, password, client: here } = await newAccount('everywhere')
    const other = await signedIn(email, password)
    const studioId = (await other.get('/api/me')).body.memberships[0].studioId
    const shootId = await insertShoot(databasePath, studioId, 'Sessions shoot')
    const join = (socket: TestSocket) => emitAck<{ ok: boolean; error?: { code: string; message: string } }>(socket, 'shoot:join', { shootId })
    const live = await connect(other)
    try {
      expect((await join(live)).ok).toBe(true)
      const otherCookie = other.cookie
      const done = await here.post('/api/auth/logout-everywhere')
      expect(done.status).toBe(200)
      expect(done.body.message).toBe('Signed out on every other browser and device. This one stays signed in.')

      expectEnded(await other.get(`/api/studios/${studioId}`))
      expect((await here.get(`/api/studios/${studioId}`)).status).toBe(200)
      expect((await here.get('/api/me')).body.user.email).toBe(email)
      // A socket opened before: its next message meets the guard, which reads the version.
      const refused = await join(live)
      expect(refused.ok).toBe(false)
      expect(refused.error).toMatchObject({ code: 'signed-out', message: expect.stringMatching(/^This session was ended/) })
      // A new socket with the old cookie: the socket session check reads it as no one's session.
      const late = await connect(Object.assign(new Client(), { cookie: otherCookie }))
      try {
        expect((await join(late)).error).toMatchObject({ code: 'signed-out', message: 'Sign in first.' })
      } finally {
        late.disconnect()
      }
    } finally {
      live.disconnect()
    }
  })

  it('removal from a studio ends the removed member\'s session at its next request', async () => {
    const producer = await signedIn(demo.producer)
    const studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    const email = uniqueEmail('removed')
    await producer.post(`/api/studios/${studioId}/invites`, { email, role: 'camera' })
    const token = linkIn(await latestMailText(databasePath, email), '/invite/').split('/').pop()
    const member = new Client()
    const joined = await member.post(`/api/invites/${token}/accept`, { name: 'Removed Cook', password: 'a long member password' })
    expect(joined.status).toBe(200)
    expect((await member.get(`/api/studios/${studioId}/members`)).status).toBe(200)
    // A socket on a shoot of the studio: its guard reads are kept in memory between changes
    // (server/utils/access-reads.ts), and the removal must reach its very next message.
    const shootId = await insertShoot(databasePath, studioId, 'Removal shoot')
    const live = await connect(member)
    try {
      const join = () => emitAck<{ ok: boolean; error?: { code: string } }>(live, 'shoot:join', { shootId })
      expect((await join()).ok).toBe(true)
      expect((await join()).ok).toBe(true)

      expect((await producer.delete(`/api/studios/${studioId}/members/${joined.body.user.id}`)).status).toBe(204)
      expect((await join()).error?.code).toBe('signed-out')
    } finally {
      live.disconnect()
    }
    expectEnded(await member.get('/api/me'))
    // The producer who removed them is not affected.
    expect((await producer.get(`/api/studios/${studioId}/members`)).status).toBe(200)
  })

  it('new passwords are hashed with scrypt at OWASP\'s cost (N=2^17, r=8, p=1)', async () => {
    const { email } = await newAccount('cost')
    const [row] = await queryFile<{ password_hash: string }>(databasePath, `SELECT password_hash FROM users WHERE email = '${email}'`)
    // OWASP Password Storage Cheat Sheet: scrypt with N=2^17, r=8, p=1. PHC string format of @adonisjs/hash.
    expect(row!.password_hash).toMatch(/^\$scrypt\$n=131072,r=8,p=1\$/)
  })

  it('an old N=2^14 hash becomes a new-cost hash at the next successful sign-in, and the password still works', async () => {
    const { email } = await newAccount('rehash')
    // The hash Hobline made before this change: @adonisjs/hash's Scrypt with its defaults (N=2^14).
    const old = await new Hash(new Scrypt({ cost: 2 ** 14, blockSize: 8, parallelization: 1 })).make('an old stored password')
    expect(old).toMatch(/^\$scrypt\$n=16384,r=8,p=1\$/)
    await queryFile(databasePath, `UPDATE users SET password_hash = '${old}' WHERE email = '${email}'`)
    const read = async () => (await queryFile<{ password_hash: string }>(databasePath, `SELECT password_hash FROM users WHERE email = '${email}'`))[0]!.password_hash

    expect((await new Client().post('/api/auth/login', { email, password: 'a wrong password' })).status).toBe(401)
    expect(await read()).toBe(old)
    expect((await new Client().post('/api/auth/login', { email, password: 'an old stored password' })).status).toBe(200)
    const now = await read()
    expect(now).toMatch(/^\$scrypt\$n=131072,r=8,p=1\$/)
    expect(now).not.toBe(old)
    expect((await new Client().post('/api/auth/login', { email, password: 'an old stored password' })).status).toBe(200)
  })
})
