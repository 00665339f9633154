// The producer takes a recipe's public page down: its address answers 404 from now on.
export default defineEventHandler(async (event) => {
  const { episodeId } = await requireEpisode(event, 'episode.edit')
  const recipeId = recipeIdParam(event)
  await unpublishRecipe(episodeId, recipeId)
  return publishKit(episodeId, siteUrl(event))
})
