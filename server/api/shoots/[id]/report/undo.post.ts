// Undo "adopt the actuals": the ranges before are put back, while nobody has saved those recipes since. Producers only.
import { REHEARSAL_FIELD_LABELS, undoAdoptionSchema } from '../../../../../shared/utils/rehearsal-schemas'

export default defineEventHandler(async (event) => {
  const { shootId } = await requireShoot(event, 'episode.edit')
  const { adoptionId } = await validateBody(event, undoAdoptionSchema, REHEARSAL_FIELD_LABELS)
  return undoAdoption(shootId, adoptionId)
})
