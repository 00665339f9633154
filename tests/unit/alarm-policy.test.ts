// What a screen does for a due timer (shared/utils/alarm-policy.ts). These are product rules
// (DESIGN.md: "While the camera is rolling, alarms on the host's device turn to visual only";
// "Alarms never fire silently … visual-only mode still flashes the whole screen on every device"),
// not facts with an outside source; each check says which rule it holds.
import { describe, expect, it } from 'vitest'
import type { ShootTimer } from '../../shared/types/shoot'
import { ALARM_REPEAT_MS, alarmOutput, audibleElsewhere, dueTimersAt } from '../../shared/utils/alarm-policy'
import { timerAlarmRound } from '../../shared/utils/shoot-timers'

const T0 = 1_760_000_000_000
const CREW = ['producer', 'host', 'camera'] as const
const ROLES = [...CREW, 'viewer'] as const
const bools = [false, true]

function timer(over: Partial<ShootTimer>): ShootTimer {
  return {
    id: 'pasta', slot: 0, label: 'Pasta', sound: null,
    stepRef: { segment: 0, step: 0, segmentId: 'pasta', stepId: 'boil' },
    durationMs: 60_000, deadlineServerMs: T0, remainingMs: null, speed: 1, state: 'running', heldByShoot: false,
    startedAtServerMs: T0 - 60_000, startedBy: { role: 'host', id: 'user:2' }, dueAtServerMs: null,
    acknowledgedBy: null, acknowledgedAtServerMs: null, cancelledAtServerMs: null, ...over,
  }
}

describe('alarm output off camera (product rule (DESIGN.md))', () => {
  it('rings and flashes on every crew screen, whatever the settings', () => {
    for (const role of CREW) for (const a of bools) for (const e of bools) {
      expect(alarmOutput({ role, rolling: false, audibleWhileRolling: a, audibleElsewhere: e })).toMatchObject({ sound: true, flash: true })
    }
  })
  it('flashes a viewer’s screen and keeps it quiet', () => {
    for (const rolling of bools) {
      const out = alarmOutput({ role: 'viewer', rolling, audibleWhileRolling: true, audibleElsewhere: false })
      expect(out).toMatchObject({ sound: false, flash: true })
      expect(out.reason).toMatch(/viewer/)
    }
  })
  it('does nothing on a screen that is not on the shoot', () => {
    expect(alarmOutput({ role: null, rolling: false, audibleWhileRolling: true, audibleElsewhere: true })).toMatchObject({ sound: false, flash: false })
    expect(alarmOutput({ role: 'guest', rolling: true, audibleWhileRolling: true, audibleElsewhere: false })).toMatchObject({ sound: false, flash: false })
  })
})

describe('alarm output while rolling: quiet on set (product rule (DESIGN.md))', () => {
  it('turns the host’s screen to flash only when another screen rings', () => {
    const out = alarmOutput({ role: 'host', rolling: true, audibleWhileRolling: false, audibleElsewhere: true })
    expect(out).toMatchObject({ sound: false, flash: true })
    expect(out.reason).toMatch(/^Quiet on set/)
  })
  it('rings on a screen set to ring while rolling (the producer’s desk, an earpiece)', () => {
    for (const role of CREW) for (const e of bools) {
      expect(alarmOutput({ role, rolling: true, audibleWhileRolling: true, audibleElsewhere: e })).toMatchObject({ sound: true, flash: true })
    }
  })
  it('keeps the producer’s and the camera’s screens quiet when they are not set to ring', () => {
    for (const role of ['producer', 'camera']) {
      expect(alarmOutput({ role, rolling: true, audibleWhileRolling: false, audibleElsewhere: true })).toMatchObject({ sound: false, flash: true })
      expect(alarmOutput({ role, rolling: true, audibleWhileRolling: false, audibleElsewhere: false })).toMatchObject({ sound: false, flash: true })
    }
  })
  it('rings the host’s screen anyway when no screen on set rings while rolling, and says why', () => {
    expect(alarmOutput({ role: 'host', rolling: true, audibleWhileRolling: false, audibleElsewhere: false })).toEqual({
      sound: true, flash: true, reason: 'No device on set is set to ring while rolling, so this one rings.',
    })
  })
  it('with no host on set, moves that fall-back ring to the crew screens that are left', () => {
    for (const role of ['producer', 'camera']) {
      const output = alarmOutput({ role, rolling: true, audibleWhileRolling: false, audibleElsewhere: false, hostOnSet: false })
      expect(output).toMatchObject({ sound: true, flash: true })
      expect(alarmOutput({ role, rolling: true, audibleWhileRolling: false, audibleElsewhere: true, hostOnSet: false })).toMatchObject({ sound: false })
    }
  })
  it('flashes every screen on the shoot, in every case', () => {
    for (const role of ROLES) for (const rolling of bools) for (const a of bools) for (const e of bools) for (const h of bools) {
      expect(alarmOutput({ role, rolling, audibleWhileRolling: a, audibleElsewhere: e, hostOnSet: h }).flash).toBe(true)
    }
  })
})

describe('nothing due is ever silent everywhere (product rule (DESIGN.md))', () => {
  // Every set of crew screens (with or without a host), every setting on each, rolling: at least
  // one screen rings when each screen is told truthfully whether another one rings.
  const screensets = [['host'], ['host', 'camera'], ['producer', 'host', 'camera'], ['producer'], ['camera'], ['producer', 'camera'], ['camera', 'camera']]
  for (const roles of screensets) {
    it(`rings somewhere on a set of ${roles.join(' + ')}`, () => {
      for (let mask = 0; mask < 2 ** roles.length; mask++) {
        const screens = roles.map((role, i) => ({ role, audibleWhileRolling: (mask & (1 << i)) !== 0 }))
        const presence = { screens }
        const rings = screens.map((self) => alarmOutput({
          role: self.role, rolling: true, audibleWhileRolling: self.audibleWhileRolling,
          audibleElsewhere: audibleElsewhere(presence, self), hostOnSet: roles.includes('host'),
        }).sound)
        expect(rings.some(Boolean), JSON.stringify(screens)).toBe(true)
        // Quiet on set still holds: a host among ringing screens stays quiet.
        if (roles.includes('host') && screens.some((s) => s.audibleWhileRolling)) expect(rings[roles.indexOf('host')]).toBe(screens[roles.indexOf('host')]!.audibleWhileRolling)
      }
    })
  }
})

describe('audibleElsewhere from the screens on the shoot', () => {
  it('counts other crew screens that ring while rolling, not this one and not viewers', () => {
    const presence = { screens: [{ role: 'producer', audibleWhileRolling: true }, { role: 'host', audibleWhileRolling: false }, { role: 'viewer', audibleWhileRolling: true }] }
    expect(audibleElsewhere(presence, { role: 'host', audibleWhileRolling: false })).toBe(true)
    expect(audibleElsewhere(presence, { role: 'producer', audibleWhileRolling: true })).toBe(false)
    expect(audibleElsewhere({ screens: [] }, { role: 'host', audibleWhileRolling: false })).toBe(false)
  })
})

describe('due timers and their repeats', () => {
  it('repeats every few seconds (product rule (DESIGN.md): repeating until acknowledged)', () => {
    expect(ALARM_REPEAT_MS).toBeGreaterThanOrEqual(2000)
    expect(ALARM_REPEAT_MS).toBeLessThanOrEqual(5000)
  })
  it('takes the server’s due timers and running ones past their deadline, due at the deadline, by slot', () => {
    const timers = [
      timer({ id: 'b', slot: 3, state: 'due', dueAtServerMs: T0 - 500, deadlineServerMs: T0 - 500 }),
      timer({ id: 'a', slot: 1, deadlineServerMs: T0 - 200 }),
      timer({ id: 'c', slot: 0, deadlineServerMs: T0 + 1 }),
      timer({ id: 'd', slot: 2, state: 'paused', deadlineServerMs: null, remainingMs: 5000 }),
      timer({ id: 'e', slot: 4, state: 'acknowledged', dueAtServerMs: T0 - 9000 }),
    ]
    const due = dueTimersAt(timers, T0)
    expect(due.map((t) => [t.id, t.state, t.dueAtServerMs])).toEqual([['a', 'due', T0 - 200], ['b', 'due', T0 - 500]])
    // Every screen reads the same round from the server time (shoot-timers.ts timerAlarmRound).
    expect(due.map((t) => timerAlarmRound(t, T0 + ALARM_REPEAT_MS, ALARM_REPEAT_MS))).toEqual([1, 1])
    expect(timerAlarmRound(due[0]!, T0 + ALARM_REPEAT_MS - 201, ALARM_REPEAT_MS)).toBe(0)
  })
})
