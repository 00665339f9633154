// Cost per serving, with and without the optional ingredients, in the studio's currency.
import { z } from 'zod'

const query = z.object({
  servings: z.coerce.number({ error: 'write the number of servings, such as 4.' }).positive('write a number above 0, such as 4.').max(1000, 'write at most 1000.').optional(),
})

export default defineEventHandler(async (event) => {
  const { recipeId, studioId } = await requireRecipe(event, 'recipe.read')
  const { servings } = validateQuery(event, query)
  return recipeCostView(recipeId, studioId, servings)
})
