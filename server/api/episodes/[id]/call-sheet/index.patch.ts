// The producer writes the call time, place, nearest hospital and crew call times, over the version they read.
import { callSheetBodySchema } from '../../../../../shared/utils/call-sheet-schema'

export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'episode.edit')
  const body = await validateBody(event, callSheetBodySchema)
  return saveCallSheet(episodeId, studioId, body)
})
