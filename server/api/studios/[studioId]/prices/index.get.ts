export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'recipe.read')
  return { prices: await listPrices(studioId) }
})
