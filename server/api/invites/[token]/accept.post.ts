// Public: the token is the proof. A new address gets an account; an existing account confirms
// with its password. Either way the person is signed in, in the studio that invited them.
// The password check uses the sign-in attempts of the invited e-mail (and one of the address)
// before it runs, so an invite link is no way around the sign-in limit.
export default defineEventHandler(async (event) => {
  const body = await validateBody(event, acceptInviteBodySchema)
  const token = getRouterParam(event, 'token') ?? ''
  const address = clientAddress(event)
  await consumeAttempt(event, 'inviteAddress', address)
  const email = await invitedEmail(token)
  await consumeAttempt(event, 'loginEmail', email, email)
  const { user, studioId } = await acceptInvite(token, body)
  await Promise.all([clearAttempts('loginEmail', email), refundAttempt('inviteAddress', address)])
  await startMemberSession(event, user, studioId)
  return { user: publicUser(user), studioId, memberships: await membershipsOf(user.id) }
})
