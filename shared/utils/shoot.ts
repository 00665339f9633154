// A shoot's state and its run order. The server makes the state once from the episode's run order
// (createShootState) and from then on changes it only through applyShootCommand
// (shoot-reducer.ts) and markDueTimers (shoot-timers.ts).
import {
  SHOOT_SPEED_MAX, SHOOT_SPEED_MIN,
  type ShootCursor, type ShootMode, type ShootPlan, type ShootSegment, type ShootState, type ShootStepRef,
} from '../types/shoot'

export interface ShootInit {
  id: string
  mode: ShootMode
  runOrder: ShootSegment[]
  /** Rehearsal speed to begin with (1 by default); a take always runs at 1×. */
  speed?: number
  /** The cook plan the shoot runs, when the run order came from one (server/shoot/plan.ts). */
  plan?: ShootPlan | null
}

/** Steps in a segment as the cursor sees them: a segment without steps is one position. */
export function shootSegmentPositions(segment: ShootSegment): number {
  return Math.max(1, segment.stepIds.length)
}

/** Every position of the run order, in order. */
export function shootPositions(runOrder: readonly ShootSegment[]): ShootStepRef[] {
  return runOrder.flatMap((seg, segment) =>
    Array.from({ length: shootSegmentPositions(seg) }, (_, step) => ({
      segment, step, segmentId: seg.id, stepId: seg.stepIds[step] ?? null,
    })))
}

/** The position at a cursor, or null when the run order has no such position. */
export function shootStepRefAt(runOrder: readonly ShootSegment[], cursor: ShootCursor): ShootStepRef | null {
  const seg = runOrder[cursor.segment]
  if (!seg || !Number.isInteger(cursor.step) || cursor.step < 0 || cursor.step >= shootSegmentPositions(seg)) return null
  return { segment: cursor.segment, step: cursor.step, segmentId: seg.id, stepId: seg.stepIds[cursor.step] ?? null }
}

/** Where the cursor is now. */
export function shootCursorRef(state: Pick<ShootState, 'runOrder' | 'cursor'>): ShootStepRef {
  const ref = shootStepRefAt(state.runOrder, state.cursor)
  if (!ref) throw new RangeError(`the cursor (segment ${state.cursor.segment}, step ${state.cursor.step}) is outside the run order`)
  return ref
}

/** The position after (+1) or before (−1) a cursor, or null at either end of the run order. */
export function shootCursorMoved(runOrder: readonly ShootSegment[], cursor: ShootCursor, by: 1 | -1): ShootCursor | null {
  const seg = runOrder[cursor.segment]
  if (!seg) return null
  if (by === 1) {
    if (cursor.step + 1 < shootSegmentPositions(seg)) return { segment: cursor.segment, step: cursor.step + 1 }
    return cursor.segment + 1 < runOrder.length ? { segment: cursor.segment + 1, step: 0 } : null
  }
  if (cursor.step > 0) return { segment: cursor.segment, step: cursor.step - 1 }
  const before = runOrder[cursor.segment - 1]
  return before ? { segment: cursor.segment - 1, step: shootSegmentPositions(before) - 1 } : null
}

/** A new shoot, ready to start at the first step; refuses a run order it cannot drive. */
export function createShootState(init: ShootInit): ShootState {
  if (init.mode !== 'rehearsal' && init.mode !== 'take') throw new RangeError(`a shoot is a rehearsal or a take (got ${String(init.mode)})`)
  if (!Array.isArray(init.runOrder) || init.runOrder.length === 0) throw new RangeError('the run order has no segments; add one before shooting')
  const seen = new Set<string>()
  for (const [i, seg] of init.runOrder.entries()) {
    if (typeof seg?.id !== 'string' || seg.id === '') throw new RangeError(`segment ${i + 1} of the run order has no id`)
    if (seen.has(seg.id)) throw new RangeError(`segment id "${seg.id}" appears twice in the run order`)
    seen.add(seg.id)
    if (!Array.isArray(seg.stepIds) || seg.stepIds.some((s) => typeof s !== 'string' || s === '')) {
      throw new RangeError(`segment "${seg.id}" needs stepIds, a list of step ids (empty for a segment without steps)`)
    }
  }
  const speed = init.mode === 'take' ? 1 : (init.speed ?? 1)
  if (!(speed >= SHOOT_SPEED_MIN && speed <= SHOOT_SPEED_MAX)) {
    throw new RangeError(`rehearsal speed runs from ${SHOOT_SPEED_MIN}× to ${SHOOT_SPEED_MAX}× (got ${init.speed})`)
  }
  return {
    id: init.id,
    mode: init.mode,
    status: 'ready',
    runOrder: init.runOrder.map((s) => ({ ...s, stepIds: [...s.stepIds] })),
    cursor: { segment: 0, step: 0 },
    seq: 0,
    clock: { anchorServerMs: 0, anchorShootMs: 0, speed, running: false },
    rolling: false,
    rollingSinceServerMs: null,
    rollingSinceShootMs: null,
    timers: [],
    markers: [],
    visits: [],
    startedAtServerMs: null,
    endedAtServerMs: null,
    plan: init.plan ?? null,
  }
}
