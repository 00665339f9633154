// "Stand by" for the camera: the next timed events of a shoot, soonest first, with the real time
// left until each (what the operator waits through), whatever the rehearsal speed. Two kinds:
// a running timer ending, and a step the cook plan starts at a fixed time (plannedStartMs on the
// shoot clock) that the cursor has not reached yet.
import type { ShootState } from '../types/shoot'
import { shootClockAt } from './shoot-clock'
import { shootPositions } from './shoot'
import { segmentsText } from './step-segments'

export interface StandByEvent {
  kind: 'timer' | 'step'
  id: string
  label: string
  /** Real (server) ms until it happens; 0 once it is due. */
  inMs: number
}

/** The last this many real ms before an event are the urgent "stand by" (common practice: a
 * ten-second warning before a cue). */
export const STAND_BY_URGENT_MS = 10_000

export function standByEvents(
  state: ShootState,
  steps: Readonly<Record<string, { plannedStartMs: number | null; segments?: Array<{ text: string }>; text: string }>>,
  nowServerMs: number,
  limit = 3,
): StandByEvent[] {
  const out: StandByEvent[] = []
  for (const t of state.timers) {
    if (t.state !== 'running' || t.deadlineServerMs === null) continue
    out.push({ kind: 'timer', id: t.id, label: `${t.label} done`, inMs: Math.max(0, t.deadlineServerMs - nowServerMs) })
  }
  // Planned starts run on the shoot clock; while it is stopped nothing comes closer.
  if (state.status === 'running') {
    const shootNow = shootClockAt(state.clock, nowServerMs)
    const positions = shootPositions(state.runOrder)
    const at = positions.findIndex((p) => p.segment === state.cursor.segment && p.step === state.cursor.step)
    for (const p of positions.slice(at + 1)) {
      const step = p.stepId ? steps[p.stepId] : undefined
      if (!step || step.plannedStartMs === null || step.plannedStartMs <= shootNow) continue
      const text = step.segments ? segmentsText(step.segments) : step.text
      out.push({ kind: 'step', id: p.stepId!, label: text, inMs: (step.plannedStartMs - shootNow) / state.clock.speed })
    }
  }
  return out.sort((a, b) => a.inMs - b.inMs).slice(0, limit)
}
