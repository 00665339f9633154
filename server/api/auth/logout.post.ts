// Anyone may sign out, signed in or not.
export default defineEventHandler(async (event) => {
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})
