// The take log's exports (GET /api/shoots/:id/markers.csv, .vtt, .json): who may fetch them (the
// producer and the viewer, who is the editor: 'takelog.export' in roles.ts, through the one guard),
// which camera's timecode they are written in, and the CSV itself (csv-stringify). The content is
// built by shared/utils/take-log-export.ts.
import type { H3Event } from 'h3'
import { stringify } from 'csv-stringify/sync'
import type { ShootCamera, ShootState } from '../../shared/types/shoot'
import { DomainError } from '../../shared/utils/domain-error'
import { recordingMsAt } from '../../shared/utils/take-log'
import { CSV_HEADER, takeLogCsvRows } from '../../shared/utils/take-log-export'
import { RATE_WORDS, queryCamera, takeLogQuerySchema } from '../../shared/utils/take-log-schemas'
import { timecodeRateText } from '../../shared/utils/timecode'
import { shootServerNow } from '../shoot/clock'

export interface TakeLogExport {
  shootId: number
  title: string
  state: ShootState
  camera: ShootCamera
  track: 'chapters' | 'markers'
  /** The recording's length so far: the end of the last chapter. */
  recordingEndMs: number
}

/** The shoot, the camera chosen by `?camera=` or `?rate=&start=` (else the shoot's first camera) and the track. */
export async function takeLogExport(event: H3Event): Promise<TakeLogExport> {
  const { shootId } = await requireShoot(event, 'takelog.export')
  const query = validateQuery(event, takeLogQuerySchema)
  const row = await useShoot().handlers.engine.read(shootId)
  const cameras = row.state.cameras ?? []
  let camera: ShootCamera | undefined
  if (query.camera !== undefined) {
    camera = cameras.find((c) => c.id === query.camera)
    if (!camera) {
      const known = cameras.map((c) => `${c.id} (${c.name})`).join(', ')
      throw new DomainError('invalid', known
        ? `Camera: this shoot has no camera "${query.camera}"; choose one of ${known}.`
        : `Camera: this shoot has no cameras set; give the rate instead, such as ?rate=25&start=01:00:00:00.`, { field: 'camera' })
    }
  } else if (query.rate !== undefined) {
    camera = queryCamera(query.rate, query.start)
  } else {
    camera = cameras[0]
    if (!camera) {
      throw new DomainError('invalid', `Frame rate: this shoot has no cameras set, so say which timecode to write: ?rate=… (${RATE_WORDS}), `
        + 'and &start= the first frame\'s timecode if it is not 01:00:00:00.', { field: 'rate' })
    }
  }
  const s = row.state
  return {
    shootId, title: row.title, state: s, camera, track: query.track ?? 'chapters',
    recordingEndMs: recordingMsAt(s, shootServerNow()) ?? s.recordedMs ?? 0,
  }
}

/** A file name for the download: take-log-shoot-12-camera-a-29.97df.csv. */
export function takeLogFileName(x: TakeLogExport, ext: string, extra = ''): string {
  const cam = x.camera.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'camera'
  return `take-log-shoot-${x.shootId}-${cam}-${timecodeRateText(x.camera)}${extra}.${ext}`
}

export function attachment(event: H3Event, type: string, fileName: string) {
  setResponseHeader(event, 'Content-Type', type)
  setResponseHeader(event, 'Content-Disposition', `attachment; filename="${fileName}"`)
}

export function takeLogCsv(x: TakeLogExport): string {
  return stringify([[...CSV_HEADER], ...takeLogCsvRows(x.state, x.camera)], { record_delimiter: 'windows' })
}
