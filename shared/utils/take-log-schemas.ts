// What the take log reads from outside, checked with zod: the producer's commands that set a
// shoot's cameras and tidy its markers afterwards (joined into the shoot's command schema,
// shoot-schema.ts), and the query of the take-log exports (GET /api/shoots/:id/markers.csv …).
// Server only: screens build their commands without zod (CSP keeps zod's code generation out of
// pages). Messages are instructions; the field's label goes in front (field-labels.ts).
import { z } from 'zod'
import { SHOOT_CAMERA_NAME_MAX, SHOOT_MARKER_KINDS, SHOOT_MARKER_TEXT_MAX } from '../types/shoot'
import { TIMECODE_FPS, defaultStartTimecode, parseTimecodeRate, timecodeToFrames, type TimecodeRate } from './timecode'

const ID_WORDS = "write 1–64 letters, digits, '-' or '_'"
const id = () => z.string({ error: ID_WORDS }).regex(/^[A-Za-z0-9_-]{1,64}$/, { error: ID_WORDS })

export const RATE_WORDS = `write one of ${TIMECODE_FPS.join(', ')}, with "df" after 29.97 or 59.94 for drop-frame (such as 29.97df)`
const START_WORDS = 'write the timecode of the first recorded frame as HH:MM:SS:FF, such as 01:00:00:00 (01:00:00;00 in drop-frame)'

/** The rate a text names, or null. */
function rateOf(text: string): TimecodeRate | null {
  try {
    return parseTimecodeRate(text)
  } catch {
    return null
  }
}

/** Why a start label does not exist at a rate (the timecode's own words), or null when it does. */
function startFault(start: string, rate: TimecodeRate): string | null {
  try {
    timecodeToFrames(start, rate)
    return null
  } catch (error) {
    return (error as Error).message
  }
}

const rateText = () => z.string({ error: RATE_WORDS }).trim().refine((t) => rateOf(t) !== null, { error: RATE_WORDS })
const startText = () => z.string({ error: START_WORDS }).trim().regex(/^\d{2}:\d{2}:\d{2}[:;]\d{2}$/, { error: START_WORDS })

/** Checks that the start exists at the rate ("01:01:00;00 does not exist … next label is 01:01:00;02"). */
function startFitsRate(v: { rate?: string; start?: string }, ctx: z.RefinementCtx) {
  const rate = v.rate === undefined ? null : rateOf(v.rate)
  if (!rate || v.start === undefined) return
  const fault = startFault(v.start, rate)
  if (fault) ctx.addIssue({ code: 'custom', path: ['start'], message: fault })
}

/** The producer adds a camera (no cameraId, or a new one) or changes one. */
export const cameraSetCommandSchema = z.object({
  type: z.literal('camera.set'),
  cameraId: id().optional(),
  name: z.string({ error: 'name the camera, such as "Camera A"' }).trim()
    .min(1, { error: 'name the camera, such as "Camera A"' })
    .max(SHOOT_CAMERA_NAME_MAX, { error: `write at most ${SHOOT_CAMERA_NAME_MAX} characters` }),
  rate: rateText(),
  start: startText().optional(),
}).superRefine(startFitsRate)

export const cameraRemoveCommandSchema = z.object({ type: z.literal('camera.remove'), cameraId: id() })

const KIND_WORDS = `choose one of: ${SHOOT_MARKER_KINDS.join(', ')}`

/** The producer changes a marker's kind or text afterwards; an empty text clears it. */
export const markerEditCommandSchema = z.object({
  type: z.literal('marker.edit'),
  markerId: id(),
  kind: z.enum(SHOOT_MARKER_KINDS, { error: KIND_WORDS }).optional(),
  text: z.string({ error: 'write the note as text' }).trim()
    .max(SHOOT_MARKER_TEXT_MAX, { error: `write at most ${SHOOT_MARKER_TEXT_MAX} characters` }).optional(),
}).refine((m) => m.kind !== undefined || m.text !== undefined, { error: 'send the new kind of marker, its text, or both', path: ['kind'] })

export const markerDeleteCommandSchema = z.object({ type: z.literal('marker.delete'), markerId: id() })

/** Labels of the camera form, where they differ from the shared ones. */
export const CAMERA_FIELD_LABELS = { name: 'Camera name' }

/** The exports' query: a camera of the shoot, or a rate and start given outright; which WebVTT track. */
export const takeLogQuerySchema = z.object({
  camera: id().optional(),
  rate: rateText().optional(),
  start: startText().optional(),
  track: z.enum(['chapters', 'markers'], { error: 'choose chapters (one cue per step) or markers' }).optional(),
}).superRefine((q, ctx) => {
  if (q.camera !== undefined && (q.rate !== undefined || q.start !== undefined)) {
    ctx.addIssue({ code: 'custom', path: ['camera'], message: 'choose a camera of the shoot, or give a rate and start, not both' })
  }
  if (q.start !== undefined && q.rate === undefined) {
    ctx.addIssue({ code: 'custom', path: ['rate'], message: `give the frame rate the start is written in: ${RATE_WORDS}` })
  }
  startFitsRate(q, ctx)
})

export type TakeLogQuery = z.output<typeof takeLogQuerySchema>

/** A camera given outright by `?rate=…&start=…` (the start defaults to 01:00:00:00). */
export function queryCamera(rate: string, start?: string) {
  const r = parseTimecodeRate(rate)
  return { id: 'query', name: `${r.fps} fps${r.drop ? ' drop-frame' : ''}`, fps: r.fps, drop: !!r.drop, start: start ?? defaultStartTimecode(r) }
}
