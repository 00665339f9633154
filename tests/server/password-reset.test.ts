// Password reset by an e-mailed link that expires and works once. The mail goes through the real
// SMTP catcher; a reset belongs to no studio, so the test reads it from the catcher's table.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, linkIn, uniqueEmail } from '../support/client'
import { queryFile } from '../support/sqlite'

describe('password reset', async () => {
  const { databasePath } = await useBuiltApp()

  async function resetMailFor(email: string) {
    for (let i = 0; i < 40; i++) {
      const rows = await queryFile<{ text: string; kind: string }>(databasePath, `SELECT text, kind FROM mails WHERE "to" LIKE '%${email}%' ORDER BY id DESC LIMIT 1`)
      if (rows[0]) return rows[0]
      await new Promise((r) => setTimeout(r, 50))
    }
    throw new Error(`no mail to ${email}`)
  }

  it('the link changes the password once; the old password stops working; a second use is refused', async () => {
    const email = uniqueEmail('forgetful')
    await new Client().post('/api/auth/signup', { name: 'Forgetful Cook', email, password: 'the first password', studioName: 'Reset Kitchen' })
    const ask = await new Client().post('/api/auth/password-reset', { email })
    expect(ask.status).toBe(202)
    const mail = await resetMailFor(email)
    expect(mail.kind).toBe('password-reset')
    const path = linkIn(mail.text, '/reset/')
    const token = path.split('/').pop()

    const weak = await new Client().post(`/api/auth/password-reset/${token}`, { password: 'short' })
    expect(weak.status).toBe(400)
    const done = await new Client().post(`/api/auth/password-reset/${token}`, { password: 'the second password' })
    expect(done.status).toBe(200)
    expect((await new Client().post('/api/auth/login', { email, password: 'the first password' })).status).toBe(401)
    expect((await new Client().post('/api/auth/login', { email, password: 'the second password' })).status).toBe(200)
    const again = await new Client().post(`/api/auth/password-reset/${token}`, { password: 'the third password' })
    expect(again.status).toBe(410)
    expect(again.body.statusMessage).toMatch(/expired or was already used/)
  })

  it('an expired link is refused', async () => {
    const email = uniqueEmail('late')
    await new Client().post('/api/auth/signup', { name: 'Late Cook', email, password: 'the first password', studioName: 'Late Kitchen' })
    await new Client().post('/api/auth/password-reset', { email })
    const token = linkIn((await resetMailFor(email)).text, '/reset/').split('/').pop()
    await queryFile(databasePath, `UPDATE password_resets SET expires_at = '2000-01-01 00:00:00.000 +00:00' WHERE used_at IS NULL`)
    expect((await new Client().post(`/api/auth/password-reset/${token}`, { password: 'the second password' })).status).toBe(410)
  })

  it('an unknown address gets the same answer and no mail', async () => {
    const email = uniqueEmail('nobody')
    const res = await new Client().post('/api/auth/password-reset', { email })
    expect(res.status).toBe(202)
    await new Promise((r) => setTimeout(r, 300))
    expect(await queryFile(databasePath, `SELECT id FROM mails WHERE "to" LIKE '%${email}%'`)).toEqual([])
  })
})
