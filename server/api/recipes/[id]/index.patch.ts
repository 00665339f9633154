// Saves the whole recipe; `version` must be the one the editor opened (409 otherwise).
export default defineEventHandler(async (event) => {
  const { caller, recipeId, studioId } = await requireRecipe(event, 'recipe.edit')
  const body = await validateBody(event, recipeUpdateSchema)
  await assertPricesInStudio(studioId, body.ingredients)
  return saveRecipe(recipeId, body, { name: caller.user.name })
})
