// The call sheet over the built app: the demo episode's sheet (planned start times from the call time
// and the show's planned lengths), sending it to the four demo crew members through a real SMTP
// exchange (the app's NUXT_MAIL_SMTP_URL pointed at a server in this file), the text, HTML and
// iCalendar parts of each mail, the calendar event read back by an independent parser (ical.js), the
// sent log, a re-send that says what changed, who may send, and bad input refused by the field's label.
import ICAL from 'ical.js'
import type { ParsedMail } from 'mailparser'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoCrew } from '../../server/db/demo'
import { useBuiltApp } from '../support/app'
import { demo, signedIn, type Client } from '../support/client'
import { startSmtpSink } from '../support/smtp-sink'

const TITLE = 'Thursday supper special'

function calendarOf(mail: ParsedMail) {
  const ics = mail.attachments.find((a) => a.contentType === 'text/calendar')
  expect(ics, 'the mail carries a text/calendar attachment').toBeDefined()
  expect(ics!.filename).toBe('shoot.ics')
  const text = ics!.content.toString('utf8')
  const event = new ICAL.Event(new ICAL.Component(ICAL.parse(text)).getFirstSubcomponent('vevent')!)
  return { text, event }
}

describe('the call sheet', async () => {
  const sink = await startSmtpSink()
  await useBuiltApp({ env: { NUXT_MAIL_SMTP_URL: sink.url } })
  afterAll(() => sink.close())
  let producer: Client
  let episodeId: number

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    const studioId = (await producer.get('/api/me')).body.memberships[0].studioId
    episodeId = (await producer.get(`/api/studios/${studioId}/episodes`)).body.episodes.find((e: { title: string }) => e.title === TITLE).id
  })

  const sheet = async () => (await producer.get(`/api/episodes/${episodeId}/call-sheet`)).body

  it('the demo episode\'s sheet: called at 08:30 on Thursday 10 December, each segment after the planned lengths before it', async () => {
    const answer = await sheet()
    expect(answer.details).toMatchObject({ version: 1, callTime: '08:30', hospital: null })
    expect(answer.sheet.dateText).toBe('Thursday, 10 December 2026')
    // IANA tzdata: Europe/London is on GMT (UTC+0) in December, so 08:30 local is 08:30Z.
    expect(answer.sheet.startsAt).toBe('2026-12-10T08:30:00.000Z')
    expect(answer.sheet.crew.map((c: { name: string }) => c.name)).toEqual(demoCrew.map((c) => c.name))
    // The starts again, from the show's own planned lengths: 08:30 plus the minutes before each, rounded.
    const show = (await producer.get(`/api/episodes/${episodeId}/show`)).body as { segments: { id: string; totalMs: number }[]; runtime: { totalMs: number } }
    let before = 0
    const starts = show.segments.map((s) => {
      const min = Math.round(before / 60_000)
      before += s.totalMs
      const t = 8 * 60 + 30 + min
      return `${String(Math.floor(t / 60)).padStart(2, '0')}:${String(t % 60).padStart(2, '0')}`
    })
    expect(answer.sheet.runOrder.map((r: { start: string }) => r.start)).toEqual(starts)
    expect(answer.sheet.plannedMs).toBe(show.runtime.totalMs)
    expect(answer.sheet.endsAt).toBe(new Date(Date.parse('2026-12-10T08:30:00Z') + show.runtime.totalMs).toISOString())
    // The demo recipes use burners, the oven and knives, and hold flour (gluten), yoghurt (milk) and tahini (sesame).
    expect(answer.sheet.equipment.join('\n')).toMatch(/^Hob: 4 burners in the kitchen/)
    expect(answer.sheet.equipment.some((x: string) => x.startsWith('Oven: '))).toBe(true)
    expect(answer.sheet.allergens.eu).toEqual(expect.arrayContaining(['Milk (including lactose)', 'Sesame seeds']))
    expect(answer.sheet.allergens.us).toBeNull()
    expect(answer.sheet.safety.map((s: { id: string }) => s.id)).toEqual(expect.arrayContaining(['hot-oil', 'oven', 'knife', 'boiling', 'allergen', 'hot-holding']))
    expect(answer.sends).toEqual([])
    expect(answer.changes).toEqual([])
  })

  it('sends every crew member the sheet as text and HTML with the shoot as an iCalendar event, and logs the send', async () => {
    const answer = await sheet()
    const res = await producer.post(`/api/episodes/${episodeId}/call-sheet/send`, { hash: answer.hash })
    expect(res.status).toBe(200)
    await sink.waitFor(4)
    expect(sink.mails.flatMap((m) => m.to).sort()).toEqual(demoCrew.map((c) => c.email).sort())
    const place = answer.sheet.place as string
    for (const { parsed } of sink.mails) {
      expect(parsed.subject).toBe(`Call sheet: ${TITLE}, Thursday, 10 December 2026`)
      const text = parsed.text!
      expect(text).toContain('Date: Thursday, 10 December 2026')
      expect(text).toContain('Call: 08:30 (Europe/London)')
      expect(text).toContain(`Place: ${place}`)
      expect(text).toContain('Nearest hospital: ____')
      for (const c of demoCrew) expect(text).toContain(`- ${c.name}, ${c.role[0]!.toUpperCase()}${c.role.slice(1)}, call 08:30, ${c.email}`)
      for (const r of answer.sheet.runOrder) expect(text).toContain(`- ${r.start}  ${r.title} (${r.kind}`)
      expect(text).not.toContain('What changed')
      const html = parsed.html as string
      expect(html).toContain('<h1 style="margin:0 0 12px 0;font-size:24px;line-height:1.3;">Call sheet: Thursday supper special</h1>')
      expect(html).toContain('Pan flatbreads with mint yoghurt')
      expect(html).toContain('Sesame seeds')
      expect(html).not.toMatch(/<img|<script|src=/i)
      const { text: ics, event } = calendarOf(parsed)
      // Read back by ical.js, an independent parser: 08:30 GMT on 10 December is 08:30Z; it ends after the planned run order.
      expect(event.startDate.toJSDate().toISOString()).toBe('2026-12-10T08:30:00.000Z')
      expect(event.endDate.toJSDate().getTime()).toBe(Math.ceil(Date.parse(answer.sheet.endsAt) / 60_000) * 60_000)
      expect(event.summary).toBe(TITLE)
      expect(event.location).toBe(place)
      expect(event.sequence).toBe(0)
      expect(ics).toContain('DTSTART:20261210T083000Z')
    }
    const after = await sheet()
    expect(after.sends).toHaveLength(1)
    expect(after.sends[0]).toMatchObject({ sentByName: 'Ines Carrowby', hash: answer.hash, changes: [] })
    expect(after.sends[0].recipients.map((r: { email: string }) => r.email).sort()).toEqual(demoCrew.map((c) => c.email).sort())
    expect(after.sends[0].hash).toMatch(/^[0-9a-f]{64}$/)
    expect(after.changes).toEqual([])
  })

  it('a re-send after the call time moves says what changed, at the top of every mail, and moves the event', async () => {
    const saved = await producer.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 1, callTime: '09:00' })
    expect(saved.status).toBe(200)
    expect(saved.body.details).toMatchObject({ version: 2, callTime: '09:00' })
    expect(saved.body.changes).toEqual(['Call time: 08:30 → 09:00'])
    sink.mails.length = 0
    expect((await producer.post(`/api/episodes/${episodeId}/call-sheet/send`, { hash: saved.body.hash })).status).toBe(200)
    await sink.waitFor(4)
    for (const { parsed } of sink.mails) {
      expect(parsed.subject).toBe(`Call sheet changed: ${TITLE}, Thursday, 10 December 2026`)
      expect(parsed.text).toMatch(/here is the call sheet for the shoot\. The calendar event is attached\.\n\nWhat changed since the last sheet:\n- Call time: 08:30 → 09:00\n/)
      expect(parsed.html).toContain('<li>Call time: 08:30 → 09:00</li>')
      const { event } = calendarOf(parsed)
      expect(event.startDate.toJSDate().toISOString()).toBe('2026-12-10T09:00:00.000Z')
      // The same event, updated: same UID, next sequence number (RFC 5545 §3.8.7.4).
      expect(event.uid).toBe(`call-sheet-${episodeId}@127.0.0.1`)
      expect(event.sequence).toBe(1)
    }
    const after = await sheet()
    expect(after.sends.map((s: { changes: string[] }) => s.changes)).toEqual([['Call time: 08:30 → 09:00'], []])
    expect(after.changes).toEqual([])
  })

  it('a camera operator or a viewer may read the sheet but not change or send it', async () => {
    for (const who of [demo.camera, demo.viewer, demo.host]) {
      const client = await signedIn(who)
      const read = await client.get(`/api/episodes/${episodeId}/call-sheet`)
      expect(read.status).toBe(200)
      const send = await client.post(`/api/episodes/${episodeId}/call-sheet/send`, { hash: read.body.hash })
      expect(send.status).toBe(403)
      expect((await client.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 2, callTime: '07:00' })).status).toBe(403)
    }
    expect((await sheet()).details.callTime).toBe('09:00')
  })

  it('refuses bad input with the field\'s label, a stale version and a sheet changed since it was read', async () => {
    const bad = await producer.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 2, callTime: '25:00' })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toBe('Call time: write a time of day on the 24-hour clock, such as 08:30, or leave it empty.')
    expect(bad.body.data.field).toBe('callTime')
    const long = await producer.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 2, place: 'x'.repeat(301) })
    expect(long.status).toBe(400)
    expect(long.body.message).toBe('Place: write at most 300 characters.')
    const crew = await producer.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 2, crewCalls: [{ userId: 1, callTime: '7am' }] })
    expect(crew.status).toBe(400)
    expect(crew.body.message).toBe('Crew call 1, call time: write a time of day on the 24-hour clock, such as 07:45.')
    const stranger = await producer.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 2, crewCalls: [{ userId: 999999, callTime: '07:45' }] })
    expect(stranger.status).toBe(400)
    expect(stranger.body.message).toBe('Crew call 1, crew member: choose someone from the studio\'s crew list.')
    const stale = await producer.patch(`/api/episodes/${episodeId}/call-sheet`, { version: 1, place: 'Elsewhere' })
    expect(stale.status).toBe(409)
    expect(stale.body.data.current).toMatchObject({ version: 2, callTime: '09:00' })
    const hash = await producer.post(`/api/episodes/${episodeId}/call-sheet/send`, { hash: 'abc' })
    expect(hash.status).toBe(400)
    expect(hash.body.message).toBe('The sheet you read: send the fingerprint of the sheet you read (reload the page to get it).')
    const old = await producer.post(`/api/episodes/${episodeId}/call-sheet/send`, { hash: '0'.repeat(64) })
    expect(old.status).toBe(409)
    // Nothing of it was saved or sent.
    expect((await sheet()).details).toMatchObject({ version: 2, callTime: '09:00', crewCalls: [] })
    expect((await sheet()).sends).toHaveLength(2)
  })
})
