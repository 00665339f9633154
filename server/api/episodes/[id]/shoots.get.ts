// The shoots of an episode, newest first (server/utils/shoot-list.ts): every member of its studio.
export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'shoot.read')
  return listShoots({ episodeId }, studioId)
})
