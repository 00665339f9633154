// "Adopt the actuals": the suggested ranges become the steps' planned ranges, over the recipe
// versions the report showed (a stale one is 409 and nothing changes). Producers only.
import { z } from 'zod'
import { DomainError } from '../../../../../shared/utils/domain-error'

const WHOLE = 'write the number the report gave, a whole number such as 3.'
const body = z.object({
  recipes: z.array(z.object({
    id: z.number({ error: WHOLE }).int(WHOLE).positive(WHOLE),
    version: z.number({ error: WHOLE }).int(WHOLE).positive(WHOLE),
  }, { error: 'list each recipe with its number and version.' }), { error: 'list each recipe of the report with its version.' }).min(1, 'list each recipe of the report with its version.').max(50, 'list at most 50 recipes.'),
})

export default defineEventHandler(async (event) => {
  const caller = await requireShoot(event, 'episode.edit')
  if (caller.kind !== 'member') throw new DomainError('forbidden', 'This device joined one shoot only and may open nothing else.')
  const { recipes } = await validateBody(event, body, { recipes: 'Recipe versions' })
  return adoptActuals(caller.shootId, caller.studioId, recipes, { id: caller.user.id, name: caller.user.name })
})
