export default defineEventHandler(async (event) => {
  const { studioId, user } = await requireStudio(event, 'crew.manage')
  const { invite } = await resendInvite(siteUrl(event), studioId, routeId(event, 'inviteId'), user.name)
  return { invite }
})
