// Public: the token is the proof. A new address gets an account; an existing account confirms
// with its password. Either way the person is signed in, in the studio that invited them.
export default defineEventHandler(async (event) => {
  const body = await validateBody(event, acceptInviteBodySchema)
  const { user, studioId } = await acceptInvite(getRouterParam(event, 'token') ?? '', body)
  await startMemberSession(event, user, studioId)
  return { user: publicUser(user), studioId, memberships: await membershipsOf(user.id) }
})
