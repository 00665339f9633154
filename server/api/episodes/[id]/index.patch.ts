export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'episode.edit')
  const body = await validateBody(event, episodeUpdateSchema, EPISODE_LABELS)
  return saveEpisode(episodeId, studioId, body)
})
