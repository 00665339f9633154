// The call sheet as a mail to one crew member: what changed since the last sheet first (on a re-send),
// then the day, call, place, hospital, crew, run order, equipment, allergens and safety notes, as HTML
// (table layout, inline styles, every value escaped) and as text; and the shoot as an iCalendar event
// (RFC 5545) made by the `ics` package, start and end in UTC so every calendar places it right.
import { createEvent } from 'ics'
import type { CallSheet } from '../../shared/utils/call-sheet'
import { plannedText } from '../../shared/utils/show-words'
import { escapeHtml, type RenderedMail } from './templates'

const C = { paper: '#faf7f1', card: '#ffffff', line: '#d9d2c5', ink: '#1d232b', muted: '#4a5360', paprika: '#a3301a' }
const FONT = `'Atkinson Hyperlegible', system-ui, sans-serif`
const e = escapeHtml
const TO_FILL = '____________________________________ (write it in by hand)'

function utcParts(iso: string): [number, number, number, number, number] {
  const d = new Date(iso)
  return [d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes()]
}

/** The shoot as an iCalendar event: start at the call, end after the planned run order; `sequence` counts re-sends so calendars update it. */
export function callSheetEvent(sheet: CallSheet, opts: { uid: string; sequence: number; link: string }): string {
  if (!sheet.startsAt || !sheet.endsAt) throw new Error('A call sheet without a date and call time has no event')
  const { error, value } = createEvent({
    uid: opts.uid,
    sequence: opts.sequence,
    productId: 'hobline/call-sheet',
    title: sheet.title,
    start: utcParts(sheet.startsAt), startInputType: 'utc', startOutputType: 'utc',
    end: utcParts(new Date(Math.ceil(Date.parse(sheet.endsAt) / 60_000) * 60_000).toISOString()), endInputType: 'utc', endOutputType: 'utc',
    ...(sheet.place ? { location: sheet.place } : {}),
    description: `Call sheet: ${opts.link}`,
    url: opts.link,
    status: 'CONFIRMED',
    busyStatus: 'BUSY',
  })
  if (error || !value) throw error ?? new Error('The calendar event could not be made')
  return value
}

const section = (title: string, body: string) =>
  `<h2 style="margin:20px 0 8px 0;font-size:18px;line-height:1.3;color:${C.ink};">${e(title)}</h2>${body}`
const para = (html: string) => `<p style="margin:0 0 10px 0;font-size:16px;line-height:1.5;color:${C.ink};">${html}</p>`
const list = (items: string[]) => `<ul style="margin:0 0 10px 20px;padding:0;font-size:16px;line-height:1.5;">${items.map((i) => `<li>${e(i)}</li>`).join('')}</ul>`
const cell = (html: string, head = false) =>
  `<${head ? 'th' : 'td'} align="left" style="padding:4px 8px 4px 0;border-bottom:1px solid ${C.line};font-size:15px;text-align:left;vertical-align:top;">${html}</${head ? 'th' : 'td'}>`
const table = (head: string[], rows: string[][]) =>
  `<table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="border-collapse:collapse;margin:0 0 10px 0;">`
  + `<tr>${head.map((h) => cell(e(h), true)).join('')}</tr>${rows.map((r) => `<tr>${r.map((c) => cell(c)).join('')}</tr>`).join('')}</table>`

function facts(sheet: CallSheet) {
  return [
    ['Date', sheet.dateText ?? 'not set yet'],
    ['Call', sheet.callTime ? `${sheet.callTime} (${sheet.timeZone})` : 'not set yet'],
    ['Place', sheet.place ?? 'not set yet'],
    ['Planned wrap', sheet.wrap ? `${sheet.wrap} (${plannedText(sheet.plannedMs)} of run order)` : plannedText(sheet.plannedMs)],
    ['Nearest hospital', sheet.hospital ?? TO_FILL],
  ] as const
}

export function callSheetMail(sheet: CallSheet, opts: { changes: string[]; link: string; recipient: string }): RenderedMail {
  const resend = opts.changes.length > 0
  const subject = `${resend ? 'Call sheet changed' : 'Call sheet'}: ${sheet.title}${sheet.dateText ? `, ${sheet.dateText}` : ''}`
  const allergens = [...sheet.allergens.eu, ...(sheet.allergens.us ?? []).map((a) => `${a} (US list)`)]
  const html = `<!DOCTYPE html>
<html lang="en">
<head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><meta name="color-scheme" content="light"><title>${e(subject)}</title></head>
<body style="margin:0;padding:0;background-color:${C.paper};">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" bgcolor="${C.paper}" style="background-color:${C.paper};">
<tr><td align="center" style="padding:24px 12px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="max-width:640px;font-family:${FONT};color:${C.ink};">
<tr><td style="padding:0 4px 12px 4px;font-size:15px;font-weight:bold;letter-spacing:0.08em;text-transform:uppercase;color:${C.paprika};">Hobline · ${e(sheet.studioName)}</td></tr>
<tr><td bgcolor="${C.card}" style="background-color:${C.card};border:1px solid ${C.line};border-radius:16px;padding:28px 24px;font-family:${FONT};">
<h1 style="margin:0 0 12px 0;font-size:24px;line-height:1.3;">Call sheet: ${e(sheet.title)}</h1>
${para(`Hello ${e(opts.recipient)}, here is the call sheet for the shoot. The calendar event is attached.`)}
${resend ? section('What changed since the last sheet', list(opts.changes)) : ''}
${table(['', ''], facts(sheet).map(([k, v]) => [`<strong>${e(k)}</strong>`, e(v)]))}
${section('Crew', table(['Name', 'Role', 'Call', 'E-mail'], sheet.crew.map((c) => [e(c.name), e(c.role), e(c.callTime ?? '—'), e(c.email)])))}
${section('Run order', table(['Start', 'Segment', 'Planned'], sheet.runOrder.map((r) => [e(r.start ?? `+${r.startMin} min`), `${e(r.title)} <span style="color:${C.muted};">(${e(r.kind)})</span>`, e(plannedText(r.plannedMs))])))}
${para(`<span style="color:${C.muted};">Start times count from the call time, each segment after the planned length of the segments before it.</span>`)}
${sheet.equipment.length ? section('Kitchen equipment', list(sheet.equipment)) : ''}
${section('Allergens on set', allergens.length ? list(allergens) : para('None listed in the recipes.'))}
${section('Safety', list(sheet.safety.map((s) => s.text)))}
${para(`<a href="${e(opts.link)}" style="color:${C.paprika};">Open the call sheet in Hobline</a>`)}
</td></tr>
<tr><td style="padding:16px 4px 0 4px;font-size:13px;line-height:1.5;color:${C.muted};">Hobline, the run-of-show for cooking on camera. Sent on behalf of ${e(sheet.studioName)}.</td></tr>
</table>
</td></tr>
</table>
</body>
</html>
`
  const text = [
    `Call sheet: ${sheet.title}`,
    '',
    `Hello ${opts.recipient}, here is the call sheet for the shoot. The calendar event is attached.`,
    '',
    ...(resend ? ['What changed since the last sheet:', ...opts.changes.map((c) => `- ${c}`), ''] : []),
    ...facts(sheet).map(([k, v]) => `${k}: ${v}`),
    '',
    'Crew:',
    ...sheet.crew.map((c) => `- ${c.name}, ${c.role}, call ${c.callTime ?? '—'}, ${c.email}`),
    '',
    'Run order (start times count from the call time, each segment after the planned length of those before it):',
    ...sheet.runOrder.map((r) => `- ${r.start ?? `+${r.startMin} min`}  ${r.title} (${r.kind}, ${plannedText(r.plannedMs)})`),
    '',
    ...(sheet.equipment.length ? ['Kitchen equipment:', ...sheet.equipment.map((x) => `- ${x}`), ''] : []),
    'Allergens on set:',
    ...(allergens.length ? allergens.map((a) => `- ${a}`) : ['- None listed in the recipes.']),
    '',
    'Safety:',
    ...sheet.safety.map((s) => `- ${s.text}`),
    '',
    `The call sheet in Hobline: ${opts.link}`,
    '',
    '-- ',
    `Hobline, the run-of-show for cooking on camera. Sent on behalf of ${sheet.studioName}.`,
    '',
  ].join('\n')
  return { subject, html, text }
}
