// A price list as CSV (the body as text/csv, or a multipart file field "file"). Every good row is
// added; every bad row is reported with its line number and what to fix, and nothing of it is saved.
export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'price.edit')
  const text = await readUploadText(event, 'file', 2 * 1024 * 1024)
  const result = await importPriceCsv(studioId, text)
  setResponseStatus(event, result.added.length ? 201 : 400)
  return result
})
