export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'price.edit')
  const body = await validateBody(event, priceBodySchema)
  return updatePrice(studioId, routeId(event, 'priceId'), body)
})
