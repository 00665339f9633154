// The producer publishes one of the episode's recipes at a chosen address, or a new random one.
import { publishRecipeSchema } from '../../../../../../shared/utils/publish-schemas'

export default defineEventHandler(async (event) => {
  const { episodeId, caller } = await requireEpisode(event, 'episode.edit')
  const recipeId = recipeIdParam(event)
  const { slug } = await validateBody(event, publishRecipeSchema)
  await publishRecipe(episodeId, recipeId, slug ?? null, caller.kind === 'member' ? caller.user.name : 'a device')
  return publishKit(episodeId, siteUrl(event))
})
