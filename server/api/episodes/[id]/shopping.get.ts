// The episode's shopping list at the shoot's servings, with the crew's ticks and the list's version.
export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'episode.read')
  return shoppingView(episodeId, studioId)
})
