// A step's photo, as for the recipe's own: multipart field "photo"; the step must be in the recipe.
export default defineEventHandler(async (event) => {
  const { recipeId, studioId } = await requireRecipe(event, 'recipe.edit')
  const stepId = routeId(event, 'stepId')
  await requireRecipeStep(recipeId, stepId)
  const bytes = await readPhotoUpload(event, 'photo')
  const key = await setStepPhoto(recipeId, studioId, stepId, bytes)
  setResponseStatus(event, 201)
  return { photo: photoUrl(key) }
})
