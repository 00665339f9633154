// Public: anyone may open a studio. Creates the user and the studio, with the user as its producer.
export default defineEventHandler(async (event) => {
  const body = await validateBody(event, signupBodySchema)
  const { user, studioId } = await signUp(body)
  await startFreshSession(event, { user, studioId, loggedInAt: Date.now() })
  setResponseStatus(event, 201)
  return { user, memberships: await membershipsOf(user.id) }
})
