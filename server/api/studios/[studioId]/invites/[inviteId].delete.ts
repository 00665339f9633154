export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'crew.manage')
  await revokeInvite(studioId, routeId(event, 'inviteId'))
  setResponseStatus(event, 204)
  return null
})
