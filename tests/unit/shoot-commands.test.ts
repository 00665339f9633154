// Shoot commands: who may send which (the roles of DESIGN.md, "Who uses it"), and the zod schema
// the server validates them with (shared/types/shoot.ts, shared/utils/shoot-commands.ts). The
// limits are Hobline's own choices, so each check tests the boundary on both sides.
import { describe, expect, it } from 'vitest'
import { SHOOT_COMMAND_TYPES, type ShootCommandType, type ShootRole } from '../../shared/types/shoot'
import { SHOOT_COMMAND_ROLES, shootCommandAllowed, shootCommandForbiddenMessage } from '../../shared/utils/shoot-commands'
import { parseShootCommand, shootCommandSchema } from '../../shared/utils/shoot-schema'

describe('who may send which command', () => {
  // DESIGN.md, "Who uses it": the producer may do everything; the host drives a shoot (advance,
  // timers, marks); the camera adds markers and toggles rolling; a viewer reads only. Ending the
  // shoot and the rehearsal speed belong to the producer's control desk.
  const expected: Record<ShootCommandType, ShootRole[]> = {
    'shoot.start': ['producer', 'host'],
    'shoot.pause': ['producer', 'host'],
    'shoot.resume': ['producer', 'host'],
    'shoot.end': ['producer'],
    'step.next': ['producer', 'host'],
    'step.previous': ['producer', 'host'],
    'step.jump': ['producer', 'host'],
    'timer.start': ['producer', 'host'],
    'timer.pause': ['producer', 'host'],
    'timer.resume': ['producer', 'host'],
    'timer.addTime': ['producer', 'host'],
    'timer.cancel': ['producer', 'host'],
    'timer.acknowledge': ['producer', 'host'],
    'rolling.set': ['producer', 'camera'],
    'clock.speed': ['producer'],
    'marker.add': ['producer', 'host', 'camera'],
    'wait.start': ['producer', 'host'],
    // The take log afterwards: only the producer sets cameras and changes or deletes markers.
    'marker.edit': ['producer'],
    'marker.delete': ['producer'],
    'camera.set': ['producer'],
    'camera.remove': ['producer'],
  }
  const roles: ShootRole[] = ['producer', 'host', 'camera', 'viewer']

  it('covers every command type', () => {
    expect(Object.keys(SHOOT_COMMAND_ROLES).sort()).toEqual([...SHOOT_COMMAND_TYPES].sort())
    expect(Object.keys(expected).sort()).toEqual([...SHOOT_COMMAND_TYPES].sort())
  })
  for (const type of SHOOT_COMMAND_TYPES) {
    it(`${type}: ${expected[type].join(', ')}`, () => {
      for (const role of roles) expect(shootCommandAllowed(role, type), `${role} ${type}`).toBe(expected[type].includes(role))
    })
  }
  it('the producer may send everything, a viewer nothing', () => {
    expect(SHOOT_COMMAND_TYPES.every((t) => shootCommandAllowed('producer', t))).toBe(true)
    expect(SHOOT_COMMAND_TYPES.some((t) => shootCommandAllowed('viewer', t))).toBe(false)
  })
  it('refuses unknown roles and unknown commands', () => {
    expect(shootCommandAllowed('admin', 'shoot.start')).toBe(false)
    expect(shootCommandAllowed('producer', 'shoot.delete')).toBe(false)
  })
  it('says who may instead', () => {
    expect(shootCommandForbiddenMessage('camera', 'timer.start')).toBe('A camera operator may not start timers; the producer or the host may.')
    expect(shootCommandForbiddenMessage('host', 'shoot.end')).toBe('The host may not end the shoot; the producer may.')
    expect(shootCommandForbiddenMessage('viewer', 'marker.add')).toBe('A viewer may not add markers; the producer, the host or a camera operator may.')
  })
})

describe('parseShootCommand', () => {
  const ok = (input: unknown) => {
    const r = parseShootCommand(input)
    if (!r.ok) throw new Error(r.error.message)
    return r.command
  }
  const bad = (input: unknown) => {
    const r = parseShootCommand(input)
    if (r.ok) throw new Error(`expected ${JSON.stringify(input)} to be refused`)
    expect(r.error.code).toBe('invalid')
    return r.error
  }
  const timer = (over: object) => ({ type: 'timer.start', label: 'Orzo', durationMs: 540_000, ...over })

  it('accepts one of every command', () => {
    const samples = [
      { type: 'shoot.start' }, { type: 'shoot.pause' }, { type: 'shoot.resume' }, { type: 'shoot.end', cancelTimers: true },
      { type: 'step.next' }, { type: 'step.previous' }, { type: 'step.jump', segment: 1, step: 2 },
      timer({ timerId: 'orzo-1', slot: 3, sound: 'wood-block', stepRef: { segment: 1, step: 0 } }),
      { type: 'timer.pause', timerId: 'a' }, { type: 'timer.resume', timerId: 'a' }, { type: 'timer.addTime', timerId: 'a', deltaMs: 60_000 },
      { type: 'timer.cancel', timerId: 'a' }, { type: 'timer.acknowledge', timerId: 'a' },
      { type: 'rolling.set', rolling: true }, { type: 'clock.speed', speed: 2.5 }, { type: 'marker.add', kind: 'pickup', text: 'from "two cups"' },
      { type: 'wait.start', stepId: '41' },
      { type: 'marker.edit', markerId: 'm-1', kind: 'good' }, { type: 'marker.delete', markerId: 'm-1' },
      { type: 'camera.set', name: 'Camera A', rate: '29.97df', start: '01:00:00;00' }, { type: 'camera.remove', cameraId: 'c-1' },
    ]
    expect(samples.map((s) => ok(s).type)).toEqual(SHOOT_COMMAND_TYPES)
  })
  it('trims labels and drops keys it does not know', () => {
    expect(ok(timer({ label: '  Orzo  ', colour: 'red' }))).toEqual({ type: 'timer.start', label: 'Orzo', durationMs: 540_000 })
  })
  it('label: 1 to 80 characters', () => {
    expect(ok(timer({ label: 'x'.repeat(80) })).type).toBe('timer.start')
    expect(bad(timer({ label: 'x'.repeat(81) }))).toEqual({ code: 'invalid', field: 'label', message: 'Timer name: write at most 80 characters' })
    expect(bad(timer({ label: '   ' })).message).toMatch(/^Timer name: name the timer/)
    expect(bad(timer({ label: 5 })).message).toBe('Timer name: name the timer (what is cooking)')
    expect(bad({ type: 'timer.start', durationMs: 1000 }).field).toBe('label')
  })
  it('durationMs: whole ms from 1 second to 24 hours', () => {
    expect(ok(timer({ durationMs: 1000 })).type).toBe('timer.start')
    expect(ok(timer({ durationMs: 86_400_000 })).type).toBe('timer.start')
    expect(bad(timer({ durationMs: 999 })).message).toBe('Timer length: a timer runs at least 1 second')
    expect(bad(timer({ durationMs: 86_400_001 })).message).toBe('Timer length: a timer runs at most 24 hours')
    expect(bad(timer({ durationMs: 1000.5 })).message).toBe('Timer length: set a whole number of milliseconds')
    expect(bad(timer({ durationMs: '9 min' })).field).toBe('durationMs')
    expect(bad(timer({ durationMs: Number.POSITIVE_INFINITY })).field).toBe('durationMs')
    expect(bad(timer({ durationMs: Number.NaN })).field).toBe('durationMs')
  })
  it('slot, sound, ids and stepRef', () => {
    expect(ok(timer({ slot: 7 })).type).toBe('timer.start')
    expect(bad(timer({ slot: 8 })).message).toBe('Timer place: choose a place from 0 (the first) to 7')
    expect(bad(timer({ slot: -1 })).field).toBe('slot')
    expect(bad(timer({ sound: 'Loud Bell!' })).field).toBe('sound')
    expect(bad(timer({ timerId: '' })).message).toMatch(/^Timer: write 1–64 letters/)
    expect(bad(timer({ timerId: 'a'.repeat(65) })).field).toBe('timerId')
    expect(bad(timer({ stepRef: { segment: 1, step: -1 } })).field).toBe('stepRef.step')
    expect(bad({ type: 'timer.cancel' }).field).toBe('timerId')
  })
  it('deltaMs: within ±2 hours, never 0', () => {
    const add = (deltaMs: unknown) => ({ type: 'timer.addTime', timerId: 'a', deltaMs })
    expect(ok(add(7_200_000)).type).toBe('timer.addTime')
    expect(ok(add(-7_200_000)).type).toBe('timer.addTime')
    expect(bad(add(7_200_001)).message).toBe('Time to add: add at most 2 hours at a time')
    expect(bad(add(-7_200_001)).message).toBe('Time to add: take off at most 2 hours at a time')
    expect(bad(add(0)).message).toMatch(/^Time to add: add or take off some time/)
  })
  it('speed: 1× to 32× (a 70-minute episode rehearses in about 2 minutes)', () => {
    const speed = (s: unknown) => ({ type: 'clock.speed', speed: s })
    expect(ok(speed(1)).type).toBe('clock.speed')
    expect(ok(speed(32)).type).toBe('clock.speed')
    expect(bad(speed(0.5)).message).toBe('Clock speed: at least 1× (real time)')
    expect(bad(speed(32.01)).message).toBe('Clock speed: at most 32×')
    expect(bad(speed('fast')).message).toBe('Clock speed: choose a speed from 1× (real time) to 32×')
  })
  it('jump and rolling', () => {
    expect(bad({ type: 'step.jump', segment: 1.5, step: 0 }).message).toBe('Recipe in the run order: write a whole number from 0 (the first) to 9999')
    expect(bad({ type: 'step.jump', segment: 1 }).field).toBe('step')
    expect(bad({ type: 'rolling.set', rolling: 'yes' }).message).toBe('Camera rolling: choose rolling (true) or not (false)')
  })
  it('markers: a known kind, text up to 200 characters, and a note needs its text', () => {
    const marker = (over: object) => ({ type: 'marker.add', kind: 'note', text: 'more steam', ...over })
    expect(ok(marker({ text: 'x'.repeat(200) })).type).toBe('marker.add')
    expect(bad(marker({ text: 'x'.repeat(201) })).message).toBe('Text: write at most 200 characters')
    expect(bad(marker({ kind: 'blooper' })).message).toBe('Kind of marker: choose one of: good, flub, pickup, note')
    expect(bad(marker({ text: undefined }))).toMatchObject({ field: 'text', message: 'Text: write what the note says' })
    expect(bad(marker({ text: '   ' })).field).toBe('text')
    expect(ok({ type: 'marker.add', kind: 'good' }).type).toBe('marker.add')
  })
  it('names unknown and missing types, and non-objects', () => {
    const unknown = bad({ type: 'shoot.explode' })
    expect(unknown.field).toBe('type')
    // The command names are the wire's words: the message is the person's, and never echoes them.
    expect(unknown.message).toBe('This screen sent a command Hobline does not know; reload the page to get the current controls.')
    expect(bad({}).message).toMatch(/^This screen sent a command with no name/)
    expect(bad(42).field).toBe('command')
    expect(bad(42).message).toMatch(/^This screen sent a command Hobline cannot read/)
    expect(bad(null).field).toBe('command')
  })
  it('the schema is the one the server can use directly', () => {
    expect(shootCommandSchema.safeParse({ type: 'step.next' }).success).toBe(true)
    expect(shootCommandSchema.safeParse({ type: 'step.nest' }).success).toBe(false)
  })
})
