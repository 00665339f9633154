// The recipe as schema.org Recipe JSON-LD, with each ingredient's allergen certainty; importing this file
// gives the same recipe back (its allergens as suggestions to check).
export default defineEventHandler(async (event) => {
  const { recipeId } = await requireRecipe(event, 'recipe.read')
  const recipe = (await loadRecipe(recipeId))!
  const slug = recipe.title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'recipe'
  setResponseHeader(event, 'content-type', 'application/ld+json; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${slug}.jsonld"`)
  return JSON.stringify(exportRecipeJsonLd(recipe), null, 2)
})
