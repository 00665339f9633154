// What the control desk's timeline draws, from the live plan (shoot-live-plan.ts): one bar a step in
// its lane, where the plan has it now (done and running steps where they really ran, the rest where
// they are projected), beside where the shoot's first plan put it; the hands-on steps that will wait
// (comingCollisions); the now-line and both finishes. Times in ms on the shoot clock.
import type { ShootCollision, ShootLiveStep, ShootState } from '../types/shoot'
import { comingCollisions, shootProjection } from './shoot-cues'
import { shootClockAt } from './shoot-clock'
import { clockTextMs } from './clock-text'

export interface ShootTimelineBar {
  stepId: string
  /** The step's short name, else its text. */
  label: string
  recipeTitle: string
  handsOn: boolean
  lane: string
  handsLane: string | null
  startMs: number
  endMs: number
  state: ShootLiveStep['state']
  /** Past its planned end when the plan was last computed. */
  overdue: boolean
  /** Where the first plan put it; null when the first plan did not have it. */
  first: { startMs: number; endMs: number } | null
  /** The collision that will make it wait, if one is ahead. */
  collision: ShootCollision | null
}

export interface ShootTimeline {
  lanes: string[]
  bars: ShootTimelineBar[]
  nowMs: number
  plannedMs: number
  projectedMs: number
  /** Where the axis ends: the later finish, or now when the shoot runs past both. */
  spanMs: number
}

/** The desk's timeline; null when the shoot has no live plan (old shoots, a plan refused). */
export function shootTimeline(state: ShootState, nowServerMs: number): ShootTimeline | null {
  const plan = state.plan
  const live = plan?.live
  const projection = shootProjection(state)
  if (!plan || !live || !projection) return null
  const nowMs = shootClockAt(state.clock, nowServerMs)
  const collisions = new Map(comingCollisions(state, nowServerMs).map((c) => [c.stepId, c]))
  const overdue = new Set(live.overdue)
  const bars: ShootTimelineBar[] = []
  for (const step of plan.steps) {
    const at = live.steps[step.id]
    if (!at) continue
    const first = plan.first?.steps[step.id]
    bars.push({
      stepId: step.id,
      label: step.name ?? step.label ?? step.id,
      recipeTitle: step.recipeTitle,
      handsOn: step.handsOn,
      lane: at.lane,
      handsLane: at.handsLane,
      startMs: at.startMs,
      endMs: at.endMs,
      state: at.state,
      overdue: overdue.has(step.id),
      first: first ? { startMs: first.startMs, endMs: first.endMs } : null,
      collision: collisions.get(step.id) ?? null,
    })
  }
  bars.sort((a, b) => a.startMs - b.startMs || a.stepId.localeCompare(b.stepId))
  const spanMs = Math.max(projection.plannedMs, projection.projectedMs, state.status === 'ended' ? 0 : nowMs)
  return { lanes: live.lanes, bars, nowMs, plannedMs: projection.plannedMs, projectedMs: projection.projectedMs, spanMs }
}

const at = (ms: number) => clockTextMs(ms, 'nearest', { hours: false })

/** What a bar says when hovered or focused: the step and its recipe, its times, the first plan's, why it will wait. */
export function shootTimelineBarLines(bar: ShootTimelineBar): string[] {
  const lines = [`${bar.label} (${bar.recipeTitle})`]
  if (bar.state === 'done') lines.push(`Done: ${at(bar.startMs)} to ${at(bar.endMs)}`)
  else if (bar.state === 'running') lines.push(`Running since ${at(bar.startMs)}, to ${at(bar.endMs)}`)
  else lines.push(`Projected: ${at(bar.startMs)} to ${at(bar.endMs)}`)
  if (bar.first) {
    const moved = bar.startMs - bar.first.startMs
    const shift = Math.abs(moved) < 1000 ? 'on time' : `${clockTextMs(Math.abs(moved), 'nearest')} ${moved > 0 ? 'later' : 'earlier'}`
    lines.push(`First plan: ${at(bar.first.startMs)} to ${at(bar.first.endMs)} (${shift})`)
  }
  lines.push(bar.handsOn ? 'Hands-on' : 'Unattended wait')
  if (bar.overdue) lines.push('Past its planned end')
  if (bar.collision) lines.push(`Will wait: ${bar.collision.text}`)
  return lines
}

/** The same as one line, for a bar's accessible name. */
export const shootTimelineBarName = (bar: ShootTimelineBar) => shootTimelineBarLines(bar).join('; ')
