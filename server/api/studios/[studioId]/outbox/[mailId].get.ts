// One mail from the studio's outbox, with its HTML and plain-text parts. Producers only.
import { readOutboxMail } from '../../../../mail/outbox'
import { DomainError } from '../../../../../shared/utils/domain-error'

export default defineEventHandler(async (event) => {
  const caller = await requireStudio(event, 'mail.read')
  const mailId = routeId(event, 'mailId')
  const mail = await readOutboxMail(caller.studioId, mailId)
  if (!mail) throw new DomainError('not-found', "There is no such mail in this studio's outbox.")
  return mail
})
