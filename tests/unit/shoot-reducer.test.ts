// The shoot reducer (shared/utils/shoot-reducer.ts): every command, every illegal transition, and
// purity (a frozen input state is never changed; time and ids come from the context). The episode
// is invented, from the fictional Brackenford Test Kitchen. The rules checked are Hobline's own
// (DESIGN.md, "Server authoritative shoot state"), so there is no outside source to cite here;
// the clock and timecode maths are checked against RFC 5905 and SMPTE ST 12-1 in their own files.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import type { ShootActor, ShootMode, ShootRole, ShootSegment, ShootState } from '../../shared/types/shoot'
import { SHOOT_COMMAND_TYPES, SHOOT_MARKER_LIMIT, SHOOT_TIMER_LIMIT, SHOOT_TIMER_SLOTS } from '../../shared/types/shoot'
import { createShootState, shootCursorRef, shootPositions } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { isShootTimerLive, timerRemainingMs } from '../../shared/utils/shoot-timers'
import { shootClockNow } from '../../shared/utils/shoot-clock'

// ---- fixtures ----------------------------------------------------------------------------------
/** intro (no steps) · orzo, 3 steps · sponsor read (no steps) · pan sauce, 2 steps · sign-off: 8 positions. */
const RUN_ORDER: ShootSegment[] = [
  { id: 'intro', title: 'Welcome to Brackenford', stepIds: [] },
  { id: 'orzo', title: 'Lemon orzo', stepIds: ['orzo-boil', 'orzo-cook', 'orzo-drain'] },
  { id: 'sponsor', title: 'Read for Millbeck Flour', stepIds: [] },
  { id: 'sauce', title: 'Brown butter sauce', stepIds: ['sauce-melt', 'sauce-brown'] },
  { id: 'outro', title: 'Sign-off', stepIds: [] },
]
const T0 = 1_760_000_000_000
const MIN = 60_000
const ACTORS: Record<ShootRole, ShootActor> = {
  producer: { role: 'producer', id: 'user:1', name: 'Ines Varga' },
  host: { role: 'host', id: 'user:2', name: 'Tomasz Reede' },
  camera: { role: 'camera', id: 'device:7', name: 'Camera A' },
  viewer: { role: 'viewer', id: 'user:4', name: 'Editor' },
}
const newShoot = (mode: ShootMode = 'take', speed?: number) =>
  createShootState({ id: 'shoot-1', mode, runOrder: RUN_ORDER, ...(speed === undefined ? {} : { speed }) })

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value)
    for (const v of Object.values(value)) deepFreeze(v)
  }
  return value
}
let counter = 0
const makeId = () => `made-${++counter}`

/** Applies a command that must succeed, to a frozen copy of the input; checks seq and purity. */
function apply(state: ShootState, command: unknown, now: number, role: ShootRole = 'producer') {
  const before = structuredClone(state)
  const result = applyShootCommand(deepFreeze(state), command, { nowServerMs: now, actor: ACTORS[role], newId: makeId })
  if (!result.ok) throw new Error(`expected ${JSON.stringify(command)} to apply; got ${result.error.code}: ${result.error.message}`)
  expect(state).toEqual(before)
  expect(result.state.seq).toBe(state.seq + 1)
  return result
}
const run = (state: ShootState, command: unknown, now: number, role: ShootRole = 'producer') => apply(state, command, now, role).state
function refuse(state: ShootState, command: unknown, now: number, role: ShootRole = 'producer') {
  const result = applyShootCommand(deepFreeze(state), command, { nowServerMs: now, actor: ACTORS[role], newId: makeId })
  if (result.ok) throw new Error(`expected ${JSON.stringify(command)} to be refused; it applied`)
  return result.error
}
const runningTake = () => run(newShoot('take'), { type: 'shoot.start' }, T0)
const withTimer = (s: ShootState, timerId: string, durationMs: number, now: number, label = 'Orzo') =>
  run(s, { type: 'timer.start', timerId, label, durationMs }, now)
const timer = (s: ShootState, id: string) => s.timers.find((t) => t.id === id)!

// ---- the shoot as a whole ----------------------------------------------------------------------
describe('createShootState', () => {
  it('makes a ready shoot at the first position with a stopped clock', () => {
    const s = newShoot('rehearsal', 3)
    expect(s).toMatchObject({ status: 'ready', seq: 0, cursor: { segment: 0, step: 0 }, rolling: false, timers: [], markers: [] })
    expect(s.clock).toEqual({ anchorServerMs: 0, anchorShootMs: 0, speed: 3, running: false })
    expect(newShoot('take', 3).clock.speed).toBe(1) // a take is always real time
    expect(shootPositions(s.runOrder)).toHaveLength(8)
  })
  it('refuses run orders it cannot drive, saying what is wrong', () => {
    expect(() => createShootState({ id: 's', mode: 'take', runOrder: [] })).toThrow(/no segments/)
    expect(() => createShootState({ id: 's', mode: 'take', runOrder: [{ id: 'a', stepIds: [] }, { id: 'a', stepIds: [] }] })).toThrow(/appears twice/)
    expect(() => createShootState({ id: 's', mode: 'take', runOrder: [{ id: 'a' } as ShootSegment] })).toThrow(/needs stepIds/)
    expect(() => createShootState({ id: 's', mode: 'rehearsal', runOrder: RUN_ORDER, speed: 33 })).toThrow(/1× to 32×/)
    expect(() => createShootState({ id: 's', mode: 'live' as ShootMode, runOrder: RUN_ORDER })).toThrow(/rehearsal or a take/)
  })
})

describe('shoot.start / pause / resume / end', () => {
  it('start runs the clock from 0 and enters the first step', () => {
    const { state, events } = apply(newShoot(), { type: 'shoot.start' }, T0)
    expect(state.status).toBe('running')
    expect(state.startedAtServerMs).toBe(T0)
    expect(state.clock).toEqual({ anchorServerMs: T0, anchorShootMs: 0, speed: 1, running: true })
    expect(state.visits).toEqual([{ stepRef: { segment: 0, step: 0, segmentId: 'intro', stepId: null }, enteredServerMs: T0, enteredShootMs: 0 }])
    expect(events.map((e) => e.type)).toEqual(['shoot.status', 'step.entered'])
  })
  it('pause stops the shoot clock, resume carries on from where it stopped', () => {
    const paused = run(runningTake(), { type: 'shoot.pause' }, T0 + 5 * MIN)
    expect(paused.status).toBe('paused')
    expect(shootClockNow(paused, T0 + 60 * MIN)).toBe(5 * MIN)
    const resumed = run(paused, { type: 'shoot.resume' }, T0 + 7 * MIN)
    expect(resumed.status).toBe('running')
    expect(shootClockNow(resumed, T0 + 8 * MIN)).toBe(6 * MIN)
  })
  it('end stops the clock, drops rolling and keeps the record', () => {
    let s = run(runningTake(), { type: 'rolling.set', rolling: true }, T0 + MIN, 'camera')
    s = run(s, { type: 'marker.add', kind: 'good' }, T0 + 2 * MIN, 'camera')
    const { state, events } = apply(s, { type: 'shoot.end' }, T0 + 3 * MIN)
    expect(state).toMatchObject({ status: 'ended', rolling: false, rollingSinceServerMs: null, endedAtServerMs: T0 + 3 * MIN })
    expect(state.clock.running).toBe(false)
    expect(state.markers.map((m) => m.kind)).toEqual(['chapter', 'good'])
    expect(state.recordedMs).toBe(2 * MIN) // rolled from 1:00 to the end at 3:00
    expect(events.map((e) => e.type)).toEqual(['rolling.changed', 'shoot.status'])
  })
  it('end may come straight from ready (a shoot called off) or from paused', () => {
    expect(run(newShoot(), { type: 'shoot.end' }, T0).status).toBe('ended')
    expect(run(run(runningTake(), { type: 'shoot.pause' }, T0 + 1), { type: 'shoot.end' }, T0 + 2).status).toBe('ended')
  })
  it('end refuses while timers still need attention, unless told to cancel them', () => {
    let s = withTimer(runningTake(), 'orzo', 9 * MIN, T0)
    s = withTimer(s, 'oven', 1 * MIN, T0, 'Roast squash')
    const later = T0 + 2 * MIN // "Roast squash" has rung by now, "Orzo" has 7:00 left
    const err = refuse(s, { type: 'shoot.end' }, later)
    expect(err.code).toBe('timers-active')
    expect(err.message).toMatch(/2 timers still need attention: "Orzo" \(7:00 left\), "Roast squash" \(ringing\)/)
    const { state } = apply(s, { type: 'shoot.end', cancelTimers: true }, later)
    expect(state.timers.map((t) => t.state)).toEqual(['cancelled', 'cancelled'])
    expect(state.timers.some(isShootTimerLive)).toBe(false)
  })
  it('illegal transitions', () => {
    const ready = newShoot()
    const running = runningTake()
    const paused = run(running, { type: 'shoot.pause' }, T0 + 1)
    const ended = run(running, { type: 'shoot.end' }, T0 + 1)
    expect(refuse(running, { type: 'shoot.start' }, T0 + 1).code).toBe('already-started')
    expect(refuse(paused, { type: 'shoot.start' }, T0 + 1).message).toMatch(/press “Resume the shoot” instead/)
    expect(refuse(ready, { type: 'shoot.pause' }, T0).code).toBe('not-started')
    expect(refuse(paused, { type: 'shoot.pause' }, T0 + 2).code).toBe('not-running')
    expect(refuse(ready, { type: 'shoot.resume' }, T0).code).toBe('not-started')
    expect(refuse(running, { type: 'shoot.resume' }, T0 + 1).code).toBe('not-paused')
    // After the end nothing applies, whatever it is.
    for (const command of [
      { type: 'shoot.start' }, { type: 'shoot.resume' }, { type: 'shoot.end' }, { type: 'step.next' },
      { type: 'timer.start', label: 'Tea', durationMs: 60_000 }, { type: 'rolling.set', rolling: true },
      { type: 'marker.add', kind: 'note', text: 'late pickup' },
    ]) {
      const err = refuse(ended, command, T0 + 2)
      expect(err.code).toBe('shoot-ended')
      expect(err.message).toMatch(/has ended/)
    }
  })
})

// ---- the cursor --------------------------------------------------------------------------------
describe('step.next / step.previous / step.jump', () => {
  it('next walks every position in order, into segments with and without steps', () => {
    let s = runningTake()
    const seen = [shootCursorRef(s)]
    for (let i = 1; i < 8; i++) {
      s = run(s, { type: 'step.next' }, T0 + i * MIN)
      seen.push(shootCursorRef(s))
    }
    expect(seen.map((r) => `${r.segmentId}/${r.stepId}`)).toEqual([
      'intro/null', 'orzo/orzo-boil', 'orzo/orzo-cook', 'orzo/orzo-drain', 'sponsor/null', 'sauce/sauce-melt', 'sauce/sauce-brown', 'outro/null',
    ])
    expect(s.visits).toHaveLength(8)
    expect(s.visits[3]).toMatchObject({ enteredServerMs: T0 + 3 * MIN, enteredShootMs: 3 * MIN, stepRef: { stepId: 'orzo-drain' } })
    const err = refuse(s, { type: 'step.next' }, T0 + 9 * MIN)
    expect(err.code).toBe('at-last-step')
  })
  it('previous walks back across segment boundaries and stops at the first position', () => {
    let s = run(runningTake(), { type: 'step.jump', segment: 3, step: 0 }, T0 + 1)
    s = run(s, { type: 'step.previous' }, T0 + 2)
    expect(s.cursor).toEqual({ segment: 2, step: 0 })
    s = run(s, { type: 'step.previous' }, T0 + 3)
    expect(s.cursor).toEqual({ segment: 1, step: 2 })
    const first = runningTake()
    expect(refuse(first, { type: 'step.previous' }, T0 + 1).code).toBe('at-first-step')
  })
  it('jump goes anywhere that exists and records the visit with the shoot time', () => {
    const { state, events } = apply(runningTake(), { type: 'step.jump', segment: 3, step: 1 }, T0 + 4 * MIN)
    expect(shootCursorRef(state)).toEqual({ segment: 3, step: 1, segmentId: 'sauce', stepId: 'sauce-brown' })
    expect(events).toEqual([{ type: 'step.entered', stepRef: shootCursorRef(state), atServerMs: T0 + 4 * MIN, shootMs: 4 * MIN }])
  })
  it('jump refuses positions outside the run order and the position it is at', () => {
    const s = runningTake()
    expect(refuse(s, { type: 'step.jump', segment: 5, step: 0 }, T0 + 1)).toMatchObject({ code: 'no-such-step', field: 'segment' })
    expect(refuse(s, { type: 'step.jump', segment: 1, step: 3 }, T0 + 1)).toMatchObject({ code: 'no-such-step', field: 'step', message: expect.stringMatching(/has 3 steps; there is no step 4/) })
    expect(refuse(s, { type: 'step.jump', segment: 0, step: 1 }, T0 + 1).code).toBe('no-such-step') // a segment without steps is one position
    expect(refuse(s, { type: 'step.jump', segment: 0, step: 0 }, T0 + 1).code).toBe('no-change')
  })
  it('moves the starting point before the start without logging visits', () => {
    const s = run(newShoot(), { type: 'step.jump', segment: 1, step: 0 }, T0)
    expect(s.visits).toEqual([])
    const started = run(s, { type: 'shoot.start' }, T0 + 1)
    expect(started.visits.map((v) => v.stepRef.stepId)).toEqual(['orzo-boil'])
  })
  it('moves while paused at the paused shoot time', () => {
    const paused = run(run(runningTake(), { type: 'shoot.pause' }, T0 + 2 * MIN), { type: 'step.next' }, T0 + 9 * MIN)
    expect(paused.visits.at(-1)).toMatchObject({ enteredServerMs: T0 + 9 * MIN, enteredShootMs: 2 * MIN })
  })
})

// ---- timers --------------------------------------------------------------------------------------
describe('timer.start', () => {
  it('stores an absolute deadline on the server clock, the step and who started it', () => {
    const s = run(run(runningTake(), { type: 'step.next' }, T0 + MIN), {
      type: 'timer.start', timerId: 'orzo', label: '  Orzo in the pot  ', durationMs: 9 * MIN, sound: 'bell',
    }, T0 + 2 * MIN, 'host')
    expect(timer(s, 'orzo')).toMatchObject({
      slot: 0, label: 'Orzo in the pot', sound: 'bell', state: 'running', durationMs: 9 * MIN, speed: 1,
      deadlineServerMs: T0 + 11 * MIN, remainingMs: null, startedAtServerMs: T0 + 2 * MIN, startedBy: ACTORS.host,
      stepRef: { segmentId: 'orzo', stepId: 'orzo-boil' },
    })
  })
  it('gives each live timer its own slot, the lowest free one, and takes ids from newId', () => {
    let s = runningTake()
    s = run(s, { type: 'timer.start', label: 'A', durationMs: MIN }, T0)
    s = run(s, { type: 'timer.start', label: 'B', durationMs: MIN, slot: 5 }, T0)
    s = run(s, { type: 'timer.start', label: 'C', durationMs: MIN }, T0)
    expect(s.timers.map((t) => t.slot)).toEqual([0, 5, 1])
    expect(s.timers.every((t) => t.id.startsWith('made-'))).toBe(true)
    const firstId = s.timers[0]!.id
    s = run(s, { type: 'timer.cancel', timerId: firstId }, T0 + 1)
    s = run(s, { type: 'timer.start', label: 'D', durationMs: MIN }, T0 + 2) // slot 0 is free again
    expect(s.timers.at(-1)!.slot).toBe(0)
    expect(refuse(s, { type: 'timer.start', label: 'E', durationMs: MIN, slot: 5 }, T0 + 3)).toMatchObject({ code: 'slot-taken', field: 'slot' })
  })
  it('ties a timer to a given step when asked', () => {
    const s = run(runningTake(), { type: 'timer.start', label: 'Brown butter', durationMs: 4 * MIN, stepRef: { segment: 3, step: 1 } }, T0)
    expect(s.timers[0]!.stepRef).toEqual({ segment: 3, step: 1, segmentId: 'sauce', stepId: 'sauce-brown' })
    expect(refuse(s, { type: 'timer.start', label: 'X', durationMs: MIN, stepRef: { segment: 9, step: 0 } }, T0).code).toBe('no-such-step')
  })
  it(`runs at most ${SHOOT_TIMER_SLOTS} live timers at once, and refuses ids it cannot use`, () => {
    let s = runningTake()
    for (let i = 0; i < SHOOT_TIMER_SLOTS; i++) s = run(s, { type: 'timer.start', timerId: `t${i}`, label: `T${i}`, durationMs: MIN }, T0)
    expect(refuse(s, { type: 'timer.start', label: 'One more', durationMs: MIN }, T0).code).toBe('too-many-timers')
    s = run(s, { type: 'timer.cancel', timerId: 't3' }, T0 + 1)
    expect(refuse(s, { type: 'timer.start', timerId: 't3', label: 'Again', durationMs: MIN }, T0 + 2)).toMatchObject({ code: 'duplicate-id', field: 'timerId' })
    const noIds = applyShootCommand(runningTake(), { type: 'timer.start', label: 'X', durationMs: MIN }, { nowServerMs: T0, actor: ACTORS.producer })
    expect(noIds.ok ? null : noIds.error.code).toBe('no-id')
  })
  it(`keeps at most ${SHOOT_TIMER_LIMIT} timers in one shoot`, () => {
    let s = runningTake()
    for (let i = 0; i < SHOOT_TIMER_LIMIT; i++) {
      s = applyOk(s, { type: 'timer.start', timerId: `t${i}`, label: 'T', durationMs: MIN }, T0 + i)
      s = applyOk(s, { type: 'timer.cancel', timerId: `t${i}` }, T0 + i)
    }
    expect(refuse(s, { type: 'timer.start', label: 'T', durationMs: MIN }, T0 + 1000).code).toBe('too-many-timers')
  })
})

/** Applies without the purity checks, for long loops. */
function applyOk(s: ShootState, command: unknown, now: number): ShootState {
  const r = applyShootCommand(s, command, { nowServerMs: now, actor: ACTORS.producer, newId: makeId })
  if (!r.ok) throw new Error(r.error.message)
  return r.state
}

describe('timer.pause / timer.resume', () => {
  it('pause keeps the time left; resume sets a fresh deadline from it', () => {
    let s = withTimer(runningTake(), 'orzo', 9 * MIN, T0)
    s = run(s, { type: 'timer.pause', timerId: 'orzo' }, T0 + 2 * MIN)
    expect(timer(s, 'orzo')).toMatchObject({ state: 'paused', remainingMs: 7 * MIN, deadlineServerMs: null })
    expect(timerRemainingMs(timer(s, 'orzo'), T0 + 50 * MIN)).toBe(7 * MIN)
    s = run(s, { type: 'timer.resume', timerId: 'orzo' }, T0 + 10 * MIN)
    expect(timer(s, 'orzo')).toMatchObject({ state: 'running', remainingMs: null, deadlineServerMs: T0 + 17 * MIN })
  })
  it('illegal transitions', () => {
    let s = withTimer(runningTake(), 'orzo', 9 * MIN, T0)
    s = withTimer(s, 'oven', MIN, T0, 'Squash')
    expect(refuse(s, { type: 'timer.resume', timerId: 'orzo' }, T0 + 1).code).toBe('timer-not-paused')
    const paused = run(s, { type: 'timer.pause', timerId: 'orzo' }, T0 + 1)
    expect(refuse(paused, { type: 'timer.pause', timerId: 'orzo' }, T0 + 2)).toMatchObject({ code: 'timer-not-running', message: expect.stringMatching(/already paused/) })
    // "Squash" rang at T0 + 1 min: it can be acknowledged, not paused or resumed.
    expect(refuse(s, { type: 'timer.pause', timerId: 'oven' }, T0 + 2 * MIN).code).toBe('timer-due')
    expect(refuse(s, { type: 'timer.resume', timerId: 'oven' }, T0 + 2 * MIN).code).toBe('timer-due')
    const cancelled = run(s, { type: 'timer.cancel', timerId: 'orzo' }, T0 + 2)
    expect(refuse(cancelled, { type: 'timer.pause', timerId: 'orzo' }, T0 + 3)).toMatchObject({ code: 'timer-closed', message: expect.stringMatching(/was cancelled/) })
    expect(refuse(cancelled, { type: 'timer.resume', timerId: 'orzo' }, T0 + 3).code).toBe('timer-closed')
    expect(refuse(s, { type: 'timer.pause', timerId: 'nope' }, T0 + 3)).toMatchObject({ code: 'unknown-timer', field: 'timerId' })
  })
})

describe('timer.addTime', () => {
  it('moves a running deadline and the set duration', () => {
    let s = withTimer(runningTake(), 'orzo', 9 * MIN, T0)
    s = run(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: 2 * MIN }, T0 + MIN)
    expect(timer(s, 'orzo')).toMatchObject({ deadlineServerMs: T0 + 11 * MIN, durationMs: 11 * MIN })
    s = run(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: -30_000 }, T0 + 2 * MIN)
    expect(timer(s, 'orzo')).toMatchObject({ deadlineServerMs: T0 + 10.5 * MIN, durationMs: 10.5 * MIN })
  })
  it('changes the remainder of a paused timer', () => {
    let s = withTimer(runningTake(), 'orzo', 9 * MIN, T0)
    s = run(s, { type: 'timer.pause', timerId: 'orzo' }, T0 + 4 * MIN)
    s = run(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: MIN }, T0 + 5 * MIN)
    expect(timer(s, 'orzo')).toMatchObject({ state: 'paused', remainingMs: 6 * MIN, durationMs: 10 * MIN })
  })
  it('taking off all the time left makes the timer due now', () => {
    const s = withTimer(runningTake(), 'orzo', 2 * MIN, T0)
    const { state, events } = apply(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: -5 * MIN }, T0 + MIN)
    expect(timer(state, 'orzo')).toMatchObject({ state: 'due', dueAtServerMs: T0 + MIN, durationMs: MIN })
    expect(events.map((e) => e.type)).toEqual(['timer.changed', 'timer.due'])
  })
  it('runs a timer that has rung again for the time added ("two more minutes")', () => {
    let s = withTimer(runningTake(), 'orzo', MIN, T0)
    const due = run(s, { type: 'step.next' }, T0 + 90_000) // any command marks it due first
    expect(timer(due, 'orzo').state).toBe('due')
    s = run(due, { type: 'timer.addTime', timerId: 'orzo', deltaMs: 2 * MIN }, T0 + 100_000)
    expect(timer(s, 'orzo')).toMatchObject({ state: 'running', deadlineServerMs: T0 + 100_000 + 2 * MIN, dueAtServerMs: null, durationMs: 3 * MIN })
    const acked = run(due, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + 100_000, 'host')
    const again = run(acked, { type: 'timer.addTime', timerId: 'orzo', deltaMs: MIN }, T0 + 110_000)
    expect(timer(again, 'orzo')).toMatchObject({ state: 'running', acknowledgedBy: null, acknowledgedAtServerMs: null })
  })
  it('a timer re-run after acknowledging moves to a free slot if its own was taken', () => {
    let s = withTimer(runningTake(), 'orzo', MIN, T0) // slot 0
    s = run(s, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + 2 * MIN)
    s = withTimer(s, 'tea', 5 * MIN, T0 + 2 * MIN, 'Tea') // takes slot 0
    s = run(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: MIN }, T0 + 3 * MIN)
    expect([timer(s, 'tea').slot, timer(s, 'orzo').slot]).toEqual([0, 1])
  })
  it('illegal changes', () => {
    let s = withTimer(runningTake(), 'orzo', MIN, T0)
    expect(refuse(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: -MIN }, T0 + 2 * MIN).code).toBe('timer-due')
    s = run(s, { type: 'timer.cancel', timerId: 'orzo' }, T0 + 1)
    expect(refuse(s, { type: 'timer.addTime', timerId: 'orzo', deltaMs: MIN }, T0 + 2).code).toBe('timer-closed')
    const long = withTimer(runningTake(), 'stock', 23 * 60 * MIN, T0, 'Stock')
    expect(refuse(long, { type: 'timer.addTime', timerId: 'stock', deltaMs: 2 * 60 * MIN }, T0)).toMatchObject({ code: 'invalid', field: 'deltaMs', message: expect.stringMatching(/more than 24 hours/) })
    expect(refuse(long, { type: 'timer.addTime', timerId: 'ghost', deltaMs: MIN }, T0).code).toBe('unknown-timer')
  })
})

describe('timer.cancel / timer.acknowledge', () => {
  it('cancel closes a running, paused or due timer and frees its slot', () => {
    for (const prepare of [
      (s: ShootState) => s,
      (s: ShootState) => run(s, { type: 'timer.pause', timerId: 'orzo' }, T0 + 1),
      (s: ShootState) => run(s, { type: 'step.next' }, T0 + 2 * MIN),
    ]) {
      const s = prepare(withTimer(runningTake(), 'orzo', MIN, T0))
      const now = T0 + 3 * MIN
      const out = run(s, { type: 'timer.cancel', timerId: 'orzo' }, now)
      expect(timer(out, 'orzo')).toMatchObject({ state: 'cancelled', cancelledAtServerMs: now, deadlineServerMs: null })
      expect(isShootTimerLive(timer(out, 'orzo'))).toBe(false)
    }
  })
  it('acknowledge silences a due timer and says who did', () => {
    const s = withTimer(runningTake(), 'orzo', MIN, T0)
    const { state, events } = apply(s, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + 70_000, 'host')
    expect(events.map((e) => e.type)).toEqual(['timer.due', 'timer.changed'])
    expect(timer(state, 'orzo')).toMatchObject({ state: 'acknowledged', dueAtServerMs: T0 + MIN, acknowledgedBy: ACTORS.host, acknowledgedAtServerMs: T0 + 70_000 })
  })
  it('illegal transitions', () => {
    const s = withTimer(runningTake(), 'orzo', 3 * MIN, T0)
    expect(refuse(s, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + MIN)).toMatchObject({ code: 'timer-not-due', message: expect.stringMatching(/2:00 left/) })
    const acked = run(s, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + 4 * MIN, 'host')
    expect(refuse(acked, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + 5 * MIN)).toMatchObject({ code: 'timer-closed', message: expect.stringMatching(/Tomasz Reede pressed “Done”/) })
    expect(refuse(acked, { type: 'timer.cancel', timerId: 'orzo' }, T0 + 5 * MIN).code).toBe('timer-closed')
    const gone = run(s, { type: 'timer.cancel', timerId: 'orzo' }, T0 + 1)
    expect(refuse(gone, { type: 'timer.cancel', timerId: 'orzo' }, T0 + 2).code).toBe('timer-closed')
    expect(refuse(gone, { type: 'timer.acknowledge', timerId: 'orzo' }, T0 + 2).code).toBe('timer-closed')
    expect(refuse(gone, { type: 'timer.cancel', timerId: 'other' }, T0 + 2).code).toBe('unknown-timer')
  })
})

// ---- rolling, speed, markers -------------------------------------------------------------------
describe('rolling.set', () => {
  it('turns rolling on with the time it began, and off again', () => {
    const { state, events } = apply(runningTake(), { type: 'rolling.set', rolling: true }, T0 + MIN, 'camera')
    expect(state).toMatchObject({ rolling: true, rollingSinceServerMs: T0 + MIN, rollingSinceShootMs: MIN })
    expect(events).toEqual([{ type: 'rolling.changed', rolling: true, atServerMs: T0 + MIN }])
    const off = run(state, { type: 'rolling.set', rolling: false }, T0 + 2 * MIN, 'camera')
    expect(off).toMatchObject({ rolling: false, rollingSinceServerMs: null })
  })
  it('may roll before the start; the shoot clock then counts from the start', () => {
    const s = run(run(newShoot(), { type: 'rolling.set', rolling: true }, T0 - 5000, 'camera'), { type: 'shoot.start' }, T0)
    expect(s).toMatchObject({ rolling: true, rollingSinceServerMs: T0 - 5000, rollingSinceShootMs: 0 })
  })
  it('refuses a change that changes nothing (a double tap)', () => {
    expect(refuse(runningTake(), { type: 'rolling.set', rolling: false }, T0, 'camera')).toMatchObject({ code: 'no-change', message: 'The camera is not rolling; press “Roll” to roll.' })
    const rolling = run(runningTake(), { type: 'rolling.set', rolling: true }, T0, 'camera')
    expect(refuse(rolling, { type: 'rolling.set', rolling: true }, T0 + 1, 'camera').code).toBe('no-change')
  })
})

describe('clock.speed', () => {
  it('sets the rehearsal speed before and during the rehearsal', () => {
    const ready = run(newShoot('rehearsal'), { type: 'clock.speed', speed: 4 }, T0)
    expect(ready.clock).toMatchObject({ speed: 4, running: false })
    const started = run(ready, { type: 'shoot.start' }, T0 + 1)
    expect(shootClockNow(started, T0 + 1 + MIN)).toBe(4 * MIN)
  })
  it('refuses speed in a take and a speed already set', () => {
    expect(refuse(runningTake(), { type: 'clock.speed', speed: 2 }, T0)).toMatchObject({ code: 'take-mode', message: expect.stringMatching(/real time/) })
    const r = run(newShoot('rehearsal'), { type: 'clock.speed', speed: 2 }, T0)
    expect(refuse(r, { type: 'clock.speed', speed: 2 }, T0).code).toBe('no-change')
  })
})

describe('marker.add', () => {
  it('stamps a marker with the shoot clock, the server time, the step, who and the rolling start', () => {
    let s = run(runningTake(), { type: 'step.next' }, T0 + MIN)
    s = run(s, { type: 'rolling.set', rolling: true }, T0 + 2 * MIN, 'camera')
    s = run(s, { type: 'shoot.pause' }, T0 + 3 * MIN)
    const { state, events } = apply(s, { type: 'marker.add', markerId: 'm1', kind: 'flub', text: 'said "tablespoon" for teaspoon' }, T0 + 4 * MIN, 'host')
    expect(state.markers.filter((m) => m.kind !== 'chapter')).toEqual([{
      id: 'm1', kind: 'flub', text: 'said "tablespoon" for teaspoon', shootMs: 3 * MIN, serverMs: T0 + 4 * MIN,
      stepRef: { segment: 1, step: 0, segmentId: 'orzo', stepId: 'orzo-boil' }, by: ACTORS.host, rollingSinceServerMs: T0 + 2 * MIN,
      recordingMs: 2 * MIN, // the camera rolled at 2:00 and keeps rolling through the pause
    }])
    expect(events).toEqual([{ type: 'marker.added', markerId: 'm1', kind: 'flub' }])
    const plain = run(runningTake(), { type: 'marker.add', kind: 'good' }, T0 + 1, 'camera')
    expect(plain.markers[0]).toMatchObject({ text: null, rollingSinceServerMs: null })
  })
  it('marks a chapter at the roll and at every step change while rolling, in recording time across rolls', () => {
    // Worked by hand: roll 0:30–1:30 (60 s recorded), stop, roll again at 2:00; the step change at
    // 2:20 sits at 60 + 20 = 80 s of recording, as record-run timecode continues across rolls.
    let s = run(runningTake(), { type: 'rolling.set', rolling: true }, T0 + 30_000, 'camera')
    s = run(s, { type: 'step.next' }, T0 + 45_000)
    s = run(s, { type: 'rolling.set', rolling: false }, T0 + 90_000, 'camera')
    expect(s.recordedMs).toBe(60_000)
    s = run(s, { type: 'step.next' }, T0 + 100_000) // not rolling: no chapter
    s = run(s, { type: 'rolling.set', rolling: true }, T0 + 120_000, 'camera')
    s = run(s, { type: 'step.next' }, T0 + 140_000)
    s = run(s, { type: 'marker.add', kind: 'pickup' }, T0 + 150_000, 'camera')
    expect(s.markers.map((m) => [m.kind, m.recordingMs, m.stepRef.stepId])).toEqual([
      ['chapter', 0, s.markers[0]!.stepRef.stepId],
      ['chapter', 15_000, s.markers[1]!.stepRef.stepId],
      ['chapter', 60_000, s.markers[2]!.stepRef.stepId],
      ['chapter', 80_000, s.markers[3]!.stepRef.stepId],
      ['pickup', 90_000, s.markers[3]!.stepRef.stepId],
    ])
    expect(new Set(s.markers.map((m) => m.stepRef.stepId)).size).toBe(4)
    expect(new Set(s.markers.map((m) => m.id)).size).toBe(5)
  })
  it('refuses before the start, duplicate ids, and past the limit', () => {
    expect(refuse(newShoot(), { type: 'marker.add', kind: 'good' }, T0, 'camera').code).toBe('not-started')
    const s = run(runningTake(), { type: 'marker.add', markerId: 'm1', kind: 'good' }, T0 + 1)
    expect(refuse(s, { type: 'marker.add', markerId: 'm1', kind: 'pickup' }, T0 + 2)).toMatchObject({ code: 'duplicate-id', field: 'markerId' })
    const full: ShootState = { ...s, markers: Array.from({ length: SHOOT_MARKER_LIMIT }, (_, i) => ({ ...s.markers[0]!, id: `m${i}` })) }
    expect(refuse(full, { type: 'marker.add', kind: 'good' }, T0 + 3).code).toBe('too-many-markers')
  })
})

// ---- role and shape checks, in the reducer -----------------------------------------------------
describe('the reducer checks role and shape before anything else', () => {
  it('refuses a role that may not send a command, naming who may', () => {
    const s = runningTake()
    expect(refuse(s, { type: 'rolling.set', rolling: true }, T0, 'host')).toMatchObject({
      code: 'forbidden', message: 'The host may not set the camera rolling flag; the producer or a camera operator may.',
    })
    expect(refuse(s, { type: 'timer.start', label: 'X', durationMs: MIN }, T0, 'camera').code).toBe('forbidden')
    expect(refuse(s, { type: 'clock.speed', speed: 2 }, T0, 'host').code).toBe('forbidden')
    expect(refuse(s, { type: 'shoot.end' }, T0, 'host').code).toBe('forbidden')
    for (const type of SHOOT_COMMAND_TYPES) expect(refuse(s, { type }, T0, 'viewer').code).toBe('forbidden')
    // Even on an ended shoot, the role is checked first.
    expect(refuse(run(s, { type: 'shoot.end' }, T0 + 1), { type: 'step.next' }, T0 + 2, 'viewer').code).toBe('forbidden')
  })
  it('refuses a malformed command, naming the field', () => {
    const s = runningTake()
    expect(refuse(s, { type: 'timer.start', label: 'x'.repeat(81), durationMs: MIN }, T0)).toMatchObject({ code: 'invalid', field: 'label' })
    expect(refuse(s, { type: 'step.teleport' }, T0)).toMatchObject({ code: 'invalid', field: 'type' })
    const badClock = applyShootCommand(s, { type: 'step.next' }, { nowServerMs: Number.NaN, actor: ACTORS.producer })
    expect(badClock.ok ? null : badClock.error.field).toBe('nowServerMs')
  })
})

// ---- properties over random command sequences --------------------------------------------------
describe('any sequence of commands', () => {
  const commandArb = fc.oneof(
    fc.constantFrom(
      { type: 'shoot.start' }, { type: 'shoot.pause' }, { type: 'shoot.resume' }, { type: 'shoot.end' },
      { type: 'shoot.end', cancelTimers: true }, { type: 'step.next' }, { type: 'step.previous' },
    ),
    fc.record({ type: fc.constant('step.jump'), segment: fc.nat(5), step: fc.nat(3) }),
    fc.record({ type: fc.constant('timer.start'), timerId: fc.constantFrom('a', 'b', 'c', 'd'), label: fc.constant('Pot'), durationMs: fc.integer({ min: 1000, max: 20 * MIN }) }),
    fc.record({ type: fc.constantFrom('timer.pause', 'timer.resume', 'timer.cancel', 'timer.acknowledge'), timerId: fc.constantFrom('a', 'b', 'c', 'd') }),
    fc.record({ type: fc.constant('timer.addTime'), timerId: fc.constantFrom('a', 'b', 'c', 'd'), deltaMs: fc.integer({ min: -10 * MIN, max: 10 * MIN }).filter((d) => d !== 0) }),
    fc.record({ type: fc.constant('rolling.set'), rolling: fc.boolean() }),
    fc.record({ type: fc.constant('clock.speed'), speed: fc.constantFrom(1, 1.5, 2, 4, 8) }),
    fc.record({ type: fc.constant('marker.add'), kind: fc.constantFrom('good', 'flub', 'pickup') }),
  )
  const stepArb = fc.record({ command: commandArb, gapMs: fc.integer({ min: 0, max: 3 * MIN }), role: fc.constantFrom<ShootRole>('producer', 'host', 'camera', 'viewer') })

  it('never changes its input, raises seq by one per applied command and keeps the state coherent', () => {
    fc.assert(fc.property(fc.constantFrom<ShootMode>('take', 'rehearsal'), fc.array(stepArb, { maxLength: 40 }), (mode, steps) => {
      let s = newShoot(mode)
      let now = T0
      for (const { command, gapMs, role } of steps) {
        now += gapMs
        const frozen = deepFreeze(s)
        const r = applyShootCommand(frozen, command, { nowServerMs: now, actor: ACTORS[role], newId: makeId })
        if (!r.ok) {
          expect(r.error.message.length).toBeGreaterThan(10)
          continue
        }
        expect(r.state.seq).toBe(s.seq + 1)
        s = r.state
        // Coherence: the cursor is in the run order; live timers have distinct slots; a running
        // timer has a deadline, a paused one a remainder; takes run at 1×; rehearsal timers do
        // not run while the rehearsal clock is stopped; a timer past its deadline is not running.
        expect(() => shootCursorRef(s)).not.toThrow()
        const live = s.timers.filter(isShootTimerLive)
        expect(new Set(live.map((t) => t.slot)).size).toBe(live.length)
        for (const t of s.timers) {
          if (t.state === 'running') {
            expect(t.deadlineServerMs).toBeGreaterThan(now)
            expect(t.speed).toBe(s.clock.speed)
          }
          if (t.state === 'paused') expect(t.remainingMs).toBeGreaterThan(0)
          if (mode === 'rehearsal' && !s.clock.running) expect(t.state).not.toBe('running')
        }
        if (mode === 'take') expect(s.clock.speed).toBe(1)
        if (s.status === 'ended') expect(live).toHaveLength(0)
      }
    }), { numRuns: 300 })
  })
})
