// Start a shoot of the episode: a rehearsal (the clock may run faster) or a take.
import { z } from 'zod'

const body = z.object({ mode: z.enum(['rehearsal', 'take'], { error: 'mode must be rehearsal or take.' }) })

export default defineEventHandler(async (event) => {
  const { episodeId, studioId, caller } = await requireEpisode(event, 'shoot.create')
  const { mode } = await validateBody(event, body)
  const shootId = await createShoot(episodeId, studioId, mode, caller.kind === 'member' ? caller.user.id : null)
  setResponseStatus(event, 201)
  return shootSnapshot(shootId, caller)
})
