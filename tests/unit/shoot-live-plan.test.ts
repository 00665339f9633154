// The shoot runs the cook plan (shared/utils/shoot-plan.ts planShootRun, shoot-waits.ts,
// shoot-live-plan.ts): the host's script in plan order, waits whose timers start themselves with the
// step's range (checked at the short end, ringing at the long end), "start it now" from a cue, and
// the plan computed again from the present after every change. The kitchen (tests/support/lentil-kitchen.ts) is small enough to
// work by hand; every expected time is worked in the comment beside it. The scheduler itself is
// checked against its published sources in plan.test.ts and plan-replan.test.ts.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import type { ShootActor, ShootState } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { planShootRun } from '../../shared/utils/shoot-plan'
import { markDueTimers, timerChecking } from '../../shared/utils/shoot-timers'
import { waitTimerLabel } from '../../shared/utils/shoot-waits'
import { KITCHEN, RECIPES, STEPS } from '../support/lentil-kitchen'

const T0 = 1_760_000_000_000
const MIN = 60_000
const HOST: ShootActor = { role: 'host', id: 'user:2', name: 'Tomasz Reede' }
function newShoot(steps = STEPS, kitchen = KITCHEN): ShootState {
  const { runOrder, plan } = planShootRun(RECIPES, steps, kitchen)
  return createShootState({ id: 'shoot-9', mode: 'rehearsal', runOrder, plan })
}
function run(s: ShootState, command: unknown, at: number): ShootState {
  const r = applyShootCommand(s, command, { nowServerMs: T0 + at, actor: HOST })
  if (!r.ok) throw new Error(`${JSON.stringify(command)}: ${r.error.code}: ${r.error.message}`)
  return r.state
}
function refused(s: ShootState, command: unknown, at: number) {
  const r = applyShootCommand(s, command, { nowServerMs: T0 + at, actor: HOST })
  if (r.ok) throw new Error(`expected ${JSON.stringify(command)} to be refused`)
  return r.error
}
const live = (s: ShootState, id: string) => s.plan!.live!.steps[id]!
const at = (s: ShootState) => s.runOrder[s.cursor.segment]!.stepIds[s.cursor.step]
const timerOf = (s: ShootState, id: string) => s.timers.find((t) => t.stepRef.stepId === id && t.origin === 'step')

describe('the host\'s script is the plan', () => {
  it('puts every beat at its planned start, a wait first at the same moment, the recipes interleaved', () => {
    const s = newShoot()
    // Worked by hand: soak 0–30, chop 0–5, simmer 5–30, herbs 5–15 (one cook), finish 30–33.
    expect(s.runOrder).toEqual([{ id: 'segment-cook', title: 'Soaked beans and Red lentil stew', stepIds: ['soak', 'chop', 'simmer', 'herbs', 'finish'] }])
    expect(s.plan!.source).toEqual({ kind: 'plan', sideBySide: true })
    expect(s.plan!.first!.makespanMs).toBe(33 * MIN)
    expect(s.plan!.first!.steps.simmer).toMatchObject({ startMs: 5 * MIN, endMs: 30 * MIN })
    // Before anything happens the live plan is the first plan.
    expect(s.plan!.live!.makespanMs).toBe(33 * MIN)
    for (const [id, p] of Object.entries(s.plan!.first!.steps)) expect([live(s, id).startMs, live(s, id).endMs]).toEqual([p.startMs, p.endMs])
  })

  it('a plan the kitchen refuses runs the recipes as written, naming the steps that keep it from being planned', () => {
    // The oven step needs an oven the kitchen does not have.
    const steps = STEPS.map((p) => (p.id === 'herbs' ? { ...p, station: 'oven' as const } : p))
    const s = newShoot(steps, { ...KITCHEN, ovens: 0 })
    expect(s.runOrder.map((r) => r.stepIds)).toEqual([['soak'], ['chop', 'simmer', 'herbs', 'finish']])
    expect(s.plan!.source.kind).toBe('recipe-order')
    if (s.plan!.source.kind !== 'recipe-order') return
    expect(s.plan!.source.stepIds).toEqual(['herbs'])
    expect(s.plan!.source.reason).toMatch(/oven/i)
    expect(s.plan!.source.reason).toContain('"herbs" in Red lentil stew')
    expect(s.plan!.live).toBeNull()
    // Waits still get their timers from their written time.
    const started = run(s, { type: 'shoot.start' }, 0)
    expect(timerOf(started, 'soak')?.durationMs).toBe(30 * MIN)
  })
})

describe('timers born from steps', () => {
  it('reaching a wait\'s beat starts its timer: named after the step and its recipe, the long end, checked at the short end', () => {
    let s = run(newShoot(), { type: 'shoot.start' }, 0)
    const soak = timerOf(s, 'soak')!
    expect(soak).toMatchObject({ id: 'wait-soak', label: 'Bean soak · Soaked beans', durationMs: 30 * MIN, checkLeftMs: 5 * MIN, state: 'running' })
    expect(soak.deadlineServerMs).toBe(T0 + 30 * MIN)
    expect(soak.stepRef).toMatchObject({ segmentId: 'segment-cook', stepId: 'soak' })
    s = run(s, { type: 'step.next' }, 0)
    expect(at(s)).toBe('chop')
    expect(s.timers).toHaveLength(1) // a hands-on step has no timer of its own
    s = run(s, { type: 'step.next' }, 5 * MIN)
    expect(timerOf(s, 'simmer')).toMatchObject({ label: 'Lentils · Red lentil stew', durationMs: 25 * MIN, checkLeftMs: 5 * MIN })
    // Going back to the wait and on again starts nothing twice.
    s = run(run(run(s, { type: 'step.previous' }, 6 * MIN), { type: 'step.next' }, 6 * MIN), { type: 'step.next' }, 6 * MIN)
    expect(s.timers.filter((t) => t.origin === 'step')).toHaveLength(2)
  })

  it('says "check it" from the short end and rings at the long end; the host may call it done from the check on', () => {
    let s = run(newShoot(), { type: 'shoot.start' }, 0)
    const soak = () => timerOf(s, 'soak')!
    // 25 min of the 25–30: check at 25, ring at 30.
    expect(timerChecking(soak(), T0 + 25 * MIN - 1)).toBe(false)
    expect(timerChecking(soak(), T0 + 25 * MIN)).toBe(true)
    expect(refused(s, { type: 'timer.acknowledge', timerId: 'wait-soak' }, 24 * MIN).code).toBe('timer-not-due')
    expect(markDueTimers(s, T0 + 30 * MIN - 1).due).toHaveLength(0)
    expect(markDueTimers(s, T0 + 30 * MIN).due.map((t) => t.id)).toEqual(['wait-soak'])
    // One key adds a minute: the check and the alarm both move by it.
    s = run(s, { type: 'timer.addTime', timerId: 'wait-soak', deltaMs: MIN }, 10 * MIN)
    expect(timerChecking(soak(), T0 + 26 * MIN - 1)).toBe(false)
    expect(soak().deadlineServerMs).toBe(T0 + 31 * MIN)
    s = run(s, { type: 'timer.acknowledge', timerId: 'wait-soak' }, 27 * MIN)
    expect(soak()).toMatchObject({ state: 'acknowledged', closedAtShootMs: 27 * MIN })
    expect(live(s, 'soak')).toMatchObject({ state: 'done', startMs: 0, endMs: 27 * MIN })
  })

  it('"start it now" from a cue starts the wait early, and Next then goes past its beat', () => {
    let s = run(run(newShoot(), { type: 'shoot.start' }, 0), { type: 'step.next' }, 0)
    s = run(s, { type: 'wait.start', stepId: 'simmer' }, 4 * MIN)
    expect(timerOf(s, 'simmer')!.deadlineServerMs).toBe(T0 + 29 * MIN)
    expect(at(s)).toBe('chop')
    expect(refused(s, { type: 'wait.start', stepId: 'simmer' }, 4 * MIN)).toMatchObject({ code: 'already-started' })
    expect(refused(s, { type: 'wait.start', stepId: 'herbs' }, 4 * MIN)).toMatchObject({ code: 'no-such-step', field: 'stepId' })
    s = run(s, { type: 'step.next' }, 5 * MIN)
    expect(at(s)).toBe('herbs')
  })
})

describe('a plan that follows the kitchen', () => {
  const started = () => run(run(newShoot(), { type: 'shoot.start' }, 0), { type: 'step.next' }, 0)

  it('a hands-on step 3 minutes late shifts what depends on it by 3 minutes and leaves the running soak alone', () => {
    const s = run(started(), { type: 'step.next' }, 8 * MIN)
    // The onion took 8 min, not 5: the lentils go on at 8 (due at 33), the stew is finished 33–36.
    expect(live(s, 'chop')).toMatchObject({ state: 'done', startMs: 0, endMs: 8 * MIN })
    expect(live(s, 'simmer')).toMatchObject({ state: 'running', startMs: 8 * MIN, endMs: 33 * MIN, movedMs: 3 * MIN })
    expect(live(s, 'herbs')).toMatchObject({ state: 'pending', startMs: 8 * MIN, movedMs: 3 * MIN })
    expect(live(s, 'finish')).toMatchObject({ startMs: 33 * MIN, movedMs: 3 * MIN })
    expect(s.plan!.live!.makespanMs).toBe(36 * MIN)
    // The soak started at 0 keeps its deadline.
    expect(live(s, 'soak')).toMatchObject({ state: 'running', startMs: 0, endMs: 30 * MIN, movedMs: 0 })
    expect(timerOf(s, 'soak')!.deadlineServerMs).toBe(T0 + 30 * MIN)
    // The first plan is kept to compare against.
    expect(s.plan!.first!.makespanMs).toBe(33 * MIN)
  })

  it('an early finish pulls the work after it forward', () => {
    const s = run(started(), { type: 'step.next' }, 3 * MIN)
    // The onion took 3 min: lentils 3–28, finish 28–31, the soak (to 30) ends the cook at 31.
    expect(live(s, 'simmer')).toMatchObject({ startMs: 3 * MIN, endMs: 28 * MIN, movedMs: -2 * MIN })
    expect(live(s, 'finish')).toMatchObject({ startMs: 28 * MIN, endMs: 31 * MIN })
    expect(s.plan!.live!.makespanMs).toBe(31 * MIN)
  })

  it('a wait called done at its check lets the next step start then', () => {
    let s = run(run(started(), { type: 'step.next' }, 5 * MIN), { type: 'step.next' }, 5 * MIN)
    expect(at(s)).toBe('herbs')
    s = run(s, { type: 'step.next' }, 15 * MIN)
    expect(at(s)).toBe('finish')
    s = run(run(s, { type: 'step.previous' }, 15 * MIN), { type: 'timer.acknowledge', timerId: 'wait-simmer' }, 25 * MIN)
    // Lentils checked and done at 25 (their short end); the host is back on the herbs, so the finish starts
    // as soon as the herbs are left.
    expect(live(s, 'simmer')).toMatchObject({ state: 'done', startMs: 5 * MIN, endMs: 25 * MIN })
    expect(live(s, 'finish').startMs).toBe(25 * MIN)
  })

  it('a pause in a rehearsal holds the clock: nothing moves while it is stopped', () => {
    let s = run(started(), { type: 'shoot.pause' }, 2 * MIN)
    s = run(s, { type: 'shoot.resume' }, 12 * MIN)
    // Ten real minutes paused are no kitchen time: the plan still finishes at 33.
    expect(s.plan!.live!.makespanMs).toBe(33 * MIN)
    expect(timerOf(s, 'soak')!.deadlineServerMs).toBe(T0 + 40 * MIN)
  })

  it('capacities hold at every instant of every re-plan (property)', () => {
    // Random host behaviour: Next, Back, confirm a wait, add a minute, after random gaps.
    const op = fc.record({ gap: fc.integer({ min: 0, max: 12 * MIN }), kind: fc.constantFrom('next', 'back', 'ack', 'add', 'start') })
    fc.assert(fc.property(fc.array(op, { maxLength: 14 }), (ops) => {
      let s = run(newShoot(), { type: 'shoot.start' }, 0)
      let t = 0
      for (const o of ops) {
        t += o.gap
        const live = s.timers.find((x) => x.state === 'due' || timerChecking(x, T0 + t))
        const running = s.timers.find((x) => x.state === 'running')
        const command = {
          next: { type: 'step.next' }, back: { type: 'step.previous' }, start: { type: 'wait.start', stepId: 'simmer' },
          ack: live ? { type: 'timer.acknowledge', timerId: live.id } : null,
          add: running ? { type: 'timer.addTime', timerId: running.id, deltaMs: MIN } : null,
        }[o.kind]
        if (!command) continue
        const r = applyShootCommand(s, command, { nowServerMs: T0 + t, actor: HOST })
        if (!r.ok) continue
        s = r.state
        const plan = s.plan!.live!
        expect(plan.atShootMs).toBe(t)
        const spans = Object.entries(plan.steps).map(([id, p]) => ({ id, ...p, step: STEPS.find((x) => x.id === id)! }))
        for (const p of spans) if (p.state === 'pending') expect(p.startMs).toBeGreaterThanOrEqual(t)
        // From now on: at most one cook's hands and four burners in use at any instant.
        for (const moment of spans.map((p) => Math.max(p.startMs, t))) {
          const at = spans.filter((p) => p.state !== 'done' && p.startMs <= moment && moment < p.endMs)
          expect(at.filter((p) => p.step.handsOn).length).toBeLessThanOrEqual(1)
          expect(at.filter((p) => p.step.station === 'burner').length).toBeLessThanOrEqual(4)
        }
        // Links hold for what is still to come: the finish after the lentils, the simmer after the chop.
        if (plan.steps.finish!.state === 'pending') expect(plan.steps.finish!.startMs).toBeGreaterThanOrEqual(plan.steps.simmer!.endMs)
      }
    }), { numRuns: 80, seed: 1202 })
  })
})

describe('waitTimerLabel', () => {
  it('uses the short name, else the step text cut at a word, and the recipe', () => {
    expect(waitTimerLabel({ id: '4', name: 'Dough rest', label: 'Cover and leave', recipeTitle: 'Flatbreads' })).toBe('Dough rest · Flatbreads')
    const long = 'Bring a large pot of well salted water to a rolling boil over a high heat'
    expect(waitTimerLabel({ id: '5', name: null, label: long, recipeTitle: 'Pasta' })).toBe('Bring a large pot of well salted water to a… · Pasta')
  })
})

describe('what the screens read from the live plan', () => {
  it('the next waits with their countdown, the step against its planned end, the projected finish', async () => {
    const { upcomingWaits, currentStepTiming, shootProjection } = await import('../../shared/utils/shoot-cues')
    let s = run(run(newShoot(), { type: 'shoot.start' }, 0), { type: 'step.next' }, 0)
    // On the onion (0–5): the lentils are the next wait, due at 5; 0:30 before, the countdown says 30 s.
    expect(upcomingWaits(s, T0 + 4.5 * MIN)).toEqual([
      { stepId: 'simmer', label: 'Lentils', recipeTitle: 'Red lentil stew', atMs: 5 * MIN, inMs: 30_000, during: 'herbs' },
    ])
    expect(currentStepTiming(s, T0 + 4.5 * MIN)).toEqual({ stepId: 'chop', endMs: 5 * MIN, leftMs: 30_000 })
    // Past due it waits on the host, counting below zero.
    expect(upcomingWaits(s, T0 + 6 * MIN)[0]!.inMs).toBe(-MIN)
    expect(shootProjection(s)).toEqual({ plannedMs: 33 * MIN, projectedMs: 33 * MIN, lateMs: 0 })
    s = run(s, { type: 'step.next' }, 8 * MIN)
    expect(upcomingWaits(s, T0 + 8 * MIN)).toEqual([])
    expect(shootProjection(s)).toEqual({ plannedMs: 33 * MIN, projectedMs: 36 * MIN, lateMs: 3 * MIN })
  })
})
