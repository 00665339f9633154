// A new episode; `recipeIds` makes one recipe segment each, in order.
export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'episode.edit')
  const body = await validateBody(event, episodeCreateSchema, EPISODE_LABELS)
  setResponseStatus(event, 201)
  return createEpisode(studioId, body)
})
