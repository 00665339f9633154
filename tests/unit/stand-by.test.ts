// Stand-by countdowns for the camera. The arithmetic is the shoot clock's definition
// (shootMs = anchor + elapsed × speed, shared/utils/shoot-clock.ts): an event planned at shoot
// time P is (P − shoot now) ÷ speed real ms away; a timer's deadline is already on the server clock.
// Worked by hand on round numbers.
import { describe, expect, it } from 'vitest'
import { MIN, T0, run } from '../support/shoot-commands'
import { createShootState } from '../../shared/utils/shoot'
import { STAND_BY_URGENT_MS, standByEvents } from '../../shared/utils/stand-by'

const steps = {
  chop: { plannedStartMs: 0, text: 'Chop the onion' },
  soften: { plannedStartMs: 5 * MIN, text: 'Soften the onion' },
  simmer: { plannedStartMs: 15 * MIN, text: 'Simmer the beans' },
  rest: { plannedStartMs: null, text: 'Rest the dough' },
}
const shoot = (speed = 1) => createShootState({ id: 's', mode: 'rehearsal', speed, runOrder: [{ id: 'stew', stepIds: ['chop', 'soften', 'simmer', 'rest'] }] })

describe('standByEvents', () => {
  it('lists planned step starts ahead of the cursor, soonest first, in real ms', () => {
    const s = run(shoot(), { type: 'shoot.start' }, T0)
    // One minute in: soften in 4 minutes, simmer in 14; the unplanned step is left out.
    expect(standByEvents(s, steps, T0 + MIN)).toEqual([
      { kind: 'step', id: 'soften', label: 'Soften the onion', inMs: 4 * MIN },
      { kind: 'step', id: 'simmer', label: 'Simmer the beans', inMs: 14 * MIN },
    ])
  })
  it('divides by the rehearsal speed: at 4×, 4 shoot minutes away is 1 real minute', () => {
    const s = run(shoot(4), { type: 'shoot.start' }, T0)
    // 15 s real at 4× is 1 shoot minute; soften at 5 shoot minutes is 4 shoot minutes = 60 s real away.
    expect(standByEvents(s, steps, T0 + 15_000)[0]).toEqual({ kind: 'step', id: 'soften', label: 'Soften the onion', inMs: MIN })
  })
  it('puts a running timer by its deadline among them, and leaves paused timers out', () => {
    let s = run(shoot(), { type: 'shoot.start' }, T0)
    s = run(s, { type: 'timer.start', timerId: 'eggs', label: 'Eggs', durationMs: 2 * MIN }, T0)
    s = run(s, { type: 'timer.start', timerId: 'rice', label: 'Rice', durationMs: 20 * MIN }, T0)
    s = run(s, { type: 'timer.pause', timerId: 'rice' }, T0)
    expect(standByEvents(s, steps, T0 + 30_000).map((e) => [e.id, e.inMs])).toEqual([['eggs', 90_000], ['soften', 4.5 * MIN], ['simmer', 14.5 * MIN]])
  })
  it('stops counting step starts while the rehearsal is paused, and drops steps already reached', () => {
    let s = run(shoot(), { type: 'shoot.start' }, T0)
    s = run(s, { type: 'step.next' }, T0 + MIN) // at soften now
    s = run(s, { type: 'shoot.pause' }, T0 + 2 * MIN)
    expect(standByEvents(s, steps, T0 + 30 * MIN)).toEqual([])
    s = run(s, { type: 'shoot.resume' }, T0 + 30 * MIN)
    // Resumed at shoot time 2 min: simmer (15 min) is 13 minutes away.
    expect(standByEvents(s, steps, T0 + 30 * MIN)).toEqual([{ kind: 'step', id: 'simmer', label: 'Simmer the beans', inMs: 13 * MIN }])
  })
  it('keeps to the limit and names ten seconds as the urgent warning (common practice)', () => {
    const s = run(shoot(), { type: 'shoot.start' }, T0)
    expect(standByEvents(s, steps, T0, 1)).toHaveLength(1)
    expect(STAND_BY_URGENT_MS).toBe(10_000)
  })
})
