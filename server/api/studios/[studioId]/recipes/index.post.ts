export default defineEventHandler(async (event) => {
  const { studioId, user } = await requireStudio(event, 'recipe.edit')
  const body = await validateBody(event, recipeCreateSchema)
  await assertPricesInStudio(studioId, body.ingredients)
  setResponseStatus(event, 201)
  return createRecipe(studioId, body, { name: user.name })
})
