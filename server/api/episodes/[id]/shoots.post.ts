// Start a shoot of the episode: a rehearsal (the clock may run faster) or a take. Its run order is
// the episode's cook plan for the studio's kitchen (server/shoot/plan.ts).
import { z } from 'zod'
import { planShoot } from '../../../shoot/plan'

const body = z.object({ mode: z.enum(['rehearsal', 'take'], { error: 'choose rehearsal or take.' }) })

export default defineEventHandler(async (event) => {
  const { episodeId, studioId, caller } = await requireEpisode(event, 'shoot.create')
  const { mode } = await validateBody(event, body)
  const { handlers } = useShoot()
  const episode = await loadEpisodeRunOrder(episodeId)
  const { kitchen } = await studioSettings(studioId)
  const { runOrder, plan } = planShoot(episode, kitchen)
  const row = await handlers.engine.create({
    studioId, episodeId, mode, createdBy: caller.user.id,
    title: `${episode.title} — ${mode === 'take' ? 'take' : 'rehearsal'}`,
    runOrder, plan,
  })
  setResponseStatus(event, 201)
  return httpAnswer(await handlers.snapshot(await httpConnection(event), { shootId: row.id }))
})
