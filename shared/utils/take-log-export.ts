// The take log for the editor, at one camera's timecode: rows for a CSV (one per marker), a WebVTT
// file (W3C WebVTT: a chapters track with one cue per step, or a track of the markers) and JSON.
// Cue times are recording times (ms since the camera first rolled, the rolls added up), which is
// where the marker sits in footage recorded from the first roll; the timecode column is the same
// instant as the chosen camera labels it. Deleted markers and markers made while not rolling have
// no place in the footage: they are left out of WebVTT (the CSV keeps the latter with no timecode).
import type { ShootCamera, ShootState } from '../types/shoot'
import { MARKER_WORDS } from './shoot-words'
import { takeChapters, takeLogEntries, takeStepLabel, type TakeChapter, type TakeLogEntry } from './take-log'
import { timecodeRateName, timecodeRateText } from './timecode'

type TakeState = Pick<ShootState, 'markers' | 'runOrder' | 'plan'>
type Camera = Pick<ShootCamera, 'name' | 'fps' | 'drop' | 'start'>

/** A marker cue lasts a second (or until the recording's end, if sooner): long enough to be seen on a timeline. */
export const MARKER_CUE_MS = 1000

/** W3C WebVTT timestamp, hours always written: 01:02:03.045. */
export function vttTimestamp(ms: number): string {
  const t = Math.max(0, Math.round(ms))
  const p = (n: number, w = 2) => String(n).padStart(w, '0')
  return `${p(Math.floor(t / 3600_000))}:${p(Math.floor(t / 60_000) % 60)}:${p(Math.floor(t / 1000) % 60)}.${p(t % 1000, 3)}`
}

/** Cue text as WebVTT reads it: &, < and > escaped, no line breaks, never "-->". */
function cueText(text: string): string {
  return text.replace(/[\r\n]+/g, ' ').replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')
}

export const CSV_HEADER = ['Timecode', 'Recording time', 'Kind', 'Segment', 'Step', 'Note', 'Author'] as const

/** One row per marker (chapters included), in the order they were made. */
export function takeLogCsvRows(s: TakeState, camera: Camera): string[][] {
  return takeLogEntries(s, camera).map((e) => [
    e.timecode ?? '', e.recordingMs === null ? '' : vttTimestamp(e.recordingMs), MARKER_WORDS[e.kind].label,
    e.segmentTitle, e.stepLabel ?? '', e.marker.text ?? '', e.author,
  ])
}

interface Cue {
  id: string
  startMs: number
  endMs: number
  text: string
}

function vttFile(title: string, cues: Cue[]): string {
  const lines = [`WEBVTT - ${cueText(title).replace(/-->/g, '→')}`, '']
  for (const c of cues) lines.push(c.id, `${vttTimestamp(c.startMs)} --> ${vttTimestamp(c.endMs)}`, cueText(c.text), '')
  return lines.join('\n')
}

/**
 * Chapters: one cue per step change while rolling ("recipe: step", or the segment's title for a
 * segment without steps), until the next chapter or the end of the
 * recording. A chapter followed by another at the same recording time (steps passed while the
 * camera did not move on) has no length and gives way to the later one.
 */
export function takeLogChapterCues(s: TakeState, recordingEndMs: number): Cue[] {
  const recipeOfStep = new Map((s.plan?.steps ?? []).map((p) => [p.id, p.recipeTitle]))
  const chapters = takeChapters(s.markers, s.runOrder, recipeOfStep)
  const stepLabel = (c: TakeChapter) => {
    const step = Math.max(0, s.runOrder.find((seg) => seg.id === c.segmentId)?.stepIds.indexOf(c.stepId ?? '') ?? 0)
    return takeStepLabel(s, { segment: 0, step, segmentId: c.segmentId, stepId: c.stepId })
  }
  return chapters.flatMap((c, i) => {
    const next = chapters[i + 1]
    if (next && next.recordingMs <= c.recordingMs) return []
    const endMs = next ? next.recordingMs : Math.max(recordingEndMs, c.recordingMs + 1)
    const step = stepLabel(c)
    return [{ id: `chapter-${i + 1}`, startMs: c.recordingMs, endMs, text: step ? `${c.partTitle}: ${step}` : c.partTitle }]
  })
}

/** Markers a person made (not chapters), each a cue at its recording time. */
export function takeLogMarkerCues(s: TakeState, camera: Camera, recordingEndMs: number): Cue[] {
  return takeLogEntries(s, camera).flatMap((e: TakeLogEntry) => {
    if (e.kind === 'chapter' || e.recordingMs === null) return []
    const endMs = Math.max(e.recordingMs + 1, Math.min(e.recordingMs + MARKER_CUE_MS, recordingEndMs))
    const words = [MARKER_WORDS[e.kind].label, e.marker.text, `${e.timecode} on ${camera.name}`, e.stepLabel ? `${e.segmentTitle}, ${e.stepLabel}` : e.segmentTitle]
    return [{ id: e.marker.id, startMs: e.recordingMs, endMs, text: words.filter(Boolean).join(' · ') }]
  })
}

export type TakeLogTrack = 'chapters' | 'markers'

export function takeLogVtt(s: TakeState, camera: Camera, track: TakeLogTrack, title: string, recordingEndMs: number): string {
  return track === 'chapters'
    ? vttFile(`${title}: chapters`, takeLogChapterCues(s, recordingEndMs))
    : vttFile(`${title}: markers at ${camera.name}, ${timecodeRateName(camera)} from ${camera.start}`, takeLogMarkerCues(s, camera, recordingEndMs))
}

/** The take log as JSON: the camera it is labelled for, and every marker not deleted. */
export function takeLogJson(s: TakeState, camera: Camera & { id: string }, shoot: { id: number; title: string }) {
  return {
    shoot,
    camera: { id: camera.id, name: camera.name, rate: timecodeRateText(camera), start: camera.start },
    markers: takeLogEntries(s, camera).map((e) => ({
      id: e.marker.id, kind: e.kind, timecode: e.timecode, recordingMs: e.recordingMs, segment: e.segmentTitle, step: e.stepLabel,
      note: e.marker.text, author: e.author, shootMs: e.marker.shootMs, edited: (e.marker.changes?.length ?? 0) > 0, openPickup: e.openPickup,
    })),
  }
}
