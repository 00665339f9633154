// Stand-by countdowns for the camera. The arithmetic is the shoot clock's definition
// (shootMs = anchor + elapsed × speed, shared/utils/shoot-clock.ts): an event planned at shoot
// time P is (P − shoot now) ÷ speed real ms away; a timer's deadline is already on the server clock.
// Worked by hand on round numbers.
import { describe, expect, it } from 'vitest'
import { MIN, T0, run } from '../support/shoot-commands'
import type { ShootPlanStep } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { planShootRun } from '../../shared/utils/shoot-plan'
import { markDueTimers } from '../../shared/utils/shoot-timers'
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
  it('lists the next two step starts only, so timers and waits are not crowded out', () => {
    const many = { ...steps, rest: { plannedStartMs: 20 * MIN, text: 'Rest the dough' }, plate: { plannedStartMs: 25 * MIN, text: 'Plate up' } }
    const s = run(createShootState({ id: 's', mode: 'rehearsal', runOrder: [{ id: 'a', stepIds: ['chop', 'soften', 'simmer', 'rest', 'plate'] }] }), { type: 'shoot.start' }, T0)
    expect(standByEvents(s, many, T0, 6).map((e) => e.id)).toEqual(['soften', 'simmer'])
  })
  it('keeps to the limit and names ten seconds as the urgent warning (common practice)', () => {
    const s = run(shoot(), { type: 'shoot.start' }, T0)
    expect(standByEvents(s, steps, T0, 1)).toHaveLength(1)
    expect(STAND_BY_URGENT_MS).toBe(10_000)
  })
})

// A shoot that runs its cook plan (the kitchen of shoot-live-plan.test.ts): beans soak 25–30 min from
// the start; the onion is chopped (0–5), the lentils simmer 20–25 min on a burner after it while the
// herbs are picked (5–15), the stew is finished (30–33) once the lentils are done. One cook.
describe('standByEvents on a shoot that runs its cook plan', () => {
  const step = (id: string, minutes: [number | null, number], handsOn: boolean, extra: Partial<ShootPlanStep> = {}): ShootPlanStep => ({
    id, duration: minutes[1] * 60, handsOn, station: null, recipe: 'stew', recipeTitle: 'Red lentil stew', label: id, name: null,
    minMs: minutes[0] === null ? null : minutes[0] * MIN, maxMs: minutes[1] * MIN, ...extra,
  })
  const planSteps: ShootPlanStep[] = [
    step('soak', [25, 30], false, { recipe: 'beans', recipeTitle: 'Soaked beans', name: 'Bean soak' }),
    step('chop', [null, 5], true, { station: 'counter' }),
    step('simmer', [20, 25], false, { station: 'burner', after: ['chop'], name: 'Lentils' }),
    step('herbs', [null, 10], true, { after: ['chop'] }),
    step('finish', [null, 3], true, { after: ['simmer'] }),
  ]
  const screenSteps = {
    soak: { plannedStartMs: 0, text: 'Soak the beans', name: 'Bean soak' },
    chop: { plannedStartMs: 0, text: 'Chop the onion', name: null },
    simmer: { plannedStartMs: 5 * MIN, text: 'Simmer the lentils', name: 'Lentils' },
    herbs: { plannedStartMs: 5 * MIN, text: 'Pick the herbs', name: null },
    finish: { plannedStartMs: 30 * MIN, text: 'Finish the stew', name: 'Finish' },
  }
  const kitchen = { hands: 1, burners: 4, ovens: 1, racksPerOven: 1, parallelRecipes: true }
  const started = () => {
    const { runOrder, plan } = planShootRun([
      { segmentId: 'segment-1', recipeId: 'beans', title: 'Soaked beans', stepIds: ['soak'] },
      { segmentId: 'segment-2', recipeId: 'stew', title: 'Red lentil stew', stepIds: ['chop', 'simmer', 'herbs', 'finish'] },
    ], planSteps, kitchen)
    // At 4× from T0: the soak's timer starts by itself (30 kitchen min = 7.5 real min), then Next to the onion.
    const s = run(createShootState({ id: 's', mode: 'rehearsal', speed: 4, runOrder, plan }), { type: 'shoot.start' }, T0)
    return run(s, { type: 'step.next' }, T0)
  }

  it('lists the timer ending, the wait to start and the steps, from the live plan, in real ms', () => {
    // One real minute in is 4 kitchen minutes: the lentils (a wait, due at 5) and the herbs (at 5) are
    // 1 kitchen minute = 15 s away; the soak rings at 7.5 real min (6.5 left); the finish at 30 is
    // 26 kitchen min = 6.5 real min away. The lentils come as a wait, not as a step.
    expect(standByEvents(started(), screenSteps, T0 + MIN, 6)).toEqual([
      { kind: 'wait', id: 'simmer', label: 'Lentils · Red lentil stew', inMs: 15_000 },
      { kind: 'step', id: 'herbs', label: 'Pick the herbs', inMs: 15_000 },
      { kind: 'timer', id: 'wait-soak', label: 'Bean soak · Soaked beans', inMs: 6.5 * MIN },
      { kind: 'step', id: 'finish', label: 'Finish', inMs: 6.5 * MIN },
    ])
  })

  it('holds a wait that is due at zero until the host starts it, and follows the plan when the host is late', () => {
    let s = started()
    // Two real minutes in (8 kitchen minutes), still on the onion: the lentils are 3 minutes overdue.
    expect(standByEvents(s, screenSteps, T0 + 2 * MIN, 1)).toEqual([{ kind: 'wait', id: 'simmer', label: 'Lentils · Red lentil stew', inMs: 0 }])
    // Next reaches the lentils' beat: their timer starts (25 kitchen min = 6.25 real min). The plan moves
    // the finish to 33 (25 min after 8): 25 kitchen min = 6.25 real min away, with the lentils.
    s = run(s, { type: 'step.next' }, T0 + 2 * MIN)
    expect(standByEvents(s, screenSteps, T0 + 2 * MIN, 6)).toEqual([
      { kind: 'timer', id: 'wait-soak', label: 'Bean soak · Soaked beans', inMs: 5.5 * MIN },
      { kind: 'timer', id: 'wait-simmer', label: 'Lentils · Red lentil stew', inMs: 6.25 * MIN },
      { kind: 'step', id: 'finish', label: 'Finish', inMs: 6.25 * MIN },
    ])
    // At 7.5 real minutes the soak rings: it comes first, at zero, until someone acknowledges it.
    const rung = markDueTimers(s, T0 + 7.5 * MIN).state
    expect(standByEvents(rung, screenSteps, T0 + 7.6 * MIN, 1)).toEqual([{ kind: 'timer', id: 'wait-soak', label: 'Bean soak · Soaked beans', inMs: 0 }])
  })
})
