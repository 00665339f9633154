// The episode as a show: each segment's script with its live fields written from the data, the
// claims checked, and the planned runtime against the target (server/utils/show.ts).
export default defineEventHandler(async (event) => {
  const { episodeId } = await requireEpisode(event, 'episode.read')
  return episodeShow(episodeId)
})
