export default defineEventHandler(async (event) => {
  const { recipeId } = await requireRecipe(event, 'recipe.edit')
  await deleteRecipe(recipeId)
  setResponseStatus(event, 204)
  return null
})
