// A shoot command over HTTP: the same handler as the socket's `shoot:command`, so a refusal has the
// same code and message on either wire.
export default defineEventHandler(async (event) => {
  const shootId = routeId(event, 'id')
  const conn = await httpConnection(event)
  const body = await readJsonObject(event)
  return httpAnswer(await useShoot().handlers.command(conn, { ...body, shootId }))
})
