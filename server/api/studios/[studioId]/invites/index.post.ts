export default defineEventHandler(async (event) => {
  const { studioId, user } = await requireStudio(event, 'crew.manage')
  const { email, role } = await validateBody(event, inviteBodySchema)
  const { invite } = await inviteToStudio(siteUrl(event), studioId, user, email, role)
  setResponseStatus(event, 201)
  return { invite }
})
