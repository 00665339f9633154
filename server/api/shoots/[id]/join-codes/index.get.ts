export default defineEventHandler(async (event) => {
  const { shootId } = await requireShoot(event, 'joincode.manage')
  return { codes: await listJoinCodes(siteUrl(event), shootId) }
})
