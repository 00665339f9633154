// Recording time: how long the camera has rolled in this shoot, the rolls before added up, as
// record-run timecode counts (common practice). The reducer stamps markers with it; the take log
// (take-log.ts) reads it. Kept apart so screens that run the reducer do not load the take log.
import type { ShootState } from '../types/shoot'

/** Recording time at a server instant: the ended rolls plus this roll so far; null when not rolling. */
export function recordingMsAt(s: Pick<ShootState, 'rolling' | 'rollingSinceServerMs' | 'recordedMs'>, serverMs: number): number | null {
  if (!s.rolling || s.rollingSinceServerMs === null) return null
  return (s.recordedMs ?? 0) + Math.max(0, serverMs - s.rollingSinceServerMs)
}
