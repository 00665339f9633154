export default defineEventHandler(async (event) => {
  const caller = await requireShoot(event, 'joincode.manage')
  const { role, minutes } = await validateBody(event, joinCodeBodySchema, JOIN_CODE_LABELS)
  const code = await createJoinCode(siteUrl(event), caller.shootId, role, caller.kind === 'member' ? caller.user.id : 0, minutes)
  setResponseStatus(event, 201)
  return code
})
