export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'episode.read')
  return { episodes: await listEpisodes(studioId) }
})
