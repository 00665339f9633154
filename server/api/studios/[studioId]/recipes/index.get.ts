// The studio's recipes, with search and filters, and each one's cost per serving.
import { z } from 'zod'

const query = z.object({
  q: z.string().trim().max(100, 'search for at most 100 characters.').optional(),
  tag: z.string().trim().max(40).optional(),
  allergen: z.string().trim().max(40).optional(),
  without: z.string().trim().max(40).optional(),
})

export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'recipe.read')
  const filters = validateQuery(event, query)
  return listRecipes(studioId, filters)
})
