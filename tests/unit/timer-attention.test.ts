// Which timer the host's one-key "done" and "+1 min" act on (shared/utils/timer-attention.ts).
// Product rules, not facts with an outside source; the times are worked by hand beside each check.
import { describe, expect, it } from 'vitest'
import { MIN, T0, run } from '../support/shoot-commands'
import { createShootState } from '../../shared/utils/shoot'
import { timerForMoreTime, timersToCallDone } from '../../shared/utils/timer-attention'

const shoot = () => run(createShootState({ id: 's', mode: 'take', runOrder: [{ id: 'a', stepIds: ['x'] }] }), { type: 'shoot.start' }, T0)
const ids = (list: Array<{ id: string }>) => list.map((t) => t.id)

describe('timersToCallDone', () => {
  it('takes every ringing timer, a running one past its deadline included', () => {
    let s = run(shoot(), { type: 'timer.start', timerId: 'eggs', label: 'Eggs', durationMs: 2 * MIN }, T0)
    s = run(s, { type: 'timer.start', timerId: 'rice', label: 'Rice', durationMs: 3 * MIN }, T0)
    s = run(s, { type: 'timer.start', timerId: 'stew', label: 'Stew', durationMs: 20 * MIN }, T0)
    // At 3 min both eggs (due at 2) and rice (due at 3) ring; the stew has 17 min left.
    expect(ids(timersToCallDone(s.timers, T0 + 3 * MIN))).toEqual(['eggs', 'rice'])
    expect(timersToCallDone(s.timers, T0 + MIN)).toEqual([])
  })
  it('with none ringing, takes the one at its check nearest its end', () => {
    // Timers started from a plan's wait carry checkLeftMs: a 25–30 min soak is checked with 5 min left.
    const s = run(shoot(), { type: 'timer.start', timerId: 'a', label: 'A', durationMs: 30 * MIN }, T0)
    const timers = [
      { ...s.timers[0]!, id: 'soak', slot: 0, checkLeftMs: 5 * MIN },
      { ...s.timers[0]!, id: 'rest', slot: 1, deadlineServerMs: T0 + 28 * MIN, checkLeftMs: 10 * MIN },
      { ...s.timers[0]!, id: 'bake', slot: 2, deadlineServerMs: T0 + 26 * MIN, checkLeftMs: null },
    ]
    // At 24 min: the soak has 6 left (check at 5: not yet); the rest 4 (check at 10: checking); the bake
    // has no check. Only the rest may be called done.
    expect(ids(timersToCallDone(timers, T0 + 24 * MIN))).toEqual(['rest'])
    // At 25.5 min the soak (4.5 left) is checking too, but the rest (2.5 left) is nearer its end.
    expect(ids(timersToCallDone(timers, T0 + 25.5 * MIN))).toEqual(['rest'])
  })
})

describe('timerForMoreTime', () => {
  it('goes to the timer ringing longest, else to the live one with least time left', () => {
    let s = run(shoot(), { type: 'timer.start', timerId: 'stew', label: 'Stew', durationMs: 20 * MIN }, T0)
    s = run(s, { type: 'timer.start', timerId: 'eggs', label: 'Eggs', durationMs: 6 * MIN }, T0)
    s = run(s, { type: 'timer.start', timerId: 'rice', label: 'Rice', durationMs: 4 * MIN }, T0)
    expect(timerForMoreTime(s.timers, T0 + MIN)?.id).toBe('rice')
    // At 7 min the rice (due at 4) has rung longer than the eggs (due at 6).
    expect(timerForMoreTime(s.timers, T0 + 7 * MIN)?.id).toBe('rice')
    s = run(s, { type: 'timer.acknowledge', timerId: 'rice' }, T0 + 7 * MIN)
    expect(timerForMoreTime(s.timers, T0 + 7 * MIN)?.id).toBe('eggs')
    s = run(s, { type: 'timer.acknowledge', timerId: 'eggs' }, T0 + 7 * MIN)
    expect(timerForMoreTime(s.timers, T0 + 7 * MIN)?.id).toBe('stew')
    expect(timerForMoreTime([], T0)).toBeNull()
  })
})
