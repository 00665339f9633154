// Hobline's mails: an HTML part in the plan look and a plain-text part with the same link and facts.
// Mail clients ignore stylesheets and block outside requests, so the HTML uses a table layout, inline
// styles, the system font stack behind Atkinson Hyperlegible, and no images or web fonts at all.
// Every value put into the HTML is escaped; the text part carries the values as they are.
import { STUDIO_ROLE_LABELS, STUDIO_ROLE_SUMMARIES, isStudioRole } from '../../shared/utils/roles'
import { dateTimeInZone } from '../../shared/utils/time-zone'

export interface RenderedMail {
  subject: string
  html: string
  text: string
}

// The plan palette of tailwind.config.ts.
const C = { paper: '#faf7f1', card: '#ffffff', line: '#d9d2c5', ink: '#1d232b', muted: '#4a5360', paprika: '#a3301a' }
const FONT = `'Atkinson Hyperlegible', system-ui, sans-serif`

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' }

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!)
}

/** One line: line breaks and control characters become a space (for subjects and one-line facts). */
function oneLine(value: string): string {
  // eslint-disable-next-line no-control-regex -- matching control characters is the point: a subject or fact stays one clean line
  return value.replace(/[\u0000-\u001f\u007f]+/g, ' ').replace(/\s+/g, ' ').trim()
}

function checkLink(link: string): string {
  if (!/^https?:\/\/[^\s]+$/i.test(link)) throw new Error(`A link in a mail must be an absolute http(s) address, got "${link.slice(0, 80)}".`)
  return link
}

/**
 * When a link stops working, in words and in the studio's local time: "Wednesday, 9 December 2026
 * at 14:30 GMT" (UTC for a studio that has not chosen its zone). The crew page writes the same words.
 */
export function formatExpiry(expiresAt: Date, locale = 'en-GB', timeZone = 'UTC'): string {
  return dateTimeInZone(expiresAt, locale, timeZone)
}

/** How long from `now` until `expiresAt`, rounded to what a reader needs: "7 days", "1 hour", "30 minutes". */
export function formatDuration(expiresAt: Date, now = new Date()): string {
  const minutes = Math.max(0, Math.round((expiresAt.getTime() - now.getTime()) / 60_000))
  const unit = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`
  if (minutes >= 2 * 24 * 60) return unit(Math.round(minutes / (24 * 60)), 'day')
  if (minutes >= 2 * 60) return unit(Math.round(minutes / 60), 'hour')
  if (minutes >= 60 && minutes % 60 === 0) return unit(minutes / 60, 'hour')
  return unit(minutes, 'minute')
}

interface Layout {
  title: string
  /** Hidden preview line that mail clients show beside the subject. */
  preview: string
  heading: string
  /** Paragraphs before the button, already escaped HTML. */
  before: string[]
  button: { label: string; link: string }
  /** Paragraphs after the button, already escaped HTML. */
  after: string[]
  footer: string
}

const p = (html: string, muted = false) =>
  `<p style="margin:0 0 16px 0;font-size:${muted ? '15px' : '17px'};line-height:1.55;color:${muted ? C.muted : C.ink};">${html}</p>`

function layout(l: Layout): string {
  const link = escapeHtml(l.button.link)
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="color-scheme" content="light">
<title>${escapeHtml(l.title)}</title>
</head>
<body style="margin:0;padding:0;background-color:${C.paper};">
<div style="display:none;max-height:0;overflow:hidden;opacity:0;">${escapeHtml(l.preview)}</div>
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" bgcolor="${C.paper}" style="background-color:${C.paper};">
<tr><td align="center" style="padding:24px 12px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="max-width:560px;font-family:${FONT};color:${C.ink};">
<tr><td style="padding:0 4px 12px 4px;font-family:${FONT};font-size:15px;font-weight:bold;letter-spacing:0.08em;text-transform:uppercase;color:${C.paprika};">Hobline</td></tr>
<tr><td bgcolor="${C.card}" style="background-color:${C.card};border:1px solid ${C.line};border-radius:16px;padding:28px 24px;font-family:${FONT};">
<h1 style="margin:0 0 16px 0;font-size:24px;line-height:1.3;font-weight:bold;color:${C.ink};">${escapeHtml(l.heading)}</h1>
${l.before.map((x) => p(x)).join('\n')}
<table role="presentation" cellpadding="0" cellspacing="0" border="0" style="margin:8px 0 24px 0;">
<tr><td bgcolor="${C.paprika}" style="background-color:${C.paprika};border-radius:8px;">
<a href="${link}" style="display:inline-block;padding:13px 22px;font-family:${FONT};font-size:17px;font-weight:bold;line-height:1.2;color:#ffffff;text-decoration:none;border-radius:8px;">${escapeHtml(l.button.label)}</a>
</td></tr>
</table>
${l.after.map((x) => p(x, true)).join('\n')}
${p(`If the button does nothing, copy this address into your browser:<br><a href="${link}" style="color:${C.paprika};word-break:break-all;">${link}</a>`, true)}
</td></tr>
<tr><td style="padding:16px 4px 0 4px;font-family:${FONT};font-size:13px;line-height:1.5;color:${C.muted};">${l.footer}</td></tr>
</table>
</td></tr>
</table>
</body>
</html>
`
}

const FOOTER_TEXT = 'Hobline, the run-of-show for cooking on camera.'

export interface InviteMailInput {
  studioName: string
  inviterName: string
  role: string
  link: string
  expiresAt: Date
  /** The studio's locale, for the date (English locales only; others read as en-GB). */
  locale?: string
  /** The studio's time zone, for the time the link stops working. */
  timeZone?: string
  /** For the "in 7 days" figure; defaults to now. */
  now?: Date
}

function roleInWords(role: string): { label: string; summary: string } {
  if (!isStudioRole(role)) return { label: oneLine(role), summary: '' }
  const summary = STUDIO_ROLE_SUMMARIES[role]
  return { label: STUDIO_ROLE_LABELS[role], summary: summary.charAt(0).toLowerCase() + summary.slice(1) }
}

export function inviteMail(input: InviteMailInput): RenderedMail {
  const studio = oneLine(input.studioName)
  const inviter = oneLine(input.inviterName)
  const link = checkLink(input.link)
  const role = roleInWords(input.role)
  const until = formatExpiry(input.expiresAt, input.locale, input.timeZone)
  const within = formatDuration(input.expiresAt, input.now)
  const roleLine = role.summary ? `${role.label} — ${role.summary}.` : `${role.label}.`

  const subject = `${inviter} has kept a place for you on the ${studio} crew`
  const e = escapeHtml
  const html = layout({
    title: subject,
    preview: `Your role: ${role.label}. The invitation link works until ${until}.`,
    heading: `A place on the crew at ${studio}`,
    before: [
      `<strong>${e(inviter)}</strong> has asked you to join <strong>${e(studio)}</strong> in Hobline, where the studio plans its cooking shoots and runs them live, every screen on the same clock.`,
      `Your role: <strong>${e(role.label)}</strong>${role.summary ? ` — ${e(role.summary)}` : ''}.`,
    ],
    button: { label: 'Open the invitation', link },
    after: [
      `The invitation works until <strong>${e(until)}</strong> (${e(within)} from when it was sent). After that, ask ${e(inviter)} to send a new one.`,
      `Not expecting this? You can leave the mail unanswered: nobody joins the crew unless the invitation is opened and accepted.`,
    ],
    footer: `${e(FOOTER_TEXT)} Sent on behalf of ${e(studio)}.`,
  })
  const text = [
    `A place on the crew at ${studio}`,
    '',
    `${inviter} has asked you to join ${studio} in Hobline, where the studio plans its cooking shoots and runs them live, every screen on the same clock.`,
    '',
    `Your role: ${roleLine}`,
    '',
    'Open the invitation:',
    link,
    '',
    `The invitation works until ${until} (${within} from when it was sent). After that, ask ${inviter} to send a new one.`,
    '',
    'Not expecting this? You can leave the mail unanswered: nobody joins the crew unless the invitation is opened and accepted.',
    '',
    '-- ',
    `${FOOTER_TEXT} Sent on behalf of ${studio}.`,
    '',
  ].join('\n')
  return { subject, html, text }
}

export interface PasswordResetMailInput {
  name: string
  link: string
  expiresAt: Date
  now?: Date
}

export function passwordResetMail(input: PasswordResetMailInput): RenderedMail {
  const name = oneLine(input.name)
  const link = checkLink(input.link)
  const until = formatExpiry(input.expiresAt)
  const within = formatDuration(input.expiresAt, input.now)
  const subject = 'Set a new password for Hobline'
  const e = escapeHtml
  const html = layout({
    title: subject,
    preview: `The link works once, until ${until}.`,
    heading: 'A new password for your account',
    before: [`Hello ${e(name)}, a new Hobline password was asked for with this e-mail address. Choose one with the button below.`],
    button: { label: 'Choose a new password', link },
    after: [
      `The link works <strong>once</strong>, and only until <strong>${e(until)}</strong> (${e(within)} from when it was sent). For another try, ask for a new link on the sign-in page.`,
      `Did not ask for this? Then ignore this mail: your password stays as it is.`,
    ],
    footer: e(FOOTER_TEXT),
  })
  const text = [
    'A new password for your account',
    '',
    `Hello ${name}, a new Hobline password was asked for with this e-mail address. Choose one here:`,
    link,
    '',
    `The link works once, and only until ${until} (${within} from when it was sent). For another try, ask for a new link on the sign-in page.`,
    '',
    'Did not ask for this? Then ignore this mail: your password stays as it is.',
    '',
    '-- ',
    FOOTER_TEXT,
    '',
  ].join('\n')
  return { subject, html, text }
}
