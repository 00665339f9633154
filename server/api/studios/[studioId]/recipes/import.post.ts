// Import a schema.org Recipe: JSON-LD, an HTML page that embeds it (also inside @graph), or an
// uploaded file of either (multipart field "file"). `?preview=1` only reads it and says what could
// not be understood; without it the recipe is saved (201). Over 512 KB is refused before it is
// read, with a 413 that says to paste only the recipe's JSON-LD (DEVELOPERS.md, "Recipe import").
// `?confirmed=1,3` (step positions) or `?confirmed=all`: the times, waits and stations read from those
// steps' text were confirmed in the preview, so they are saved as confirmed.
import { z } from 'zod'
import { DomainError } from '../../../../../shared/utils/domain-error'
import { IMPORT_MAX_CHARS, IMPORT_TOO_LARGE } from '../../../../../shared/utils/schemaorg-read'

const query = z.object({
  preview: z.enum(['0', '1', 'true', 'false'], { error: 'write 1 to preview only, or 0 to save.' }).optional(),
  confirmed: z.string().regex(/^(?:all|\d{1,3}(?:,\d{1,3}){0,199})$/, 'list the step numbers such as 1,3, or write all.').optional(),
})

export default defineEventHandler(async (event) => {
  const { studioId, user } = await requireStudio(event, 'recipe.edit')
  const { preview, confirmed } = validateQuery(event, query)
  const text = await readUploadText(event, 'file', IMPORT_MAX_CHARS).catch((error) => {
    throw error instanceof DomainError && error.code === 'too-large' ? new DomainError('too-large', IMPORT_TOO_LARGE) : error
  })
  const result = await readRecipeImport(studioId, text)
  if (preview === '1' || preview === 'true') return result
  if (confirmed) {
    const positions = confirmed === 'all' ? null : new Set(confirmed.split(',').map(Number))
    result.body.steps.forEach((s, i) => {
      if (!positions || positions.has(i + 1)) s.readFromText = []
    })
  }
  setResponseStatus(event, 201)
  return { recipe: await createRecipe(studioId, result.body, { name: user.name }), problems: result.problems, images: result.images }
})
