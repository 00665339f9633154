// The episode's prep list (mise en place), in the order the cook plan needs it.
export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'episode.read')
  return episodePrep(episodeId, studioId)
})
