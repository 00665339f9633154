// Shoot timing (shared/utils/shoot-clock.ts, shoot-timers.ts): the shoot clock with its speed,
// timers as absolute deadlines on the server clock, rehearsal speed scaling, alarms marked due at
// their deadline (also after a server restart) and repeating until acknowledged. The arithmetic is
// the definition written in shoot-clock.ts (shootMs = anchor + elapsed × speed; deadline = now +
// kitchen time left ÷ speed); the checks work it by hand on round numbers.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import type { ShootActor, ShootMode, ShootRole, ShootState } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { shootClockAt, shootClockAtSpeed, shootClockNow, shootClockStarted, shootClockStopped } from '../../shared/utils/shoot-clock'
import { markDueTimers, timerAlarmRound, timerOverdueMs, timerRemainingMs } from '../../shared/utils/shoot-timers'
import { serverNow } from '../../shared/utils/clock'

const T0 = 1_760_000_000_000
const MIN = 60_000
const ACTORS: Record<ShootRole, ShootActor> = {
  producer: { role: 'producer', id: 'user:1', name: 'Ines Varga' },
  host: { role: 'host', id: 'user:2', name: 'Tomasz Reede' },
  camera: { role: 'camera', id: 'device:7' },
  viewer: { role: 'viewer', id: 'user:4' },
}
const newShoot = (mode: ShootMode, speed?: number) => createShootState({
  id: 'shoot-2', mode, runOrder: [{ id: 'pasta', stepIds: ['boil', 'cook'] }], ...(speed === undefined ? {} : { speed }),
})
function run(state: ShootState, command: unknown, now: number, role: ShootRole = 'producer'): ShootState {
  const r = applyShootCommand(state, command, { nowServerMs: now, actor: ACTORS[role] })
  if (!r.ok) throw new Error(`${JSON.stringify(command)}: ${r.error.code}: ${r.error.message}`)
  return r.state
}
function refuse(state: ShootState, command: unknown, now: number) {
  const r = applyShootCommand(state, command, { nowServerMs: now, actor: ACTORS.producer })
  if (r.ok) throw new Error(`expected ${JSON.stringify(command)} to be refused`)
  return r.error
}
const start = (s: ShootState, id: string, durationMs: number, now: number, label = 'Pasta') =>
  run(s, { type: 'timer.start', timerId: id, label, durationMs }, now)
const timer = (s: ShootState, id: string) => s.timers.find((t) => t.id === id)!

describe('the shoot clock', () => {
  it('reads anchor + elapsed × speed while running, the anchor while stopped', () => {
    const clock = { anchorServerMs: T0, anchorShootMs: 30_000, speed: 4, running: true }
    expect(shootClockAt(clock, T0 + 15_000)).toBe(30_000 + 15_000 * 4)
    expect(shootClockAt({ ...clock, running: false }, T0 + 15_000)).toBe(30_000)
    expect(shootClockAt(clock, T0 - 5_000)).toBe(30_000) // a server time before the anchor never runs it backwards
  })
  it('stops, starts and changes speed without a jump in shoot time', () => {
    const clock = { anchorServerMs: T0, anchorShootMs: 0, speed: 2, running: true }
    const stopped = shootClockStopped(clock, T0 + 10_000)
    expect(shootClockAt(stopped, T0 + 99_000)).toBe(20_000)
    const started = shootClockStarted(stopped, T0 + 100_000)
    expect(shootClockAt(started, T0 + 101_000)).toBe(22_000)
    const faster = shootClockAtSpeed(started, T0 + 105_000, 8) // 30 000 at the change
    expect(shootClockAt(faster, T0 + 105_000)).toBe(30_000)
    expect(shootClockAt(faster, T0 + 106_000)).toBe(38_000)
  })
  it('is continuous across any sequence of stops, starts and speed changes', () => {
    fc.assert(fc.property(fc.array(fc.record({ gap: fc.nat(100_000), op: fc.constantFrom('stop', 'start', 'speed'), speed: fc.constantFrom(1, 2, 3.5, 8) })), (ops) => {
      let clock = { anchorServerMs: T0, anchorShootMs: 0, speed: 1, running: true }
      let now = T0
      for (const { gap, op, speed } of ops) {
        now += gap
        const before = shootClockAt(clock, now)
        clock = op === 'stop' ? shootClockStopped(clock, now) : op === 'start' ? shootClockStarted(clock, now) : shootClockAtSpeed(clock, now, speed)
        expect(shootClockAt(clock, now)).toBeCloseTo(before, 6)
      }
    }))
  })
})

describe('take timers run in real time from a server deadline', () => {
  it('draws the time left from the deadline, the same on every screen whatever its clock', () => {
    const s = start(run(newShoot('take'), { type: 'shoot.start' }, T0), 'pasta', 9 * MIN, T0)
    const t = timer(s, 'pasta')
    expect(t.deadlineServerMs).toBe(T0 + 9 * MIN)
    expect(timerRemainingMs(t, T0 + 4 * MIN)).toBe(5 * MIN)
    // Two screens, one clock 10 minutes slow, both with their measured offset (clock.ts):
    const honest = timerRemainingMs(t, serverNow(T0 + 4 * MIN, 0))
    const slow = timerRemainingMs(t, serverNow(T0 + 4 * MIN - 10 * MIN, 10 * MIN))
    expect(slow).toBe(honest)
    expect(timerRemainingMs(t, T0 + 10 * MIN)).toBe(0) // never negative
  })
  it('keeps running while a take is paused: the food keeps cooking', () => {
    let s = start(run(newShoot('take'), { type: 'shoot.start' }, T0), 'pasta', 9 * MIN, T0)
    s = run(s, { type: 'shoot.pause' }, T0 + 2 * MIN)
    expect(timer(s, 'pasta')).toMatchObject({ state: 'running', deadlineServerMs: T0 + 9 * MIN })
    s = markDueTimers(s, T0 + 9 * MIN).state
    expect(timer(s, 'pasta').state).toBe('due')
  })
  it('runs timers started before the take begins', () => {
    const s = start(newShoot('take'), 'water', 8 * MIN, T0 - 5 * MIN, 'Water on')
    expect(timer(s, 'water')).toMatchObject({ state: 'running', deadlineServerMs: T0 + 3 * MIN })
  })
})

describe('rehearsal speed scales timers', () => {
  it('a 10-minute timer at 4× is due after 2.5 real minutes', () => {
    let s = run(run(newShoot('rehearsal', 4), { type: 'shoot.start' }, T0), { type: 'timer.start', timerId: 'rice', label: 'Rice', durationMs: 10 * MIN }, T0)
    expect(timer(s, 'rice')).toMatchObject({ deadlineServerMs: T0 + 2.5 * MIN, speed: 4 })
    expect(timerRemainingMs(timer(s, 'rice'), T0 + MIN)).toBe(6 * MIN) // kitchen time: 10 − 1 × 4
    expect(markDueTimers(s, T0 + 2.5 * MIN - 1).due).toEqual([])
    s = markDueTimers(s, T0 + 2.5 * MIN).state
    expect(timer(s, 'rice')).toMatchObject({ state: 'due', dueAtServerMs: T0 + 2.5 * MIN })
  })
  it('a speed change keeps the kitchen time left and moves the deadline', () => {
    let s = run(newShoot('rehearsal'), { type: 'shoot.start' }, T0)
    s = start(s, 'rice', 10 * MIN, T0)
    s = run(s, { type: 'clock.speed', speed: 4 }, T0 + 2 * MIN) // 8 kitchen minutes left
    expect(timer(s, 'rice')).toMatchObject({ deadlineServerMs: T0 + 4 * MIN, speed: 4 })
    expect(timerRemainingMs(timer(s, 'rice'), T0 + 2 * MIN)).toBe(8 * MIN)
    expect(shootClockNow(s, T0 + 3 * MIN)).toBe(6 * MIN)
    s = run(s, { type: 'clock.speed', speed: 1 }, T0 + 3 * MIN) // 4 kitchen minutes left
    expect(timer(s, 'rice').deadlineServerMs).toBe(T0 + 7 * MIN)
  })
  it('added time is kitchen time too', () => {
    let s = run(newShoot('rehearsal', 2), { type: 'shoot.start' }, T0)
    s = start(s, 'rice', 10 * MIN, T0) // due at T0 + 5 min
    s = run(s, { type: 'timer.addTime', timerId: 'rice', deltaMs: 4 * MIN }, T0 + MIN)
    expect(timer(s, 'rice').deadlineServerMs).toBe(T0 + 7 * MIN)
  })
  it('pausing the rehearsal holds its timers; resuming releases them with the time they had', () => {
    let s = run(newShoot('rehearsal', 2), { type: 'shoot.start' }, T0)
    s = start(s, 'rice', 10 * MIN, T0)
    s = start(s, 'stock', 30 * MIN, T0, 'Stock')
    s = run(s, { type: 'timer.pause', timerId: 'stock' }, T0 + MIN) // paused by hand: 28 min left
    s = run(s, { type: 'shoot.pause' }, T0 + 2 * MIN) // rice: 10 − 2 × 2 = 6 min left
    expect(timer(s, 'rice')).toMatchObject({ state: 'paused', heldByShoot: true, remainingMs: 6 * MIN })
    expect(timer(s, 'stock')).toMatchObject({ state: 'paused', heldByShoot: false, remainingMs: 28 * MIN })
    expect(markDueTimers(s, T0 + 60 * MIN).due).toEqual([]) // nothing rings while held
    expect(refuse(s, { type: 'timer.resume', timerId: 'stock' }, T0 + 3 * MIN).code).toBe('rehearsal-stopped')
    expect(refuse(s, { type: 'timer.pause', timerId: 'rice' }, T0 + 3 * MIN)).toMatchObject({ code: 'timer-not-running', message: expect.stringMatching(/paused with the rehearsal; it runs again when you press “Resume the shoot”/) })
    s = run(s, { type: 'shoot.resume' }, T0 + 10 * MIN)
    expect(timer(s, 'rice')).toMatchObject({ state: 'running', heldByShoot: false, deadlineServerMs: T0 + 13 * MIN })
    expect(timer(s, 'stock').state).toBe('paused') // a timer paused by hand stays paused
  })
  it('timers set before the rehearsal starts wait for it', () => {
    let s = start(newShoot('rehearsal', 4), 'rice', 10 * MIN, T0 - MIN)
    expect(timer(s, 'rice')).toMatchObject({ state: 'paused', heldByShoot: true, remainingMs: 10 * MIN })
    expect(refuse(s, { type: 'timer.resume', timerId: 'rice' }, T0).message).toMatch(/has not started.*press “Start the shoot” first/)
    s = run(s, { type: 'shoot.start' }, T0)
    expect(timer(s, 'rice')).toMatchObject({ state: 'running', deadlineServerMs: T0 + 2.5 * MIN })
  })
  it('adding time to a rung timer while the rehearsal is stopped holds it for the rehearsal', () => {
    let s = run(newShoot('rehearsal'), { type: 'shoot.start' }, T0)
    s = start(s, 'rice', MIN, T0)
    s = run(s, { type: 'shoot.pause' }, T0 + 2 * MIN) // rice rang at T0 + 1 min, before the pause
    expect(timer(s, 'rice').state).toBe('due')
    s = run(s, { type: 'timer.addTime', timerId: 'rice', deltaMs: 3 * MIN }, T0 + 3 * MIN)
    expect(timer(s, 'rice')).toMatchObject({ state: 'paused', heldByShoot: true, remainingMs: 3 * MIN, dueAtServerMs: null })
  })
})

describe('markDueTimers: alarms as events', () => {
  const twoTimers = () => {
    let s = run(newShoot('take'), { type: 'shoot.start' }, T0)
    s = start(s, 'pasta', 9 * MIN, T0)
    return start(s, 'roast', 40 * MIN, T0, 'Roast')
  }
  it('marks a timer due at its deadline and hands it back once', () => {
    const s = twoTimers()
    const first = markDueTimers(s, T0 + 9 * MIN)
    expect(first.due.map((t) => t.id)).toEqual(['pasta'])
    expect(first.state.seq).toBe(s.seq + 1)
    expect(timer(first.state, 'pasta')).toMatchObject({ state: 'due', dueAtServerMs: T0 + 9 * MIN })
    expect(timer(first.state, 'roast').state).toBe('running')
    const again = markDueTimers(first.state, T0 + 10 * MIN)
    expect(again.due).toEqual([])
    expect(again.state).toBe(first.state) // nothing new: the same state, no seq raised
  })
  it('fires timers that expired while the server was down, from when they expired', () => {
    // The server stopped at T0 + 5 min and starts again at T0 + 45 min: both deadlines passed.
    const stored: ShootState = JSON.parse(JSON.stringify(twoTimers()))
    const { state, due } = markDueTimers(stored, T0 + 45 * MIN)
    expect(due.map((t) => [t.id, t.dueAtServerMs])).toEqual([['pasta', T0 + 9 * MIN], ['roast', T0 + 40 * MIN]])
    expect(timerOverdueMs(timer(state, 'pasta'), T0 + 45 * MIN)).toBe(36 * MIN)
    expect(stored.timers.map((t) => t.state)).toEqual(['running', 'running']) // input untouched
  })
  it('the reducer marks due timers before a command, and reports them', () => {
    const s = twoTimers()
    const r = applyShootCommand(s, { type: 'step.next' }, { nowServerMs: T0 + 10 * MIN, actor: ACTORS.host })
    expect(r.ok && r.events[0]).toEqual({ type: 'timer.due', timerId: 'pasta', label: 'Pasta', slot: 0, sound: null, dueAtServerMs: T0 + 9 * MIN })
    expect(r.ok && r.state.seq).toBe(s.seq + 1) // one command, one seq, the due marking included
  })
  it('repeats the alarm until acknowledged: every screen derives the same ring from the server time', () => {
    let s = markDueTimers(twoTimers(), T0 + 9 * MIN).state
    const pasta = timer(s, 'pasta')
    expect(timerAlarmRound(pasta, T0 + 9 * MIN, 20_000)).toBe(0)
    expect(timerAlarmRound(pasta, T0 + 9 * MIN + 19_999, 20_000)).toBe(0)
    expect(timerAlarmRound(pasta, T0 + 9 * MIN + 20_000, 20_000)).toBe(1)
    expect(timerAlarmRound(pasta, T0 + 9 * MIN + 65_000, 20_000)).toBe(3)
    expect(timerAlarmRound(timer(s, 'roast'), T0 + 9 * MIN, 20_000)).toBeNull()
    s = run(s, { type: 'timer.acknowledge', timerId: 'pasta' }, T0 + 10 * MIN, 'host')
    expect(timerAlarmRound(timer(s, 'pasta'), T0 + 11 * MIN, 20_000)).toBeNull()
    expect(() => timerAlarmRound(pasta, T0, 0)).toThrow(/positive time/)
  })
  it('paused, due and closed timers report what they hold', () => {
    let s = twoTimers()
    s = run(s, { type: 'timer.pause', timerId: 'roast' }, T0 + 10 * MIN) // pasta rings at T0 + 9 min
    expect(timerRemainingMs(timer(s, 'roast'), T0 + 99 * MIN)).toBe(30 * MIN)
    expect(timerRemainingMs(timer(s, 'pasta'), T0 + 10 * MIN)).toBe(0)
    expect(timerOverdueMs(timer(s, 'pasta'), T0 + 10 * MIN)).toBe(MIN)
    expect(timerOverdueMs(timer(s, 'roast'), T0 + 10 * MIN)).toBe(0)
    s = run(s, { type: 'timer.cancel', timerId: 'roast' }, T0 + 11 * MIN)
    expect(timer(s, 'roast')).toMatchObject({ state: 'cancelled', remainingMs: 30 * MIN })
    expect(timerRemainingMs(timer(s, 'roast'), T0 + 11 * MIN)).toBe(0)
  })
})
