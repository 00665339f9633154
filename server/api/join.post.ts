// Public: a tablet trades a join code for a session limited to one shoot and one role.
// Wrong guesses are limited per address.
import { DomainError } from '../../shared/utils/domain-error'
export default defineEventHandler(async (event) => {
  const { code } = await validateBody(event, joinBodySchema)
  const key = `join:${clientAddress(event)}`
  assertUnderLimit(event, key, useRuntimeConfig().auth.joinPerAddress, 'join-code attempts from this device')
  const device = await redeemJoinCode(event, code)
  if (!device) {
    countAttempt(key)
    throw new DomainError('not-found', 'That join code is not valid or has expired. Check it on the control desk, or ask for a new one.')
  }
  return { shootId: device.shootId, role: device.role, until: device.until, next: shootScreenPath(device.shootId, device.role) }
})
