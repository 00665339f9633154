// The ingredients for N servings in metric or US units, kitchen-rounded text beside exact numbers.
import { z } from 'zod'

const query = z.object({
  servings: z.coerce.number({ error: 'servings must be a number.' }).positive('servings must be above zero.').max(1000, 'servings is at most 1000.').optional(),
  units: z.enum(['metric', 'us'], { error: 'units must be metric or us.' }).optional(),
})

export default defineEventHandler(async (event) => {
  const { recipeId, studioId } = await requireRecipe(event, 'recipe.read')
  const { servings, units } = validateQuery(event, query)
  return scaledRecipe(recipeId, studioId, servings, units)
})
