// The rehearsal report (shared/utils/rehearsal-report.ts): a small rehearsal at 16× driven through
// the reducer, every actual worked by hand in kitchen time (shoot clock = 16 × real time since the
// start, shared/utils/shoot-clock.ts). The measuring rule (timer for a timed wait, the cursor for
// the rest) and the suggested range's rounding are Hobline's own rules, stated in the module.
import { describe, expect, it } from 'vitest'
import type { ShootActor, ShootState } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { planShootRun } from '../../shared/utils/shoot-plan'
import { KITCHEN, RECIPES, STEPS } from '../support/lentil-kitchen'
import { biggestOverruns, rehearsalReport, stepActuals, suggestedRange, suggestedRanges } from '../../shared/utils/rehearsal-report'

const T0 = 1_760_000_000_000
const S = 1000
const MIN = 60_000
// The kitchen of tests/support/lentil-kitchen.ts: plan soak 0–30, chop 0–5, simmer 5–30, herbs 5–15, finish 30–33 (min).
const HOST: ShootActor = { role: 'producer', id: 'user:1' }

function run(s: ShootState, command: unknown, realMs: number): ShootState {
  const r = applyShootCommand(s, command, { nowServerMs: T0 + realMs, actor: HOST })
  if (!r.ok) throw new Error(`${JSON.stringify(command)}: ${r.error.message}`)
  return r.state
}
const timerId = (s: ShootState, stepId: string) => s.timers.find((t) => t.origin === 'step' && t.stepRef.stepId === stepId)!.id

/**
 * Real seconds → kitchen seconds at 16×:
 *   0 s start (soak's timer starts, kitchen 0)      1 s next → chop (kitchen 16 s)
 *   23.5 s next → simmer (kitchen 376 s; its timer)  24.5 s next → herbs (kitchen 392 s)
 *   54.5 s next → finish (kitchen 872 s)             105 s soak done (kitchen 1680 s = 28 min)
 *   106 s simmer done (kitchen 1696 s)               120 s end (kitchen 1920 s)
 */
function rehearsal(): ShootState {
  const { runOrder, plan } = planShootRun(RECIPES, STEPS, KITCHEN)
  let s = createShootState({ id: 'shoot-7', mode: 'rehearsal', runOrder, plan })
  s = run(s, { type: 'clock.speed', speed: 16 }, 0)
  s = run(s, { type: 'shoot.start' }, 0)
  s = run(s, { type: 'step.next' }, 1 * S)
  s = run(s, { type: 'step.next' }, 23.5 * S)
  s = run(s, { type: 'step.next' }, 24.5 * S)
  s = run(s, { type: 'step.next' }, 54.5 * S)
  s = run(s, { type: 'timer.acknowledge', timerId: timerId(s, 'soak') }, 105 * S)
  s = run(s, { type: 'timer.acknowledge', timerId: timerId(s, 'simmer') }, 106 * S)
  return run(s, { type: 'shoot.end' }, 120 * S)
}

describe('what each step took, in kitchen time', () => {
  const s = rehearsal()

  it('is 16 × the real time, from the timer for a timed wait and from the cursor for the rest', () => {
    expect(s.runOrder[0]!.stepIds).toEqual(['soak', 'chop', 'simmer', 'herbs', 'finish'])
    const a = Object.fromEntries(stepActuals(s, T0 + 200 * S))
    expect(a).toEqual({
      soak: { ms: 28 * MIN, source: 'timer' }, // 105 s × 16 = 1680 s
      chop: { ms: 360 * S, source: 'cursor' }, // (23.5 − 1) s × 16
      simmer: { ms: 22 * MIN, source: 'timer' }, // (106 − 23.5) s × 16 = 1320 s
      herbs: { ms: 480 * S, source: 'cursor' }, // (54.5 − 24.5) s × 16
      finish: { ms: 1048 * S, source: 'cursor' }, // (120 − 54.5) s × 16
    })
  })

  it('leaves out the step the cursor is still on, and a wait whose timer was cancelled', () => {
    // A shoot whose soak timer was cancelled, read at 60 s while the cursor is still on chop.
    const { runOrder, plan } = planShootRun(RECIPES, STEPS, KITCHEN)
    let s2 = createShootState({ id: 'shoot-8', mode: 'rehearsal', runOrder, plan })
    s2 = run(s2, { type: 'clock.speed', speed: 16 }, 0)
    s2 = run(s2, { type: 'shoot.start' }, 0)
    s2 = run(s2, { type: 'step.next' }, 1 * S)
    s2 = run(s2, { type: 'timer.cancel', timerId: timerId(s2, 'soak') }, 2 * S)
    const a = stepActuals(s2, T0 + 60 * S)
    expect(a.has('soak')).toBe(false)
    expect(a.has('chop')).toBe(false)
  })
})

describe('the report', () => {
  const r = rehearsalReport(rehearsal(), T0 + 200 * S)

  it('puts each step against its range: over the long end, under the short end, within', () => {
    const by = Object.fromEntries(r.steps.map((x) => [x.stepId, x]))
    expect(by.chop).toMatchObject({ plannedMinMs: null, plannedMaxMs: 5 * MIN, actualMs: 6 * MIN, overMs: 1 * MIN, verdict: 'over' })
    expect(by.herbs).toMatchObject({ actualMs: 8 * MIN, overMs: -2 * MIN, verdict: 'under' }) // no short end: 10 min is both ends
    expect(by.soak).toMatchObject({ label: 'Bean soak', actualMs: 28 * MIN, overMs: -2 * MIN, verdict: 'within' }) // 25 ≤ 28 ≤ 30
    expect(by.simmer).toMatchObject({ label: 'Lentils', actualMs: 22 * MIN, verdict: 'within' })
    expect(by.finish).toMatchObject({ actualMs: 1048 * S, overMs: 868 * S, verdict: 'over' }) // 1048 − 180
  })

  it('lists the biggest overruns, most over first', () => {
    expect(r.overruns.map((x) => [x.stepId, x.overMs])).toEqual([['finish', 868 * S], ['chop', 60 * S]])
    expect(biggestOverruns(r.steps, 1).map((x) => x.stepId)).toEqual(['finish'])
  })

  it('times the segment against its span in the first plan, and the shoot as a whole', () => {
    // One cooking segment, side by side: planned 0–33 min; the cursor was in it from 0 to the end, 1920 s.
    expect(r.segments).toEqual([{ id: 'segment-cook', title: 'Soaked beans and Red lentil stew', plannedMs: 33 * MIN, actualMs: 1920 * S, overMs: -60 * S }])
    expect(r.plannedMakespanMs).toBe(33 * MIN)
    expect(r.actualLengthMs).toBe(1920 * S)
  })
})

describe('the suggested range', () => {
  it('runs from the shortest to the longest actual, rounded outward to the minute (to 5 s under a minute)', () => {
    expect(suggestedRange([360 * S, 270 * S])).toEqual({ min: 240, max: 360, rehearsals: 2 }) // 4:30 → 4:00, 6:00 stays
    expect(suggestedRange([1048 * S])).toEqual({ min: 1020, max: 1080, rehearsals: 1 }) // 17:28 → 17:00 … 18:00
    expect(suggestedRange([12_300, 41_000])).toEqual({ min: 10, max: 45, rehearsals: 2 })
    expect(suggestedRange([1_200])).toEqual({ min: 5, max: 5, rehearsals: 1 }) // never under 5 s
    expect(suggestedRange([])).toBeNull()
  })

  it('gathers each step across rehearsals, counting the rehearsals that measured it', () => {
    const one = stepActuals(rehearsal(), T0 + 200 * S)
    const two = new Map([['chop', { ms: 270 * S, source: 'cursor' as const }]])
    const ranges = suggestedRanges([one, two])
    expect(ranges.get('chop')).toEqual({ min: 240, max: 360, rehearsals: 2 })
    expect(ranges.get('herbs')).toEqual({ min: 480, max: 480, rehearsals: 1 })
    expect(ranges.get('simmer')).toEqual({ min: 1320, max: 1320, rehearsals: 1 })
  })
})
