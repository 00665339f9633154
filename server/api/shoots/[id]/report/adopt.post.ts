// "Adopt the actuals": the suggested ranges become the steps' planned ranges, over the recipe
// versions the report showed (a stale one is 409 and nothing changes). Producers only.
import { DomainError } from '../../../../../shared/utils/domain-error'
import { adoptActualsSchema, REHEARSAL_FIELD_LABELS } from '../../../../../shared/utils/rehearsal-schemas'

export default defineEventHandler(async (event) => {
  const caller = await requireShoot(event, 'episode.edit')
  if (caller.kind !== 'member') throw new DomainError('forbidden', 'This device joined one shoot only and may open nothing else.')
  const { recipes } = await validateBody(event, adoptActualsSchema, REHEARSAL_FIELD_LABELS)
  return adoptActuals(caller.shootId, caller.studioId, recipes, { id: caller.user.id, name: caller.user.name })
})
