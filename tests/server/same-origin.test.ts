// Cross-site request forgery and floods, over the built app: a form on another site cannot change
// anything with a visitor's cookie (server/middleware/01.same-origin.ts), routes that read JSON read
// nothing else (server/utils/validate.ts), a socket handshake from another site is refused and one
// socket cannot send faster than its limit (server/plugins/04.socket.ts). The rule is in
// DEVELOPERS.md, "Security"; the headers are W3C Fetch Metadata (Sec-Fetch-Site) and RFC 6454 (Origin).
import { url } from '@nuxt/test-utils/e2e'
import { io } from 'socket.io-client'
import { beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '../../server/db/demo'
import { useBuiltApp } from '../support/app'
import { appOrigin, Client, demo, signedIn } from '../support/client'
import { insertShoot } from '../support/shoot-row'
import { connect, emitAck } from '../support/sockets'

const ELSEWHERE = 'https://recipes-elsewhere.example'
/** What a browser sends with a form that another site's page submits. */
const crossSiteForm = { 'content-type': 'application/x-www-form-urlencoded', 'origin': ELSEWHERE, 'sec-fetch-site': 'cross-site' }

type Handshake = { connected: true } | { connected: false; message: string; data: { code?: string; message?: string } | undefined }

/** Opens a socket with exactly these headers; says whether the handshake was let in. */
function handshake(headers: Record<string, string>, transport: 'websocket' | 'polling'): Promise<Handshake> {
  const socket = io(url('/'), { path: '/socket.io', transports: [transport], extraHeaders: headers, reconnection: false, forceNew: true })
  return new Promise((resolve) => {
    socket.once('connect', () => {
      socket.disconnect()
      resolve({ connected: true })
    })
    socket.once('connect_error', (error: Error & { data?: { code?: string; message?: string } }) => {
      socket.disconnect()
      resolve({ connected: false, message: error.message, data: error.data })
    })
  })
}

describe('same-origin checks', async () => {
  const { databasePath } = await useBuiltApp()
  let studioId = 0
  let shootId = 0
  let viewerId = 0

  beforeAll(async () => {
    const producer = await signedIn(demo.producer)
    studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    shootId = await insertShoot(databasePath, studioId, 'Same-origin shoot')
    const members = (await producer.get(`/api/studios/${studioId}/members`)).body
    viewerId = (members.members ?? members).find((m: { email: string }) => m.email === demo.viewer).userId
  })

  describe('HTTP', () => {
    it('refuses a cross-site form post with the cookie, and nothing changes', async () => {
      const producer = await signedIn(demo.producer)
      const start = await producer.call('POST', `/api/shoots/${shootId}/commands`, 'type=shoot.start', crossSiteForm)
      expect(start.status).toBe(403)
      expect(start.body.data.code).toBe('cross-site')
      expect(start.body.message).toBe(`This request was refused because it came from ${ELSEWHERE}, not from this site. `
        + 'Use Hobline from its own pages; a program calling the API sends an Origin header naming this site.')
      expect((await producer.get(`/api/shoots/${shootId}`)).body.state.status).toBe('ready')

      const promote = await producer.call('PATCH', `/api/studios/${studioId}/members/${viewerId}`, JSON.stringify({ role: 'producer' }), {
        'content-type': 'application/json', 'origin': ELSEWHERE,
      })
      expect(promote.status).toBe(403)
      const signOut = await producer.call('POST', '/api/auth/logout', '', crossSiteForm)
      expect(signOut.status).toBe(403)
      // The session and the viewer's role are as they were.
      const members = (await producer.get(`/api/studios/${studioId}/members`)).body
      expect((members.members ?? members).find((m: { userId: number }) => m.userId === viewerId).role).toBe('viewer')
    })

    it('refuses what a browser marks as from elsewhere even without a cookie (signing a visitor in as someone else)', async () => {
      const visitor = new Client()
      const signIn = await visitor.call('POST', '/api/auth/login', JSON.stringify({ email: demo.producer, password: DEMO_PASSWORD }), {
        ...crossSiteForm, 'content-type': 'text/plain',
      })
      expect(signIn.status).toBe(403)
      expect(signIn.body.data.code).toBe('cross-site')
      expect((await visitor.get('/api/me')).status).toBe(401)
      // Sec-Fetch-Site alone (a browser that sent no Origin) and an opaque origin are refused alike.
      expect((await new Client().call('POST', '/api/auth/logout', '', { 'origin': '', 'sec-fetch-site': 'same-site' })).status).toBe(403)
      expect((await new Client().call('POST', '/api/auth/logout', '', { origin: 'null' })).status).toBe(403)
    })

    it('refuses a change that carries cookies but says nothing of where it came from, and says what to send', async () => {
      const producer = await signedIn(demo.producer)
      const bare = await producer.call('POST', '/api/auth/logout', undefined, { origin: '' })
      expect(bare.status).toBe(403)
      expect(bare.body.message).toMatch(/carries cookies but no Origin or Sec-Fetch-Site header.*sends an Origin header naming this site\.$/)
      // The same origin on another port is another origin.
      const port = Number(new URL(appOrigin()).port)
      expect((await producer.call('POST', '/api/auth/logout', undefined, { origin: `http://127.0.0.1:${port + 1}` })).status).toBe(403)
      expect((await producer.get('/api/me')).status).toBe(200)
    })

    it('lets same-origin changes through: Sec-Fetch-Site same-origin, or the matching Origin', async () => {
      const producer = await signedIn(demo.producer)
      const bySecFetch = await producer.call('PUT', '/api/me/studio', { studioId }, { 'origin': '', 'sec-fetch-site': 'same-origin' })
      expect(bySecFetch.status).toBe(200)
      const byOrigin = await producer.call('PUT', '/api/me/studio', { studioId }, { 'origin': appOrigin(), 'sec-fetch-site': '' })
      expect(byOrigin.status).toBe(200)
      // A request with no cookie and no browser headers is no one's session: it goes on to the route.
      expect((await new Client().call('POST', '/api/auth/login', { email: demo.producer, password: 'wrong password' }, { origin: '' })).status).toBe(401)
      // Reading is not changing: another site can send a GET but cannot read the answer (no CORS).
      expect((await producer.call('GET', '/api/me', undefined, { origin: ELSEWHERE, 'sec-fetch-site': 'cross-site' })).status).toBe(200)
    })

    it('reads JSON only on JSON routes: forms and text/plain bodies get 415 with what to send', async () => {
      const producer = await signedIn(demo.producer)
      const form = await producer.call('POST', `/api/studios/${studioId}/episodes`, 'title=Form+episode', { 'content-type': 'application/x-www-form-urlencoded' })
      expect(form.status).toBe(415)
      expect(form.body.data).toMatchObject({ code: 'unsupported-type', field: 'body', accepted: ['application/json'] })
      expect(form.body.message).toBe('This address reads JSON only: send it with Content-Type: application/json '
        + '(this was "application/x-www-form-urlencoded"; form posts are refused).')
      // A text/plain form can carry a body that reads as JSON; it is refused all the same.
      const plain = await producer.call('POST', `/api/studios/${studioId}/episodes`, '{"title":"Plain episode"}', { 'content-type': 'text/plain' })
      expect(plain.status).toBe(415)
      const multipart = new FormData()
      multipart.append('title', 'Multipart episode')
      const parts = await fetch(url(`/api/studios/${studioId}/episodes`), { method: 'POST', body: multipart, headers: { cookie: producer.cookie, origin: appOrigin() } })
      expect(parts.status).toBe(415)
      const shootCommand = await producer.call('POST', `/api/shoots/${shootId}/commands`, 'type=shoot.start', { 'content-type': 'application/x-www-form-urlencoded' })
      expect(shootCommand.status).toBe(415)
      const titles = (await producer.get(`/api/studios/${studioId}/episodes`)).body.episodes.map((e: { title: string }) => e.title)
      expect(titles.filter((t: string) => /Form|Plain|Multipart/.test(t))).toEqual([])
      // JSON, and JSON dialects, are read; an empty body is still `{}`.
      expect((await producer.post(`/api/studios/${studioId}/episodes`, { title: 'JSON episode' })).status).toBe(201)
      expect((await producer.call('POST', `/api/studios/${studioId}/episodes`, '{"title":"LD episode"}', { 'content-type': 'application/ld+json' })).status).toBe(201)
      expect((await producer.call('POST', '/api/auth/logout')).status).toBe(204)
    })

    it('keeps uploads working: a price list as a multipart form from this site', async () => {
      const producer = await signedIn(demo.producer)
      const form = new FormData()
      form.append('file', new Blob(['item,package size,unit,price,currency\nSame-origin oats,1,kg,1.10,GBP\n'], { type: 'text/csv' }), 'prices.csv')
      const res = await fetch(url(`/api/studios/${studioId}/prices/import`), { method: 'POST', body: form, headers: { cookie: producer.cookie, origin: appOrigin() } })
      expect(res.status).toBe(201)
      expect((await res.json()).added.map((p: { item: string }) => p.item)).toEqual(['Same-origin oats'])
      // The same upload from another site's form is refused.
      const elsewhere = await fetch(url(`/api/studios/${studioId}/prices/import`), { method: 'POST', body: form, headers: { cookie: producer.cookie, origin: ELSEWHERE } })
      expect(elsewhere.status).toBe(403)
    })
  })

  describe('socket handshake', () => {
    for (const transport of ['websocket', 'polling'] as const) {
      it(`refuses a cross-origin handshake over ${transport}, with the cookie or without`, async () => {
        const producer = await signedIn(demo.producer)
        const crossOrigin: Record<string, string>[] = [{ cookie: producer.cookie, origin: ELSEWHERE }, { origin: ELSEWHERE }, { 'cookie': producer.cookie, 'sec-fetch-site': 'cross-site' }]
        for (const headers of crossOrigin) {
          const refused = await handshake(headers, transport)
          expect(refused).toMatchObject({ connected: false, data: { code: 'cross-site' } })
          expect(refused.connected === false && refused.message).toMatch(/^This connection was refused because .*, not from this site\. Open the shoot from Hobline's own pages/)
        }
        expect(await handshake({ cookie: producer.cookie, origin: appOrigin() }, transport)).toEqual({ connected: true })
        expect(await handshake({ cookie: producer.cookie, 'sec-fetch-site': 'same-origin' }, transport)).toEqual({ connected: true })
        // No browser header at all: a non-browser client, or an older browser's same-origin poll.
        expect(await handshake({ cookie: producer.cookie }, transport)).toEqual({ connected: true })
      })
    }
  })

  describe('per-socket limit', () => {
    it('refuses messages past the burst with too-many and when to retry, per socket, and lets them through again', async () => {
      const producer = await signedIn(demo.producer)
      const flooding = await connect(producer)
      const other = await connect(producer)
      type Reply = { ok?: boolean; t1?: number; error?: { code: string; message: string; retryAfterSeconds: number } }
      const seqNow = async () => (await emitAck<{ state: { seq: number } }>(other, 'shoot:snapshot', { shootId })).state.seq
      const before = await seqNow()
      // 60 pings at once, then a command: the burst of 40 gets through, then about one every 50 ms.
      const pings = Array.from({ length: 60 }, (_, i) => emitAck<Reply>(flooding, 'clock:ping', { t1: i }))
      const command = emitAck<Reply>(flooding, 'shoot:command', { shootId, type: 'marker.add', kind: 'good' })
      const replies = await Promise.all(pings)
      const refused = replies.filter((r) => r.ok === false)
      expect(replies.length - refused.length).toBeGreaterThanOrEqual(40)
      expect(refused.length).toBeGreaterThanOrEqual(15)
      expect(refused[0]!.error).toMatchObject({ code: 'too-many', retryAfterSeconds: expect.any(Number) })
      expect(refused[0]!.error!.retryAfterSeconds).toBeGreaterThan(0)
      expect(refused[0]!.error!.message).toMatch(/^Too many messages from this screen: at most 20 a second \(40 at once\)\. This one was not applied; send it again in [\d.]+ s\.$/)
      // The command over the limit is not applied.
      expect(await command).toMatchObject({ ok: false, error: { code: 'too-many' } })
      expect(await seqNow()).toBe(before)
      // Another socket of the same person has its own bucket, and the flooding one recovers.
      expect((await emitAck<Reply>(other, 'clock:ping', { t1: 1 })).t1).toBe(1)
      await new Promise((r) => setTimeout(r, 1000))
      expect((await emitAck<Reply>(flooding, 'clock:ping', { t1: 2 })).t1).toBe(2)
      flooding.disconnect()
      other.disconnect()
    })
  })
})
