// Public. An attempt is used per e-mail and per address BEFORE the password is checked (so parallel
// guesses cannot all be checked); a success gives the address's attempt back and clears the e-mail's.
import { DomainError } from '../../../shared/utils/domain-error'
export default defineEventHandler(async (event) => {
  const { email, password } = await validateBody(event, loginBodySchema)
  const address = clientAddress(event)
  await consumeAttempt(event, 'loginAddress', address)
  await consumeAttempt(event, 'loginEmail', email, email)
  const user = await checkCredentials(email, password)
  if (!user) throw new DomainError('signed-out', 'That e-mail and password do not match an account. Check both, or reset the password.')
  await Promise.all([clearAttempts('loginEmail', email), refundAttempt('loginAddress', address)])
  await startMemberSession(event, user)
  return { user: publicUser(user), memberships: await membershipsOf(user.id) }
})
