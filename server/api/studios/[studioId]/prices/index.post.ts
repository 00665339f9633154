export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'price.edit')
  const body = await validateBody(event, priceBodySchema)
  setResponseStatus(event, 201)
  return createPrice(studioId, body)
})
