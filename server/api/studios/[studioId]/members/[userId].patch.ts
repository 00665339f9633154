// A crew member's role (producers only) or reading pace on camera (producers, or the member for
// their own pace).
export default defineEventHandler(async (event) => {
  const caller = await requireStudio(event, 'crew.read')
  const userId = routeId(event, 'userId')
  const body = await validateBody(event, memberBodySchema, { role: 'Role', readingWpm: 'Reading pace' })
  const self = caller.user.id === userId && body.role === undefined
  if (!self && !roleCan(caller.role, 'crew.manage')) {
    throw new DomainError('forbidden', body.role === undefined
      ? 'Only a producer sets another crew member\'s reading pace; you can set your own.'
      : 'Only a producer changes roles. Ask the studio\'s producer.')
  }
  return changeMember(caller.studioId, userId, body)
})
