// A shoot command over HTTP: the same handler as the socket's `shoot:command`, so a refusal has the
// same code and message on either wire. The guard goes first, so a stranger's unreadable body is
// answered "sign in", not "bad JSON"; the handler checks the caller again, as it does for a socket.
export default defineEventHandler(async (event) => {
  const { shootId } = await requireShoot(event, 'shoot.read')
  const body = await readJsonObject(event)
  return httpAnswer(await useShoot().handlers.command(await httpConnection(event), { ...body, shootId }))
})
