// The take log as JSON at the chosen camera's timecode (producer and viewer).
import { takeLogJson } from '../../../../shared/utils/take-log-export'

export default defineEventHandler(async (event) => {
  const x = await takeLogExport(event)
  return takeLogJson(x.state, x.camera, { id: x.shootId, title: x.title })
})
