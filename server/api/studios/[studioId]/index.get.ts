export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'studio.read')
  return studioSettings(studioId)
})
