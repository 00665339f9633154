// A step of the machine's wall clock (an NTP correction) against the server's own timekeeping: the
// shoot's server clock (shared/utils/steady-clock.ts) and a socket's command bucket
// (server/utils/socket-session.ts). Both are driven here by hand-set clocks.
import { describe, expect, it } from 'vitest'
import { steadyClock } from '../../shared/utils/steady-clock'
import { createCommandBucket } from '../../server/utils/socket-session'

const T0 = 1_760_000_000_000

describe('steadyClock', () => {
  it('reads the wall clock at the start and moves on with the monotonic clock only', () => {
    let wall = T0
    let mono = 5_000.25
    const now = steadyClock(() => wall, () => mono)
    expect(now()).toBe(T0)
    mono += 1_500.5
    wall += 1_500
    expect(now()).toBe(T0 + 1_500)
    // The wall clock steps a minute forward, then two back: the steady clock does not follow.
    wall += 60_000
    mono += 250
    expect(now()).toBe(T0 + 1_750)
    wall -= 120_000
    mono += 250
    expect(now()).toBe(T0 + 2_000)
  })

  it('keeps a deadline\'s real duration across a step (a 10-minute timer rings after 10 real minutes)', () => {
    let wall = T0
    let mono = 0
    const now = steadyClock(() => wall, () => mono)
    const deadline = now() + 10 * 60_000
    wall += 60_000 // NTP steps the wall clock a minute forward at once
    mono += 9 * 60_000
    expect(deadline - now()).toBe(60_000)
    mono += 60_000
    expect(deadline - now()).toBe(0)
  })

  it('gives whole milliseconds that never run backwards', () => {
    let mono = 0.9
    const now = steadyClock(() => T0, () => mono)
    const seen = [now()]
    for (const m of [1.1, 1.9, 2.0, 2.7, 1000.49]) {
      mono = m
      seen.push(now())
    }
    expect(seen).toEqual([T0, T0, T0 + 1, T0 + 1, T0 + 1, T0 + 999])
    for (const v of seen) expect(Number.isInteger(v)).toBe(true)
  })
})

describe('a screen\'s command bucket when its clock goes back', () => {
  it('takes no tokens away: a clock stepped back a minute does not lock the screen out', () => {
    const bucket = createCommandBucket({ perSecond: 20, burst: 40 })
    for (let i = 0; i < 30; i++) expect(bucket.take(T0)).toBeNull()
    // 60 s back: before the fix this left 10 − 1200 tokens, a minute of refusals.
    expect(bucket.take(T0 - 60_000)).toBeNull()
    for (let i = 0; i < 9; i++) expect(bucket.take(T0 - 60_000)).toBeNull()
    expect(bucket.take(T0 - 60_000)).toMatchObject({ ok: false, error: { code: 'too-many' } })
    // Time moves on from the new reading: 20 a second again.
    expect(bucket.take(T0 - 60_000 + 1000)).toBeNull()
  })
})
