// Public. Failed attempts are limited per e-mail and per address; a success clears the e-mail's count.
import { DomainError } from '../../../shared/utils/domain-error'
export default defineEventHandler(async (event) => {
  const { email, password } = await validateBody(event, loginBodySchema)
  const limits = useRuntimeConfig().auth
  const byEmail = `login:email:${email}`
  const byAddress = `login:address:${clientAddress(event)}`
  assertUnderLimit(event, byAddress, limits.loginPerAddress, 'sign-in attempts from this network')
  assertUnderLimit(event, byEmail, limits.loginPerEmail, `sign-in attempts for ${email}`)
  const user = await checkCredentials(email, password)
  if (!user) {
    countAttempt(byEmail)
    countAttempt(byAddress)
    throw new DomainError('signed-out', 'That e-mail and password do not match an account. Check both, or reset the password.')
  }
  clearAttempts(byEmail)
  await startMemberSession(event, user)
  return { user: publicUser(user), memberships: await membershipsOf(user.id) }
})
