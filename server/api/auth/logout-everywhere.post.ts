// A member ends every other session of their account (other browsers, a lost tablet): the account's
// session version goes up, and this session takes the new one, so it stays signed in.
export default defineEventHandler(async (event) => {
  const user = await requireMember(event)
  const sessionVersion = await endSessions(user.id)
  await setUserSession(event, { sessionVersion })
  return { message: 'Signed out on every other browser and device. This one stays signed in.' }
})
