// Public: anyone may open a studio. Creates the user and the studio, with the user as its producer.
// New accounts are limited per address (NUXT_AUTH_SIGNUP_PER_ADDRESS), counted before the account is made.
export default defineEventHandler(async (event) => {
  const body = await validateBody(event, signupBodySchema)
  await consumeAttempt(event, 'signup', clientAddress(event))
  const { user, studioId, sessionVersion } = await signUp(body)
  await startFreshSession(event, { user, studioId, sessionVersion, loggedInAt: Date.now() })
  setResponseStatus(event, 201)
  return { user, memberships: await membershipsOf(user.id) }
})
