// Crew: invites by e-mail through the real SMTP catcher, accepting them, roles, the last producer.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, linkIn, signedIn, uniqueEmail } from '../support/client'

async function studioOf(client: Client): Promise<number> {
  return (await client.get('/api/me')).body.memberships[0].studioId
}

async function latestMailTo(producer: Client, studioId: number, to: string) {
  const list = await producer.get(`/api/studios/${studioId}/outbox`)
  expect(list.status).toBe(200)
  const item = list.body.mails.find((m: { to: string }) => m.to.includes(to))
  expect(item, `a mail to ${to} in the outbox`).toBeTruthy()
  return (await producer.get(`/api/studios/${studioId}/outbox/${item.id}`)).body
}

describe('crew and invites', async () => {
  await useBuiltApp()

  it('invite → mail caught over SMTP → link accepted → member listed with the role', async () => {
    const producer = await signedIn(demo.producer)
    const studioId = await studioOf(producer)
    const email = uniqueEmail('camera')
    const sent = await producer.post(`/api/studios/${studioId}/invites`, { email, role: 'camera' })
    expect(sent.status).toBe(201)
    expect(sent.body.invite).toMatchObject({ email, role: 'camera', sentCount: 1, expired: false })

    const mail = await latestMailTo(producer, studioId, email)
    expect(mail.subject).toContain('Brackenford Test Kitchen')
    expect(mail.text).toContain('Camera')
    expect(mail.html).toContain('Brackenford Test Kitchen')
    const path = linkIn(mail.text, '/invite/')
    expect(mail.html).toContain(path)

    const guest = new Client()
    const preview = await guest.get(`/api/invites/${path.split('/').pop()}`)
    // The preview does not say whether the address has an account (issue 13).
    expect(preview.body).toEqual({ studioName: 'Brackenford Test Kitchen', role: 'camera', email, expiresAt: expect.any(String) })
    const accepted = await guest.post(`/api/invites/${path.split('/').pop()}/accept`, { name: 'Pim Okonkwo', password: 'steady hands on set' })
    expect(accepted.status).toBe(200)
    expect(accepted.body.memberships).toEqual([{ studioId, studioName: 'Brackenford Test Kitchen', role: 'camera' }])
    expect((await guest.get('/api/me')).body.user.email).toBe(email)

    const members = await producer.get(`/api/studios/${studioId}/members`)
    expect(members.body.members).toContainEqual(expect.objectContaining({ email, name: 'Pim Okonkwo', role: 'camera' }))
    // The invite is no longer pending, and its link is spent.
    expect((await producer.get(`/api/studios/${studioId}/invites`)).body.invites.find((i: { email: string }) => i.email === email)).toBeUndefined()
    expect((await new Client().post(`/api/invites/${path.split('/').pop()}/accept`, { name: 'Someone', password: 'another long one' })).status).toBe(410)
  })

  it('an existing account accepts with its own password and gains the studio', async () => {
    const other = new Client()
    const email = uniqueEmail('multi')
    await other.post('/api/auth/signup', { name: 'Dara Finch', email, password: 'my own studio pass', studioName: 'Finch Bakes' })
    const producer = await signedIn(demo.producer)
    const studioId = await studioOf(producer)
    await producer.post(`/api/studios/${studioId}/invites`, { email, role: 'host' })
    const path = linkIn((await latestMailTo(producer, studioId, email)).text, '/invite/')
    const guest = new Client()
    expect((await guest.get(`/api/invites/${path.split('/').pop()}`)).body).not.toHaveProperty('hasAccount')
    // A name is asked of everyone, account or not, so leaving it out tells nothing either.
    const noName = await guest.post(`/api/invites/${path.split('/').pop()}/accept`, { password: 'not my password' })
    expect(noName.status).toBe(400)
    expect(noName.body.data.field).toBe('name')
    const wrong = await guest.post(`/api/invites/${path.split('/').pop()}/accept`, { name: 'Dara', password: 'not my password' })
    expect(wrong.status).toBe(401)
    expect(wrong.body.data.field).toBe('password')
    const ok = await guest.post(`/api/invites/${path.split('/').pop()}/accept`, { name: 'Someone else', password: 'my own studio pass' })
    expect(ok.status).toBe(200)
    // The existing account keeps its own name.
    expect(ok.body.user.name).toBe('Dara Finch')
    expect(ok.body.memberships.map((m: { role: string }) => m.role).sort()).toEqual(['host', 'producer'])
  })

  it('resend makes a new link and kills the old one; revoke withdraws the invite', async () => {
    const producer = await signedIn(demo.producer)
    const studioId = await studioOf(producer)
    const email = uniqueEmail('resend')
    const { body } = await producer.post(`/api/studios/${studioId}/invites`, { email, role: 'viewer' })
    const firstPath = linkIn((await latestMailTo(producer, studioId, email)).text, '/invite/')
    const resent = await producer.post(`/api/studios/${studioId}/invites/${body.invite.id}/resend`)
    expect(resent.status).toBe(200)
    expect(resent.body.invite.sentCount).toBe(2)
    expect((await new Client().get(`/api/invites/${firstPath.split('/').pop()}`)).status).toBe(404)
    const secondPath = linkIn((await latestMailTo(producer, studioId, email)).text, '/invite/')
    expect(secondPath).not.toBe(firstPath)
    expect((await producer.delete(`/api/studios/${studioId}/invites/${body.invite.id}`)).status).toBe(204)
    const gone = await new Client().get(`/api/invites/${secondPath.split('/').pop()}`)
    expect(gone.status).toBe(410)
    expect(gone.body.statusMessage).toMatch(/withdrawn/)
  })

  it('inviting someone already in the studio is a 409 naming the field', async () => {
    const producer = await signedIn(demo.producer)
    const res = await producer.post(`/api/studios/${await studioOf(producer)}/invites`, { email: demo.host, role: 'viewer' })
    expect(res.status).toBe(409)
    expect(res.body.statusMessage).toMatch(/^E-mail to invite: this person is already in the studio/)
    expect(res.body.data.field).toBe('email')
  })

  it('roles change at once, and the last producer can neither be demoted nor removed', async () => {
    const owner = new Client()
    const email = uniqueEmail('solo')
    const signup = await owner.post('/api/auth/signup', { name: 'Solo Owner', email, password: 'only one producer', studioName: 'One-Person Kitchen' })
    const studioId = signup.body.memberships[0].studioId
    const selfId = signup.body.user.id
    const demote = await owner.patch(`/api/studios/${studioId}/members/${selfId}`, { role: 'host' })
    expect(demote.status).toBe(409)
    expect(demote.body.statusMessage).toMatch(/at least one producer/)
    expect((await owner.delete(`/api/studios/${studioId}/members/${selfId}`)).status).toBe(409)

    // A second producer makes it possible.
    const partner = uniqueEmail('partner')
    await owner.post(`/api/studios/${studioId}/invites`, { email: partner, role: 'producer' })
    const path = linkIn((await latestMailTo(owner, studioId, partner)).text, '/invite/')
    const guest = new Client()
    const joined = await guest.post(`/api/invites/${path.split('/').pop()}/accept`, { name: 'Partner', password: 'second producer here' })
    const partnerId = joined.body.user.id
    expect((await owner.patch(`/api/studios/${studioId}/members/${selfId}`, { role: 'viewer' })).status).toBe(200)
    // The change takes effect on the next request: a viewer may not manage the crew.
    expect((await owner.get(`/api/studios/${studioId}/invites`)).status).toBe(403)
    expect((await guest.delete(`/api/studios/${studioId}/members/${selfId}`)).status).toBe(204)
    // Removal ends every session of the removed person at once (session version); signed in again, the studio is not theirs.
    expect((await owner.get(`/api/studios/${studioId}/members`)).status).toBe(401)
    expect((await (await signedIn(email, 'only one producer')).get(`/api/studios/${studioId}/members`)).status).toBe(404)
    expect((await guest.get(`/api/studios/${studioId}/members`)).body.members.map((m: { userId: number }) => m.userId)).toEqual([partnerId])
  })
})
