// Device join codes: one shoot and one role only; expiry and revocation end them.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn } from '../support/client'
import { insertShoot } from '../support/shoot-row'
import { queryFile } from '../support/sqlite'

describe('join codes', async () => {
  const { databasePath } = await useBuiltApp()

  async function setup() {
    const producer = await signedIn(demo.producer)
    const studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    const shootId = await insertShoot(databasePath, studioId, 'Thursday rehearsal')
    const otherShootId = await insertShoot(databasePath, studioId, 'Friday take')
    return { producer, studioId, shootId, otherShootId }
  }

  it('a code grants its shoot and role only, with a QR code of the join address', async () => {
    const { producer, studioId, shootId, otherShootId } = await setup()
    const made = await producer.post(`/api/shoots/${shootId}/join-codes`, { role: 'camera' })
    expect(made.status).toBe(201)
    expect(made.body.code).toMatch(/^[A-Z2-9]{3}-[A-Z2-9]{3}$/)
    expect(made.body.qrSvg).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/)
    expect(made.body.joinUrl).toMatch(new RegExp(`/join\\?code=${made.body.code.replace('-', '')}$`))
    expect(new Date(made.body.expiresAt).getTime() - Date.now()).toBeGreaterThan(29 * 60_000)

    const tablet = new Client()
    // Typed in lower case with a space: still the same code.
    const joined = await tablet.post('/api/join', { code: made.body.code.toLowerCase().replace('-', ' ') })
    expect(joined.status).toBe(200)
    expect(joined.body).toMatchObject({ shootId, role: 'camera', next: `/shoots/${shootId}/cue` })
    const shoot = await tablet.get(`/api/shoots/${shootId}`)
    expect(shoot.status).toBe(200)
    expect(shoot.body.you).toMatchObject({ kind: 'device', role: 'camera' })
    // Nothing else: not another shoot, not the studio, not the join codes.
    expect((await tablet.get(`/api/shoots/${otherShootId}`)).status).toBe(403)
    expect((await tablet.get(`/api/studios/${studioId}/members`)).status).toBe(403)
    expect((await tablet.get(`/api/shoots/${shootId}/join-codes`)).status).toBe(403)
    expect((await tablet.get('/api/me')).body).toMatchObject({ user: null, device: { shootId, role: 'camera' } })
  })

  it('a revoked code stops working, and so do the devices that joined with it', async () => {
    const { producer, shootId } = await setup()
    const made = await producer.post(`/api/shoots/${shootId}/join-codes`, { role: 'host' })
    const tablet = new Client()
    expect((await tablet.post('/api/join', { code: made.body.code })).status).toBe(200)
    expect((await tablet.get(`/api/shoots/${shootId}`)).status).toBe(200)
    expect((await producer.get(`/api/shoots/${shootId}/join-codes`)).body.codes.map((c: { id: number }) => c.id)).toContain(made.body.id)
    expect((await producer.delete(`/api/shoots/${shootId}/join-codes/${made.body.id}`)).status).toBe(204)
    expect((await producer.get(`/api/shoots/${shootId}/join-codes`)).body.codes.map((c: { id: number }) => c.id)).not.toContain(made.body.id)
    const cut = await tablet.get(`/api/shoots/${shootId}`)
    expect(cut.status).toBe(401)
    expect(cut.body.statusMessage).toMatch(/new join code/)
    expect((await new Client().post('/api/join', { code: made.body.code })).status).toBe(404)
  })

  it('an expired code is refused', async () => {
    const { producer, shootId } = await setup()
    const made = await producer.post(`/api/shoots/${shootId}/join-codes`, { role: 'camera', minutes: 5 })
    await queryFile(databasePath, `UPDATE join_codes SET expires_at = '2000-01-01 00:00:00.000 +00:00' WHERE id = ${made.body.id}`)
    const res = await new Client().post('/api/join', { code: made.body.code })
    expect(res.status).toBe(404)
    expect(res.body.statusMessage).toMatch(/not valid or has expired/)
  })

  it('only a producer makes codes, and only for roles a device can hold', async () => {
    const { shootId } = await setup()
    const host = await signedIn(demo.host)
    expect((await host.post(`/api/shoots/${shootId}/join-codes`, { role: 'camera' })).status).toBe(403)
    const producer = await signedIn(demo.producer)
    const bad = await producer.post(`/api/shoots/${shootId}/join-codes`, { role: 'producer' })
    expect(bad.status).toBe(400)
    expect(bad.body.statusMessage).toBe('Device for: choose host or camera: a join code is for one kind of device.')
    expect(bad.body.data.field).toBe('role')
  })
})
