// The studio's outbox (mail the local catcher kept), newest first. Producers only.
import { listOutbox, outboxQuerySchema } from '../../../../mail/outbox'

export default defineEventHandler(async (event) => {
  const caller = await requireStudio(event, 'mail.read')
  const page = validateQuery(event, outboxQuerySchema)
  const mails = await listOutbox(caller.studioId, page)
  return { mails }
})
