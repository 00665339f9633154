// The take log as CSV, one row per marker, at the chosen camera's timecode (producer and viewer).
export default defineEventHandler(async (event) => {
  const x = await takeLogExport(event)
  attachment(event, 'text/csv; charset=utf-8', takeLogFileName(x, 'csv'))
  return takeLogCsv(x)
})
