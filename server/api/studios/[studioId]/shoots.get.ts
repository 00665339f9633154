// The shoots of a studio, newest first (server/utils/shoot-list.ts): every member.
export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'shoot.read')
  return listShoots({ studioId }, studioId)
})
