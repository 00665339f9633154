// Removes the recipe's photo and its thumbnail (204 also when it had none).
export default defineEventHandler(async (event) => {
  const { recipeId } = await requireRecipe(event, 'recipe.edit')
  await clearRecipePhoto(recipeId)
  setResponseStatus(event, 204)
  return null
})
