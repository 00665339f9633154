// The take log: where each marker sits in the recording. A camera records only while it rolls;
// its recording time counts on across rolls (the rolls before added up), as record-run timecode
// does on a camera that stops between takes (common practice). Chapters are markers the shoot makes
// itself at every step change while rolling; pickups are the moments still to record again.
import type { ShootMarker, ShootSegment, ShootState } from '../types/shoot'

/** Recording time at a server instant: the ended rolls plus this roll so far; null when not rolling. */
export function recordingMsAt(s: Pick<ShootState, 'rolling' | 'rollingSinceServerMs' | 'recordedMs'>, serverMs: number): number | null {
  if (!s.rolling || s.rollingSinceServerMs === null) return null
  return (s.recordedMs ?? 0) + Math.max(0, serverMs - s.rollingSinceServerMs)
}

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
      if (m.kind !== 'chapter' || at === null) return []
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
  return markers.filter((p) => p.kind === 'pickup'
    && !markers.some((g) => g.kind === 'good' && place(g) === place(p) && g.serverMs > p.serverMs))
}
