// Reading a studio's outbox: the mail the local catcher kept for it. Plain objects out, never models.
import { z } from 'zod'
import { Mail } from '../db/models'

export const OUTBOX_PAGE_MAX = 100

// The message follows the field's label (server/utils/validate.ts puts "How many to show: " in front).
const wholeNumber = (min: number, max?: number) => {
  const range = max === undefined ? `${min} or more` : `from ${min} to ${max}`
  const message = `write a whole number ${range}.`
  const base = z.coerce.number({ error: message }).int(message).min(min, message)
  return max === undefined ? base : base.max(max, message)
}

export const outboxQuerySchema = z.object({
  limit: wholeNumber(1, OUTBOX_PAGE_MAX).default(50),
  offset: wholeNumber(0).default(0),
})

export interface OutboxEntry {
  id: number
  kind: string
  to: string
  subject: string
  receivedAt: string
}

export interface OutboxMail extends OutboxEntry {
  from: string
  html: string | null
  text: string | null
}

/** Newest first; ties (the same millisecond) by id, newest first too. */
export async function listOutbox(studioId: number, page: { limit: number; offset: number }): Promise<OutboxEntry[]> {
  const rows = await Mail.findAll({
    where: { studioId },
    attributes: ['id', 'kind', 'to', 'subject', 'receivedAt'],
    order: [['receivedAt', 'DESC'], ['id', 'DESC']],
    limit: page.limit,
    offset: page.offset,
  })
  return rows.map((m) => ({ id: m.id, kind: m.kind, to: m.to, subject: m.subject, receivedAt: m.receivedAt.toISOString() }))
}

/** One mail, only if it was filed under this studio. */
export async function readOutboxMail(studioId: number, mailId: number): Promise<OutboxMail | null> {
  const m = await Mail.findOne({ where: { id: mailId, studioId } })
  if (!m) return null
  return {
    id: m.id,
    kind: m.kind,
    from: m.from,
    to: m.to,
    subject: m.subject,
    html: m.html,
    text: m.text,
    receivedAt: m.receivedAt.toISOString(),
  }
}
