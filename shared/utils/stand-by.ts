// "Stand by" for the camera: the next timed events of a shoot, soonest first, with the real time
// left until each (what the operator waits through), whatever the rehearsal speed. Three kinds:
// a timer ending (or ringing now), a wait of the cook plan to start (the host's "start it now" cue,
// upcomingWaits in shoot-cues.ts), and a step the plan starts at a set time that the cursor has not
// reached yet (the next two). A shoot running its cook plan takes every time from the live plan, so the list moves
// when the kitchen runs late; a shoot without one uses each step's planned start (plannedStartMs).
import type { ShootState } from '../types/shoot'
import { shootClockAt } from './shoot-clock'
import { shootPositions } from './shoot'
import { upcomingWaits } from './shoot-cues'
import { isTimedWait, shootPlanStep } from './shoot-waits'
import { segmentsText } from './step-segments'

export interface StandByEvent {
  kind: 'timer' | 'wait' | 'step'
  /** The timer's id, or the step's. */
  id: string
  label: string
  /** Real (server) ms until it happens; 0 once it is due. */
  inMs: number
}

/** The last this many real ms before an event are the urgent "stand by" (common practice: a
 * ten-second warning before a cue). */
export const STAND_BY_URGENT_MS = 10_000
/** At most this many step starts are listed; every timer and wait to start is. */
export const STAND_BY_STEPS = 2

type StandBySteps = Readonly<Record<string, { plannedStartMs: number | null; segments?: Array<{ text: string }>; text: string; name?: string | null }>>

export function standByEvents(state: ShootState, steps: StandBySteps, nowServerMs: number, limit = 3): StandByEvent[] {
  const out: StandByEvent[] = []
  for (const t of state.timers) {
    if (t.state === 'due') out.push({ kind: 'timer', id: t.id, label: t.label, inMs: 0 })
    else if (t.state === 'running' && t.deadlineServerMs !== null) {
      out.push({ kind: 'timer', id: t.id, label: t.label, inMs: Math.max(0, t.deadlineServerMs - nowServerMs) })
    }
  }
  // Planned starts run on the shoot clock; while it is stopped nothing comes closer.
  if (state.status === 'running') {
    const speed = state.clock.speed
    for (const w of upcomingWaits(state, nowServerMs, Number.POSITIVE_INFINITY)) {
      out.push({ kind: 'wait', id: w.stepId, label: w.recipeTitle ? `${w.label} · ${w.recipeTitle}` : w.label, inMs: Math.max(0, w.inMs) / speed })
    }
    const shootNow = shootClockAt(state.clock, nowServerMs)
    const live = state.plan?.live ?? null
    const positions = shootPositions(state.runOrder)
    const at = positions.findIndex((p) => p.segment === state.cursor.segment && p.step === state.cursor.step)
    const seen = new Set<string>()
    // The next few steps only: the list is for what the camera must catch, and timers come first.
    for (const p of positions.slice(at + 1)) {
      if (seen.size >= STAND_BY_STEPS) break
      const step = p.stepId ? steps[p.stepId] : undefined
      if (!step || seen.has(p.stepId!) || isTimedWait(shootPlanStep(state, p.stepId))) continue
      const planned = live?.steps[p.stepId!]
      const startMs = planned ? (planned.state === 'pending' ? planned.startMs : null) : step.plannedStartMs
      if (startMs === null || startMs <= shootNow) continue
      seen.add(p.stepId!)
      const label = step.name || (step.segments ? segmentsText(step.segments) : step.text)
      out.push({ kind: 'step', id: p.stepId!, label, inMs: (startMs - shootNow) / speed })
    }
  }
  return out.sort((a, b) => a.inMs - b.inMs).slice(0, limit)
}
