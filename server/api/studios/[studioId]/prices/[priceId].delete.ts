export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'price.edit')
  await deletePrice(studioId, routeId(event, 'priceId'))
  setResponseStatus(event, 204)
  return null
})
