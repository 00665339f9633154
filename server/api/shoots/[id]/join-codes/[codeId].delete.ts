export default defineEventHandler(async (event) => {
  const { shootId } = await requireShoot(event, 'joincode.manage')
  await revokeJoinCode(shootId, routeId(event, 'codeId'))
  setResponseStatus(event, 204)
  return null
})
