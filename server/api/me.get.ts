// The caller: a member with their studios, or a device with its one shoot.
export default defineEventHandler(async (event) => {
  const session = await currentSession(event)
  if (session.device) return { user: null, memberships: [], device: session.device, studioId: session.device.studioId }
  const user = await requireMember(event)
  await useDb()
  const memberships = await membershipsOf(user.id)
  const current = memberships.find((m) => m.studioId === session.studioId) ?? memberships[0]
  return { user, memberships, device: null, studioId: current?.studioId ?? null }
})
