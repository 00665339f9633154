// A rehearsal's report: each step and segment planned against actual in kitchen time, the biggest
// overruns, and the range every rehearsal of its recipes suggests (server/utils/rehearsal.ts).
export default defineEventHandler(async (event) => {
  const { shootId } = await requireShoot(event, 'shoot.read')
  return loadRehearsalReport(shootId)
})
