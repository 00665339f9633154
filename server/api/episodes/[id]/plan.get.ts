// The cook plan for the episode against the studio's kitchen, or a what-if kitchen from the query.
import { z } from 'zod'

const count = (min: number, max: number) => {
  const words = `write a whole number from ${min} to ${max}.`
  return z.coerce.number({ error: words }).int(words).min(min, words).max(max, words).optional()
}
const query = z.object({
  hands: count(1, 12),
  burners: count(0, 16),
  ovens: count(0, 6),
  racks: count(1, 6),
  parallel: z.enum(['0', '1'], { error: 'write 1 for yes or 0 for no.' }).optional(),
})

export default defineEventHandler(async (event) => {
  const { episodeId, studioId } = await requireEpisode(event, 'episode.read')
  const q = validateQuery(event, query)
  const saved = (await studioSettings(studioId)).kitchen
  const kitchen = {
    hands: q.hands ?? saved.hands,
    burners: q.burners ?? saved.burners,
    ovens: q.ovens ?? saved.ovens,
    racksPerOven: q.racks ?? saved.racksPerOven,
    parallelRecipes: q.parallel === undefined ? saved.parallelRecipes : q.parallel === '1',
  }
  return planEpisode(episodeId, kitchen)
})
