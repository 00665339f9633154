// Start a shoot of the episode: a rehearsal (the clock may run faster) or a take.
import { z } from 'zod'

const body = z.object({ mode: z.enum(['rehearsal', 'take'], { error: 'mode must be rehearsal or take.' }) })

export default defineEventHandler(async (event) => {
  const { episodeId, studioId, caller } = await requireEpisode(event, 'shoot.create')
  const { mode } = await validateBody(event, body)
  const { handlers } = useShoot()
  const episode = await loadEpisodeRunOrder(episodeId)
  const row = await handlers.engine.create({
    studioId, episodeId, mode, createdBy: caller.user.id,
    title: `${episode.title} — ${mode === 'take' ? 'take' : 'rehearsal'}`,
    runOrder: episode.segments.map((s) => ({ id: `segment-${s.id}`, title: s.title, stepIds: s.steps.map((st) => String(st.id)) })),
  })
  setResponseStatus(event, 201)
  return httpAnswer(await handlers.snapshot(await httpConnection(event), { shootId: row.id }))
})
