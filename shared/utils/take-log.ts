// The take log: where each marker sits in the recording. A camera records only while it rolls;
// its recording time counts on across rolls (the rolls before added up), as record-run timecode
// does on a camera that stops between takes (common practice). Chapters are markers the shoot makes
// itself at every step change while rolling; pickups are the moments still to record again.
import type { ShootCamera, ShootMarker, ShootMarkerKind, ShootSegment, ShootState, ShootStepRef } from '../types/shoot'
import { timecodeAfter, type TimecodeRate } from './timecode'
export { recordingMsAt } from './recording-time'


/**
 * A marker's recording time. Markers made before recording time was kept count from their own roll
 * (the only roll such shoots knew of); markers made while not rolling have none.
 */
export function markerRecordingMs(m: ShootMarker): number | null {
  if (m.recordingMs !== undefined) return m.recordingMs
  return m.rollingSinceServerMs === null ? null : Math.max(0, m.serverMs - m.rollingSinceServerMs)
}

export interface TakeChapter {
  segmentId: string
  segmentTitle: string
  stepId: string | null
  recordingMs: number
  /**
   * The part of the show the chapter belongs to: its recipe (a cook-plan segment interleaves the
   * steps of several recipes) or, for a step of no recipe and a segment without steps, its segment.
   */
  partId: string
  partTitle: string
}

/**
 * The chapters of the recording in recording order, each with its segment and its part of the show.
 * `recipeOfStep` names the recipe of each step id (the shoot's plan steps know it).
 */
export function takeChapters(
  markers: readonly ShootMarker[], runOrder: readonly ShootSegment[], recipeOfStep: ReadonlyMap<string, string> = new Map(),
): TakeChapter[] {
  const titles = new Map(runOrder.map((seg) => [seg.id, seg.title ?? seg.id]))
  return markers
    .flatMap((m) => {
      const at = markerRecordingMs(m)
      if (m.kind !== 'chapter' || m.deleted || at === null) return []
      const { segmentId, stepId } = m.stepRef
      const segmentTitle = titles.get(segmentId) ?? segmentId
      const recipe = stepId === null ? undefined : recipeOfStep.get(stepId)
      return [{ segmentId, segmentTitle, stepId, recordingMs: at, partId: recipe ? `recipe:${recipe}` : segmentId, partTitle: recipe ?? segmentTitle }]
    })
    .sort((a, b) => a.recordingMs - b.recordingMs)
}

/**
 * Pickups still to record: a pickup marker stays open until a later good take is marked on the
 * same step (or, for a segment without steps, the same segment).
 */
export function openPickups(markers: readonly ShootMarker[]): ShootMarker[] {
  const place = (m: ShootMarker) => `${m.stepRef.segmentId}\u0000${m.stepRef.stepId ?? ''}`
  const kept = liveMarkers(markers)
  return kept.filter((p) => p.kind === 'pickup'
    && !kept.some((g) => g.kind === 'good' && place(g) === place(p) && g.serverMs > p.serverMs))
}

/** The markers of the take log: all but those the producer deleted afterwards. */
export function liveMarkers(markers: readonly ShootMarker[]): ShootMarker[] {
  return markers.filter((m) => !m.deleted)
}

export function cameraRate(camera: Pick<ShootCamera, 'fps' | 'drop'>): TimecodeRate {
  return { fps: camera.fps, drop: camera.drop }
}

/** A marker's label on a camera: the camera's start plus the recording time; null when not rolling. */
export function markerTimecode(m: ShootMarker, camera: Pick<ShootCamera, 'fps' | 'drop' | 'start'>): string | null {
  const at = markerRecordingMs(m)
  return at === null ? null : timecodeAfter(camera.start, at, cameraRate(camera))
}

/** A step's name in the take log: its short name in the cook plan, else "Step n"; null for a segment without steps. */
export function takeStepLabel(s: Pick<ShootState, 'plan'>, ref: ShootStepRef): string | null {
  if (ref.stepId === null) return null
  return s.plan?.steps.find((p) => p.id === ref.stepId)?.name ?? `Step ${ref.step + 1}`
}

export function takeSegmentTitle(s: Pick<ShootState, 'runOrder'>, ref: ShootStepRef): string {
  return s.runOrder.find((seg) => seg.id === ref.segmentId)?.title ?? s.runOrder[ref.segment]?.title ?? `Segment ${ref.segment + 1}`
}

export interface TakeLogEntry {
  marker: ShootMarker
  kind: ShootMarkerKind
  /** At the chosen camera; null when the camera was not rolling. */
  timecode: string | null
  recordingMs: number | null
  segmentTitle: string
  stepLabel: string | null
  author: string
  /** A pickup no later good take on its step has covered. */
  openPickup: boolean
}

/** The take log at one camera's timecode: every marker not deleted, in the order they were made. */
export function takeLogEntries(s: Pick<ShootState, 'markers' | 'runOrder' | 'plan'>, camera: Pick<ShootCamera, 'fps' | 'drop' | 'start'>): TakeLogEntry[] {
  const open = new Set(openPickups(s.markers).map((m) => m.id))
  return liveMarkers(s.markers).map((m) => ({
    marker: m, kind: m.kind, timecode: markerTimecode(m, camera), recordingMs: markerRecordingMs(m),
    segmentTitle: takeSegmentTitle(s, m.stepRef), stepLabel: takeStepLabel(s, m.stepRef),
    author: m.by.name ?? m.by.role, openPickup: open.has(m.id),
  }))
}

export interface TakeLogGroup {
  segmentId: string
  segmentTitle: string
  steps: { stepId: string | null; stepLabel: string | null; entries: TakeLogEntry[] }[]
}

/** Entries grouped by segment, then step, in run order (a segment or step no longer in it comes last). */
export function groupTakeLog(entries: readonly TakeLogEntry[], runOrder: readonly ShootSegment[]): TakeLogGroup[] {
  const segIndex = (id: string) => { const i = runOrder.findIndex((seg) => seg.id === id); return i < 0 ? Infinity : i }
  const stepIndex = (segId: string, stepId: string | null) => {
    if (stepId === null) return -1
    const i = runOrder.find((seg) => seg.id === segId)?.stepIds.indexOf(stepId) ?? -1
    return i < 0 ? Infinity : i
  }
  const groups = new Map<string, TakeLogGroup>()
  for (const e of entries) {
    const { segmentId, stepId } = e.marker.stepRef
    let g = groups.get(segmentId)
    if (!g) groups.set(segmentId, (g = { segmentId, segmentTitle: e.segmentTitle, steps: [] }))
    let step = g.steps.find((x) => x.stepId === stepId)
    if (!step) g.steps.push((step = { stepId, stepLabel: e.stepLabel, entries: [] }))
    step.entries.push(e)
  }
  const list = [...groups.values()].sort((a, b) => segIndex(a.segmentId) - segIndex(b.segmentId))
  for (const g of list) g.steps.sort((a, b) => stepIndex(g.segmentId, a.stepId) - stepIndex(g.segmentId, b.stepId))
  return list
}
