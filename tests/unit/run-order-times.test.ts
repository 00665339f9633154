// Planned against actual on the control desk. The definitions are written in
// shared/utils/run-order-times.ts; the figures are worked by hand on round minutes.
import { describe, expect, it } from 'vitest'
import { MIN, T0, run } from '../support/shoot-commands'
import { createShootState } from '../../shared/utils/shoot'
import { overUnderText, runOrderTimes } from '../../shared/utils/run-order-times'

const step = (start: number | null, end: number | null, max: number | null = null) =>
  ({ plannedStartMs: start, plannedEndMs: end, durationMin: null, durationMax: max })
// Soup planned 0–10 min (two steps overlapping in the plan), bread 10–25 min, the sponsor read unplanned.
const steps = { a: step(0, 6 * MIN), b: step(2 * MIN, 10 * MIN), c: step(10 * MIN, 25 * MIN), d: step(null, null, 120), e: step(null, null, 180) }
const base = () => createShootState({
  id: 's', mode: 'take', runOrder: [{ id: 'soup', title: 'Soup', stepIds: ['a', 'b'] }, { id: 'bread', title: 'Bread', stepIds: ['c'] }, { id: 'read', title: 'Sponsor read', stepIds: [] }, { id: 'cake', stepIds: ['d', 'e'] }],
})

describe('runOrderTimes', () => {
  it('plans a segment as its span in the cook plan, or the sum of step durations without one', () => {
    const { segments } = runOrderTimes(base(), steps, T0)
    expect(segments.map((s) => s.plannedMs)).toEqual([10 * MIN, 15 * MIN, null, 5 * MIN])
    expect(segments.every((s) => s.state === 'to-come' && s.deltaMs === null)).toBe(true)
  })
  it('counts shoot time per segment from visit to visit and sums the over/under of segments left', () => {
    let s = run(base(), { type: 'shoot.start' }, T0)
    s = run(s, { type: 'step.next' }, T0 + 4 * MIN)
    s = run(s, { type: 'step.next' }, T0 + 12 * MIN) // soup took 12 min against 10: 2 over
    const at = runOrderTimes(s, steps, T0 + 20 * MIN) // 8 min into bread, under its 15: not counted yet
    expect(at.segments.map((x) => [x.actualMs, x.deltaMs, x.state])).toEqual([
      [12 * MIN, 2 * MIN, 'done'], [8 * MIN, -7 * MIN, 'current'], [0, null, 'to-come'], [0, null, 'to-come'],
    ])
    expect(at.runningDeltaMs).toBe(2 * MIN)
    // 17 min into bread: 2 over there as well, so 4 over in all.
    expect(runOrderTimes(s, steps, T0 + 29 * MIN).runningDeltaMs).toBe(4 * MIN)
  })
  it('adds a return visit to the segment it returns to, and stops while the clock is stopped', () => {
    let s = run(base(), { type: 'shoot.start' }, T0)
    s = run(s, { type: 'step.jump', segment: 1, step: 0 }, T0 + 5 * MIN)
    s = run(s, { type: 'step.previous' }, T0 + 6 * MIN) // back to soup's last step
    s = run(s, { type: 'shoot.pause' }, T0 + 8 * MIN)
    const at = runOrderTimes(s, steps, T0 + 60 * MIN)
    expect(at.segments[0]!.actualMs).toBe(7 * MIN)
    expect(at.segments[1]!.actualMs).toBe(1 * MIN)
    expect(at.segments[1]!.state).toBe('done')
  })
})

describe('overUnderText', () => {
  it('reads seconds as m:ss or h:mm:ss with over or under', () => {
    expect(overUnderText(65_000)).toBe('1:05 over')
    expect(overUnderText(-40_000)).toBe('0:40 under')
    expect(overUnderText(400)).toBe('on time')
    expect(overUnderText(3_725_000)).toBe('1:02:05 over')
  })
})
