export default defineEventHandler(async (event) => {
  const { episodeId } = await requireEpisode(event, 'episode.read')
  return (await loadEpisode(episodeId))!
})
