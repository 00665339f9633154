// The ingredients for N servings in metric or US units, kitchen-rounded text beside exact numbers.
import { z } from 'zod'

const query = z.object({
  servings: z.coerce.number({ error: 'write the number of servings, such as 4.' }).positive('write a number above 0, such as 4.').max(1000, 'write at most 1000.').optional(),
  units: z.enum(['metric', 'us'], { error: 'choose metric or us.' }).optional(),
})

export default defineEventHandler(async (event) => {
  const { recipeId, studioId } = await requireRecipe(event, 'recipe.read')
  const { servings, units } = validateQuery(event, query)
  return scaledRecipe(recipeId, studioId, servings, units)
})
