// Cost per serving, with and without the optional ingredients, in the studio's currency.
import { z } from 'zod'

const query = z.object({
  servings: z.coerce.number({ error: 'servings must be a number.' }).positive('servings must be above zero.').max(1000, 'servings is at most 1000.').optional(),
})

export default defineEventHandler(async (event) => {
  const { recipeId, studioId } = await requireRecipe(event, 'recipe.read')
  const { servings } = validateQuery(event, query)
  return recipeCostView(recipeId, studioId, servings)
})
