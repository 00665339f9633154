// The producer chooses the recording whose take log gives the chapters, and the finished video's address.
import { publishTakeSchema } from '../../../../../shared/utils/publish-schemas'

export default defineEventHandler(async (event) => {
  const { episodeId } = await requireEpisode(event, 'episode.edit')
  await setPublishTake(episodeId, await validateBody(event, publishTakeSchema))
  return publishKit(episodeId, siteUrl(event))
})
