// The cook plan for the episode against the studio's kitchen, or a what-if kitchen from the query.
import { z } from 'zod'

const count = (name: string, min: number, max: number) => z.coerce.number({ error: `${name} must be a number.` }).int(`${name} must be a whole number.`).min(min, `${name} is at least ${min}.`).max(max, `${name} is at most ${max}.`).optional()
const query = z.object({
  hands: count('hands', 1, 12),
  burners: count('burners', 0, 16),
  ovens: count('ovens', 0, 6),
  racks: count('racks', 1, 6),
  parallel: z.enum(['0', '1'], { error: 'parallel must be 1 or 0.' }).optional(),
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
