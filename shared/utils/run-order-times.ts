// Planned against actual for the run order, for the control desk.
// - Planned: a segment's span in the cook plan (first planned start to last planned end of its
//   steps, kitchen time); without a plan, the sum of its steps' longest durations; a segment
//   without steps (intro, sponsor read, outro) its read time from the show (server/utils/show.ts).
// - Actual: shoot-clock time the cursor spent in the segment, from each visit to the next (the
//   current visit up to now), so going back to a segment adds to its time.
// - Over/under: actual − planned (positive = over). The running figure adds the over/under of every
//   segment the cursor has left, and the current segment's only once it is over its plan (a segment
//   still under its plan is not yet "early").
import type { ShootState } from '../types/shoot'
import { shootClockAt } from './shoot-clock'
import { clockText } from './clock-text'

export interface SegmentTimes {
  id: string
  title: string
  plannedMs: number | null
  actualMs: number
  deltaMs: number | null
  state: 'done' | 'current' | 'to-come'
}

type StepTimes = Readonly<Record<string, {
  plannedStartMs: number | null
  plannedEndMs: number | null
  durationMin: number | null
  durationMax: number | null
}>>

function plannedFor(stepIds: readonly string[], steps: StepTimes): number | null {
  const known = stepIds.map((id) => steps[id]).filter((s) => !!s)
  if (!known.length) return null
  const starts = known.map((s) => s.plannedStartMs).filter((x): x is number => x !== null)
  const ends = known.map((s) => s.plannedEndMs).filter((x): x is number => x !== null)
  if (starts.length === known.length && ends.length === known.length) return Math.max(...ends) - Math.min(...starts)
  const durations = known.map((s) => s.durationMax ?? s.durationMin)
  return durations.every((d) => d !== null) ? durations.reduce<number>((a, d) => a + d! * 1000, 0) : null
}

export function runOrderTimes(
  state: ShootState, steps: StepTimes, nowServerMs: number, showPlannedMs: Readonly<Record<string, number>> = {},
): { segments: SegmentTimes[]; runningDeltaMs: number } {
  const shootNow = shootClockAt(state.clock, nowServerMs)
  const actual = new Array<number>(state.runOrder.length).fill(0)
  state.visits.forEach((v, i) => {
    const until = state.visits[i + 1]?.enteredShootMs ?? shootNow
    actual[v.stepRef.segment] = (actual[v.stepRef.segment] ?? 0) + Math.max(0, until - v.enteredShootMs)
  })
  const visited = new Set(state.visits.map((v) => v.stepRef.segment))
  const current = state.status === 'ready' ? -1 : state.cursor.segment
  const segments = state.runOrder.map((seg, i): SegmentTimes => {
    const plannedMs = seg.stepIds.length ? plannedFor(seg.stepIds, steps) : showPlannedMs[seg.id] ?? null
    const st = i === current ? 'current' : visited.has(i) ? 'done' : 'to-come'
    return { id: seg.id, title: seg.title ?? `Segment ${i + 1}`, plannedMs, actualMs: actual[i]!, deltaMs: plannedMs === null || st === 'to-come' ? null : actual[i]! - plannedMs, state: st }
  })
  const runningDeltaMs = segments.reduce((sum, s) => {
    if (s.deltaMs === null) return sum
    if (s.state === 'current') return sum + Math.max(0, s.deltaMs)
    return sum + s.deltaMs
  }, 0)
  return { segments, runningDeltaMs }
}

/** "+1:05 over", "0:40 under", "on time": for a delta in ms, rounded to the second. */
export function overUnderText(deltaMs: number): string {
  const s = Math.round(deltaMs / 1000)
  if (s === 0) return 'on time'
  const abs = Math.abs(s)
  const text = clockText(abs)
  return s > 0 ? `${text} over` : `${text} under`
}
