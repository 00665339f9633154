// The shoot's snapshot: the same answer `shoot:join` acknowledges with.
export default defineEventHandler(async (event) => {
  const shootId = routeId(event, 'id')
  return httpAnswer(await useShoot().handlers.snapshot(await httpConnection(event), { shootId }))
})
