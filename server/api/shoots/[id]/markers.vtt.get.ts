// The take log as WebVTT: ?track=chapters (one cue per step, the default) or ?track=markers.
import { takeLogVtt } from '../../../../shared/utils/take-log-export'

export default defineEventHandler(async (event) => {
  const x = await takeLogExport(event)
  attachment(event, 'text/vtt; charset=utf-8', takeLogFileName(x, 'vtt', `-${x.track}`))
  return takeLogVtt(x.state, x.camera, x.track, x.title, x.recordingEndMs)
})
