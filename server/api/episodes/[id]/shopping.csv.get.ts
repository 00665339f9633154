// The shopping list as a CSV download, for every role that reads the episode.
export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'episode.read')
  const { csv } = await shoppingCsv(episodeId, studioId)
  setResponseHeader(event, 'Content-Type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'Content-Disposition', `attachment; filename="shopping-list-episode-${episodeId}.csv"`)
  return csv
})
