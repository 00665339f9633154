// The bodies of "adopt the actuals" and its undo (server/api/shoots/[id]/report/). Apart from the
// report's maths on purpose: no page may import a module that builds a zod schema (the content
// security policy, see show-segment-schemas.ts).
import { z } from 'zod'

const WHOLE = 'write the number the report gave, a whole number such as 3.'
const whole = () => z.number({ error: WHOLE }).int(WHOLE).positive(WHOLE)
const EACH = 'list each recipe of the report with its number and version.'

export const adoptActualsSchema = z.object({
  recipes: z.array(z.object({ id: whole(), version: whole() }, { error: EACH }), { error: EACH })
    .min(1, EACH).max(50, 'list at most 50 recipes.'),
})

export const undoAdoptionSchema = z.object({ adoptionId: whole() })

/** Labels of their fields in refusals (field-labels.ts). */
export const REHEARSAL_FIELD_LABELS = { recipes: 'Recipe versions', adoptionId: 'Adoption to undo' }
