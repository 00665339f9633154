// The studio switcher in the app shell: remembers which studio the member is working in.
export default defineEventHandler(async (event) => {
  await requireMember(event)
  const { studioId } = await validateBody(event, switchStudioBodySchema)
  await authorize(event, { studioId }, 'studio.read')
  await setUserSession(event, { studioId })
  return { studioId }
})
