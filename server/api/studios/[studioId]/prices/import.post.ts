// A price list as CSV (the body as text/csv, or a multipart file field "file"). Every good row is
// added; every bad row is reported with its line number and what to fix, and nothing of it is saved.
// When no row is good, the answer is a refusal (400) whose message names the first problem and whose
// data carries every one (`data.errors`), as the page lists them.
import { DomainError } from '../../../../../shared/utils/domain-error'

export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'price.edit')
  const text = await readUploadText(event, 'file', 2 * 1024 * 1024)
  const result = await importPriceCsv(studioId, text)
  if (!result.added.length) {
    const more = result.errors.length > 1 ? ` (${result.errors.length - 1} more problems are listed by line)` : ''
    throw new DomainError('invalid', `No price was added. ${result.errors[0]?.message ?? 'The list has no rows under its header; add one line per item.'}${more}`, {
      field: 'file', data: { added: [], errors: result.errors },
    })
  }
  setResponseStatus(event, 201)
  return result
})
