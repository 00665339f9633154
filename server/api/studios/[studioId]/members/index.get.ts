export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'crew.read')
  return { members: await listMembers(studioId) }
})
