export default defineEventHandler(async (event) => {
  const { recipeId } = await requireRecipe(event, 'recipe.read')
  return (await loadRecipe(recipeId))!
})
