// Tick or untick one line of the shopping list for the whole crew (producers and hosts).
import { z } from 'zod'

const body = z.object({ ticked: z.boolean({ error: 'write true or false.' }) })

export default defineEventHandler(async (event) => {
  const { episodeId, studioId, caller } = await requireEpisode(event, 'shopping.tick')
  const { ticked } = await validateBody(event, body, { ticked: 'Ticked' })
  return setShoppingCheck(episodeId, studioId, getRouterParam(event, 'key') ?? '', ticked, caller.user)
})
