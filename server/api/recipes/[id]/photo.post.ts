// The recipe's photo: a JPEG, PNG or WebP in the multipart field "photo", up to 8 MB. Replaces the
// photo before it (which is deleted); answers 201 with the addresses of the photo and its thumbnail.
export default defineEventHandler(async (event) => {
  const { recipeId, studioId } = await requireRecipe(event, 'recipe.edit')
  const bytes = await readPhotoUpload(event, 'photo')
  const key = await setRecipePhoto(recipeId, studioId, bytes)
  setResponseStatus(event, 201)
  return { photo: photoUrl(key) }
})
