export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'crew.manage')
  return { invites: await listInvites(studioId) }
})
