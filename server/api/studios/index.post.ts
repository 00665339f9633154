// A signed-in member opens another studio and becomes its producer; the app then works in it.
export default defineEventHandler(async (event) => {
  const user = await requireMember(event)
  const body = await validateBody(event, newStudioBodySchema, NEW_STUDIO_LABELS)
  const studio = await openStudio(user.id, body)
  await setUserSession(event, { studioId: studio.id })
  setResponseStatus(event, 201)
  return { studio, memberships: await membershipsOf(user.id) }
})
