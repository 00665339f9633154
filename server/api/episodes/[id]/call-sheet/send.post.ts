// Send the call sheet the producer read (named by its fingerprint) to every crew member, with the
// shoot as an iCalendar event; a re-send says what changed since the last one.
import { callSheetSendSchema } from '../../../../../shared/utils/call-sheet-schema'

export default defineEventHandler(async (event) => {
  const { episodeId, caller } = await requireEpisode(event, 'episode.edit')
  const { hash } = await validateBody(event, callSheetSendSchema)
  return sendCallSheet(episodeId, { id: caller.user.id, name: caller.user.name }, hash, siteUrl(event))
})
