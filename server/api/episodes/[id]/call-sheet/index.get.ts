// The episode's call sheet as it is now, what the producer wrote on it, the sends and what changed since the last one.
export default defineEventHandler(async (event) => {
  const { episodeId } = await requireEpisode(event, 'episode.read')
  return loadCallSheet(episodeId)
})
