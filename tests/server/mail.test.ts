// Mail: the templates, a real SMTP exchange with the local catcher (nodemailer → smtp-server on
// loopback → mailparser → the `mails` table), the outbox queries, and the built app's outbox routes.
import { createServer, type AddressInfo } from 'node:net'
import { fetch } from '@nuxt/test-utils/e2e'
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startDatabase } from '../../server/db'
import { Mail, Studio } from '../../server/db/models'
import { startMailCatcher, type MailCatcher } from '../../server/mail/catcher'
import { listOutbox, outboxQuerySchema, readOutboxMail } from '../../server/mail/outbox'
import { closeTransports, deliverMail } from '../../server/mail/send'
import { formatDuration, formatExpiry, inviteMail, passwordResetMail } from '../../server/mail/templates'
import { tempDatabasePath, useBuiltApp } from '../support/app'
import { queryFile } from '../support/sqlite'

const FROM = 'Hobline <crew@hobline.invalid>'
const HOSTILE = `<script>alert("x")</script> & 'Co'`
const HOSTILE_ESCAPED = '&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;Co&#39;'
// 9 December 2026 is a Wednesday: Zeller's congruence by hand, h = (9 + 33 + 26 + 6 + 5 + 100) mod 7 = 4.
const EXPIRES = new Date('2026-12-09T14:30:00Z')
const SENT = new Date('2026-12-02T14:30:00Z')

function invite(overrides: Partial<Parameters<typeof inviteMail>[0]> = {}) {
  return inviteMail({
    studioName: 'Brackenford Test Kitchen',
    inviterName: 'Ottoline Marsh',
    role: 'camera',
    link: 'https://hobline.example/invites/tok3n?from=mail&x=1',
    expiresAt: EXPIRES,
    now: SENT,
    ...overrides,
  })
}

describe('mail templates', () => {
  it('escape every value in the HTML part and keep it verbatim in the text part', () => {
    const mail = invite({ studioName: HOSTILE, inviterName: `Ottoline "Otto" <b>Marsh</b>` })
    expect(mail.html).not.toContain('<script>')
    expect(mail.html).not.toContain('<b>Marsh')
    expect(mail.html).toContain(HOSTILE_ESCAPED)
    expect(mail.html).toContain('Ottoline &quot;Otto&quot; &lt;b&gt;Marsh&lt;/b&gt;')
    expect(mail.text).toContain(HOSTILE)
    expect(mail.text).toContain(`Ottoline "Otto" <b>Marsh</b>`)
    expect(mail.subject).toContain(HOSTILE)

    const reset = passwordResetMail({ name: HOSTILE, link: 'https://hobline.example/reset/abc', expiresAt: EXPIRES, now: SENT })
    expect(reset.html).not.toContain('<script>')
    expect(reset.html).toContain(HOSTILE_ESCAPED)
    expect(reset.text).toContain(HOSTILE)
  })

  it('escape the link inside href and refuse a link that is not http(s)', () => {
    const link = 'https://hobline.example/invites/a"onclick=x<b>&c'
    const mail = invite({ link })
    expect(mail.html).toContain('href="https://hobline.example/invites/a&quot;onclick=x&lt;b&gt;&amp;c"')
    expect(mail.html).not.toContain(link)
    expect(mail.text).toContain(link)
    expect(() => invite({ link: 'javascript:alert(1)' })).toThrow(/absolute http\(s\) address/)
    expect(() => passwordResetMail({ name: 'A', link: '/reset/relative', expiresAt: EXPIRES })).toThrow(/absolute http\(s\) address/)
  })

  it('make no outside request: no images, fonts, stylesheets; every link is the one link', () => {
    for (const mail of [invite(), passwordResetMail({ name: 'Ida', link: 'https://hobline.example/reset/abc', expiresAt: EXPIRES })]) {
      expect(mail.html).not.toMatch(/<img|<link|src=|url\(|@import|<script/i)
      const hrefs = [...mail.html.matchAll(/href="([^"]*)"/g)].map((m) => m[1])
      expect(hrefs.length).toBe(2) // the button and the copyable address
      expect(new Set(hrefs).size).toBe(1)
      // The plan palette of tailwind.config.ts: paper, ink, paprika button with white text.
      expect(mail.html).toContain('background-color:#faf7f1')
      expect(mail.html).toContain('color:#1d232b')
      expect(mail.html).toMatch(/bgcolor="#a3301a"[^>]*>\s*<a [^>]*color:#ffffff/)
      expect(mail.html).toContain(`font-family:'Atkinson Hyperlegible', system-ui, sans-serif`)
    }
  })

  it('the invite names the studio, the inviter, the role in words, the link and when it expires, in both parts', () => {
    const mail = invite()
    expect(mail.subject).toBe('Ottoline Marsh has kept a place for you on the Brackenford Test Kitchen crew')
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('Brackenford Test Kitchen')
      expect(part).toContain('Ottoline Marsh')
      expect(part).toContain('Camera')
      expect(part).toContain('follows the cue screen, marks takes, sets rolling')
      expect(part).toContain('Wednesday, 9 December 2026 at 14:30 UTC')
      expect(part).toContain('7 days')
    }
    expect(mail.text).toContain('https://hobline.example/invites/tok3n?from=mail&x=1')
    expect(mail.html).toContain('https://hobline.example/invites/tok3n?from=mail&amp;x=1')
    // A US studio reads the date the US way.
    expect(invite({ locale: 'en-US' }).text).toContain('Wednesday, December 9, 2026 at 14:30 UTC')
    // In the studio's own time zone once it has chosen one (IANA tzdata: London is on GMT in
    // December, New York on EST, UTC−5).
    expect(invite({ timeZone: 'Europe/London' }).text).toContain('Wednesday, 9 December 2026 at 14:30 GMT')
    expect(invite({ locale: 'en-US', timeZone: 'America/New_York' }).text).toContain('Wednesday, December 9, 2026 at 09:30 EST')
  })

  it('the reset mail says the link works once, until when, and that an unasked mail can be ignored', () => {
    const expiresAt = new Date(SENT.getTime() + 60 * 60_000)
    const mail = passwordResetMail({ name: 'Ida Penhallow', link: 'https://hobline.example/reset/r35et', expiresAt, now: SENT })
    for (const part of [mail.text, mail.html.replace(/<[^>]+>/g, '')]) {
      expect(part).toContain('Ida Penhallow')
      expect(part).toContain('works once')
      expect(part).toContain('Wednesday, 2 December 2026 at 15:30 UTC (1 hour from when it was sent)')
      expect(part).toContain('Did not ask for this? Then ignore this mail')
    }
    expect(mail.text).toContain('https://hobline.example/reset/r35et')
  })

  it('round a remaining time to what a reader needs', () => {
    const at = (minutes: number) => new Date(SENT.getTime() + minutes * 60_000)
    expect(formatDuration(at(30), SENT)).toBe('30 minutes')
    expect(formatDuration(at(60), SENT)).toBe('1 hour')
    expect(formatDuration(at(90), SENT)).toBe('90 minutes')
    expect(formatDuration(at(24 * 60), SENT)).toBe('24 hours')
    expect(formatDuration(at(7 * 24 * 60), SENT)).toBe('7 days')
    expect(formatExpiry(EXPIRES, 'de-DE')).toBe('Wednesday, 9 December 2026 at 14:30 UTC')
  })
})

describe('local SMTP catcher', () => {
  let sequelize: Sequelize
  let catcher: MailCatcher
  let studioId: number
  let otherStudioId: number

  beforeAll(async () => {
    ;({ sequelize } = await startDatabase(tempDatabasePath('mail'), false))
    studioId = (await Studio.create({ name: 'Brackenford Test Kitchen', slug: 'brackenford' })).id
    otherStudioId = (await Studio.create({ name: 'Larkspur Lane Bakehouse', slug: 'larkspur' })).id
    catcher = await startMailCatcher({ port: 0 })
  })

  afterAll(async () => {
    closeTransports()
    await catcher?.close()
    await sequelize?.close()
  })

  const target = () => ({ host: catcher.host, port: catcher.port })

  it('listens on loopback on the port the system picked', () => {
    expect(catcher.host).toBe('127.0.0.1')
    expect(catcher.port).toBeGreaterThan(0)
  })

  it('keeps a multipart mail received over SMTP, filed under its studio with its kind', async () => {
    const rendered = invite({ studioName: HOSTILE })
    const sent = await deliverMail(target(), FROM, { to: 'Wren Ash <wren@example.test>', ...rendered, kind: 'invite', studioId })
    expect(sent.messageId).toMatch(/^<.+@.+>$/)

    const stored = await Mail.findOne({ where: { messageId: sent.messageId } })
    expect(stored).not.toBeNull()
    expect(stored!.studioId).toBe(studioId)
    expect(stored!.kind).toBe('invite')
    expect(stored!.from).toBe('"Hobline" <crew@hobline.invalid>')
    expect(stored!.to).toBe('"Wren Ash" <wren@example.test>')
    expect(stored!.subject).toBe(rendered.subject)
    expect(stored!.html).toContain(HOSTILE_ESCAPED)
    expect(stored!.html).toContain('Open the invitation')
    expect(stored!.text?.trimEnd()).toBe(rendered.text.trimEnd())
    expect(stored!.receivedAt).toBeInstanceOf(Date)
  })

  it('sends to an SMTP server given as a URL, as NUXT_MAIL_SMTP_URL configures it', async () => {
    const sent = await deliverMail(`smtp://${catcher.host}:${catcher.port}`, FROM, { to: 'wren@example.test', ...invite(), kind: 'invite', studioId })
    const stored = await Mail.findOne({ where: { messageId: sent.messageId } })
    expect(stored?.studioId).toBe(studioId)
    expect(stored?.subject).toBe(invite().subject)
  })

  it('files a mail with no studio, or an unknown one, under no studio', async () => {
    const reset = passwordResetMail({ name: 'Ida', link: 'https://hobline.example/reset/1', expiresAt: EXPIRES })
    const none = await deliverMail(target(), FROM, { to: 'ida@example.test', ...reset, kind: 'password-reset' })
    const unknown = await deliverMail(target(), FROM, { to: 'ida@example.test', ...reset, kind: 'password-reset', studioId: 987654 })
    for (const { messageId } of [none, unknown]) {
      const stored = await Mail.findOne({ where: { messageId } })
      expect(stored?.studioId).toBeNull()
      expect(stored?.kind).toBe('password-reset')
    }
  })

  it('refuses an over-size message with SMTP 552 and keeps nothing', async () => {
    const before = await Mail.count()
    const huge = 'simmer '.repeat(Math.ceil((3 * 1024 * 1024) / 7))
    const attempt = deliverMail(target(), FROM, { to: 'wren@example.test', subject: 'Too much', html: `<p>${huge}</p>`, text: huge, kind: 'invite', studioId })
    await expect(attempt).rejects.toMatchObject({ responseCode: 552 })
    expect(await Mail.count()).toBe(before)
    // The catcher is still there for the next mail.
    const after = await deliverMail(target(), FROM, { to: 'wren@example.test', subject: 'Small', html: '<p>ok</p>', text: 'ok', kind: 'invite', studioId })
    expect(await Mail.count({ where: { messageId: after.messageId } })).toBe(1)
  })

  it('lists one studio\'s outbox newest first, in pages, and reads a mail only within its studio', async () => {
    const subjects = ['First', 'Second', 'Third']
    for (const subject of subjects) {
      await deliverMail(target(), FROM, { to: 'crew@example.test', subject, html: `<p>${subject}</p>`, text: subject, kind: 'call-sheet', studioId: otherStudioId })
    }
    const all = await listOutbox(otherStudioId, { limit: 10, offset: 0 })
    expect(all.map((m) => m.subject)).toEqual(['Third', 'Second', 'First'])
    expect(Object.keys(all[0]!).sort()).toEqual(['id', 'kind', 'receivedAt', 'subject', 'to'])
    expect(all[0]!.receivedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/)
    expect((await listOutbox(otherStudioId, { limit: 1, offset: 1 })).map((m) => m.subject)).toEqual(['Second'])

    const one = await readOutboxMail(otherStudioId, all[0]!.id)
    expect(one).toMatchObject({ id: all[0]!.id, kind: 'call-sheet', subject: 'Third', html: '<p>Third</p>', text: 'Third', to: 'crew@example.test' })
    expect(await readOutboxMail(studioId, all[0]!.id)).toBeNull()
    expect((await listOutbox(studioId, { limit: 100, offset: 0 })).some((m) => m.subject === 'Third')).toBe(false)
  })

  it('validates the page query with messages that say what to fix', () => {
    expect(outboxQuerySchema.parse({})).toEqual({ limit: 50, offset: 0 })
    expect(outboxQuerySchema.parse({ limit: '5', offset: '10' })).toEqual({ limit: 5, offset: 10 })
    for (const [query, message] of [
      [{ limit: '0' }, 'write a whole number from 1 to 100.'],
      [{ limit: '101' }, 'write a whole number from 1 to 100.'],
      [{ limit: 'lots' }, 'write a whole number from 1 to 100.'],
      [{ offset: '-1' }, 'write a whole number 0 or more.'],
      [{ offset: '1.5' }, 'write a whole number 0 or more.'],
    ] as const) {
      const result = outboxQuerySchema.safeParse(query)
      expect(result.success).toBe(false)
      expect(result.error?.issues[0]?.message).toBe(message)
      expect(result.error?.issues[0]?.path).toEqual(Object.keys(query))
    }
  })

  it('removes a studio\'s mail with the studio', async () => {
    expect(await Mail.count({ where: { studioId: otherStudioId } })).toBe(3)
    await Studio.destroy({ where: { id: otherStudioId } })
    expect(await Mail.count({ where: { studioId: otherStudioId } })).toBe(0)
  })
})

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer()
    server.once('error', reject)
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo
      server.close(() => resolve(port))
    })
  })
}

describe('built app: mail catcher and outbox routes', async () => {
  const catcherPort = await freePort()
  const { databasePath } = await useBuiltApp({ seed: 'always', env: { NUXT_MAIL_CATCHER_PORT: String(catcherPort) } })

  afterAll(() => closeTransports())

  it('starts the catcher with the app, and it files what it receives in the app\'s database', async () => {
    const [studio] = await queryFile<{ id: number }>(databasePath, "SELECT id FROM studios WHERE slug = 'brackenford'")
    expect(studio).toBeDefined()
    const sent = await deliverMail({ host: '127.0.0.1', port: catcherPort }, FROM, {
      to: 'wren@example.test', ...invite(), kind: 'invite', studioId: studio!.id,
    })
    const rows = await queryFile<{ studio_id: number; kind: string; subject: string }>(
      databasePath, `SELECT studio_id, kind, subject FROM mails WHERE message_id = '${sent.messageId.replace(/'/g, "''")}'`,
    )
    expect(rows).toEqual([{ studio_id: studio!.id, kind: 'invite', subject: invite().subject }])
  })

  it('refuses the outbox to a signed-out caller with 401, before looking at the mail id', async () => {
    for (const path of ['/api/studios/1/outbox', '/api/studios/1/outbox/1', '/api/studios/1/outbox/abc']) {
      const res = await fetch(path)
      expect(res.status).toBe(401)
      expect((await res.json()).message).toBe('Sign in first.')
    }
  })

  it('answers a studio id that is not a number with 400 saying what the address should hold', async () => {
    const res = await fetch('/api/studios/abc/outbox')
    expect(res.status).toBe(400)
    const body = await res.json()
    expect(body.message).toBe('This address names no studio: the studio number in it must be a whole number such as 12. Check the link.')
    expect(body.data.field).toBe('studioId')
  })
})
