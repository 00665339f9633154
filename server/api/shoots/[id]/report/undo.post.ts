// Undo "adopt the actuals": the ranges before are put back, while nobody has saved those recipes since. Producers only.
import { z } from 'zod'

const WHOLE = 'write the number the report gave, a whole number such as 3.'
const body = z.object({ adoptionId: z.number({ error: WHOLE }).int(WHOLE).positive(WHOLE) })

export default defineEventHandler(async (event) => {
  const { shootId } = await requireShoot(event, 'episode.edit')
  const { adoptionId } = await validateBody(event, body, { adoptionId: 'Adoption to undo' })
  return undoAdoption(shootId, adoptionId)
})
