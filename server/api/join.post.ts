// Public: a tablet trades a join code for a session limited to one shoot and one role.
// Each guess uses an attempt of its address before the code is looked up; a good code gives it back.
import { DomainError } from '../../shared/utils/domain-error'
export default defineEventHandler(async (event) => {
  const { code } = await validateBody(event, joinBodySchema)
  const address = clientAddress(event)
  await consumeAttempt(event, 'join', address)
  const device = await redeemJoinCode(event, code)
  if (!device) throw new DomainError('not-found', 'That join code is not valid or has expired. Check it on the control desk, or ask for a new one.')
  await refundAttempt('join', address)
  return { shootId: device.shootId, role: device.role, until: device.until, next: shootScreenPath(device.shootId, device.role) }
})
