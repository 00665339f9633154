// The episode's publish kit: the chosen recording's chapter lines, each recipe's public page and the video description.
export default defineEventHandler(async (event) => {
  const { episodeId } = await requireEpisode(event, 'episode.read')
  return publishKit(episodeId, siteUrl(event))
})
