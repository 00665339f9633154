export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'crew.manage')
  const userId = routeId(event, 'userId')
  const { role } = await validateBody(event, roleBodySchema)
  return changeRole(studioId, userId, role)
})
