// Removes a step's photo and its thumbnail (204 also when it had none); 404 if the step is not in the recipe.
export default defineEventHandler(async (event) => {
  const { recipeId } = await requireRecipe(event, 'recipe.edit')
  await clearStepPhoto(recipeId, routeId(event, 'stepId'))
  setResponseStatus(event, 204)
  return null
})
