export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'crew.manage')
  await removeMember(studioId, routeId(event, 'userId'))
  setResponseStatus(event, 204)
  return null
})
