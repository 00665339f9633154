// One mail from the studio's outbox, with its HTML and plain-text parts. Producers only.
import { readOutboxMail } from '../../../../mail/outbox'

export default defineEventHandler(async (event) => {
  const caller = await requireStudio(event, 'mail.read')
  const mailId = routeId(event, 'mailId')
  const mail = await readOutboxMail(caller.studioId, mailId)
  if (!mail) throw createError({ statusCode: 404, statusMessage: "There is no such mail in this studio's outbox." })
  return mail
})
