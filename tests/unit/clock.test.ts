// Clock sync maths (shared/utils/clock.ts) against RFC 5905, "Network Time Protocol Version 4".
// The worked values are built here from the RFC's formulas with explicit numbers: a true offset
// and one-way network times are chosen, the four timestamps follow from them, and the expected
// θ and δ are worked out by hand beside each check.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  clockFilterAdd, clockFilterBest, countdownMs, ntpSample, serverNow, type ClockSample,
} from '../../shared/utils/clock'

/** The four timestamps of a ping when the server clock = local clock + trueOffset. */
function ping(t1: number, trueOffset: number, up: number, serverBusy: number, down: number) {
  const t2 = t1 + up + trueOffset
  const t3 = t2 + serverBusy
  const t4 = t1 + up + serverBusy + down
  return [t1, t2, t3, t4] as const
}

describe('ntpSample: RFC 5905 §8, θ = ½[(T2 − T1) + (T3 − T4)], δ = (T4 − T1) − (T3 − T2)', () => {
  it('works the formulas on plain numbers', () => {
    // RFC 5905 §8: T1 = 100, T2 = 160, T3 = 170, T4 = 130 →
    // θ = ½[(160 − 100) + (170 − 130)] = ½[60 + 40] = 50; δ = (130 − 100) − (170 − 160) = 30 − 10 = 20.
    expect(ntpSample(100, 160, 170, 130)).toEqual({ offset: 50, delay: 20 })
  })

  it('finds a client clock 10 minutes slow, exactly, when the paths are symmetric', () => {
    // Client clock 600 000 ms behind the server; 25 ms each way; the server takes 3 ms.
    // T1 = 1 000 000, T2 = 1 000 000 + 25 + 600 000 = 1 600 025, T3 = 1 600 028, T4 = 1 000 053.
    // θ = ½[(1 600 025 − 1 000 000) + (1 600 028 − 1 000 053)] = ½[600 025 + 599 975] = 600 000.
    // δ = (1 000 053 − 1 000 000) − (1 600 028 − 1 600 025) = 53 − 3 = 50.
    const [t1, t2, t3, t4] = ping(1_000_000, 600_000, 25, 3, 25)
    expect([t1, t2, t3, t4]).toEqual([1_000_000, 1_600_025, 1_600_028, 1_000_053])
    expect(ntpSample(t1, t2, t3, t4)).toEqual({ offset: 600_000, delay: 50 })
  })

  it('finds a client clock 10 minutes fast (negative offset)', () => {
    // Server = client − 600 000; 10 ms each way, server 0 ms:
    // T1 = 5 000 000, T2 = 4 400 010, T3 = 4 400 010, T4 = 5 000 020 →
    // θ = ½[(−599 990) + (−600 010)] = −600 000; δ = 20 − 0 = 20.
    expect(ntpSample(5_000_000, 4_400_010, 4_400_010, 5_000_020)).toEqual({ offset: -600_000, delay: 20 })
  })

  it('is off by half the path asymmetry on asymmetric paths, within ±δ/2 as RFC 5905 §8 notes', () => {
    // Client 10 min slow; 40 ms up, 5 ms at the server, 60 ms down:
    // T1 = 1 000 000, T2 = 1 600 040, T3 = 1 600 045, T4 = 1 000 105.
    // θ = ½[600 040 + 599 940] = 599 990, i.e. the true 600 000 + (40 − 60)/2; δ = 105 − 5 = 100.
    const [t1, t2, t3, t4] = ping(1_000_000, 600_000, 40, 5, 60)
    expect([t2, t3, t4]).toEqual([1_600_040, 1_600_045, 1_000_105])
    const s = ntpSample(t1, t2, t3, t4)
    expect(s).toEqual({ offset: 599_990, delay: 100 })
    expect(Math.abs(s.offset - 600_000)).toBeLessThanOrEqual(s.delay / 2)
  })

  it('gives the true offset ± δ/2 and δ = up + down for any timestamps (RFC 5905 §8, property)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 0, max: 2 ** 40 }), fc.integer({ min: -86_400_000, max: 86_400_000 }),
      fc.integer({ min: 0, max: 5_000 }), fc.integer({ min: 0, max: 500 }), fc.integer({ min: 0, max: 5_000 }),
      (t1, trueOffset, up, busy, down) => {
        const s = ntpSample(...ping(t1, trueOffset, up, busy, down))
        expect(s.delay).toBe(up + down)
        expect(s.offset - trueOffset).toBe((up - down) / 2)
        expect(Math.abs(s.offset - trueOffset)).toBeLessThanOrEqual(s.delay / 2)
      },
    ))
  })

  it('refuses timestamps that cannot come from one ping, saying which', () => {
    expect(() => ntpSample(100, 160, 150, 130)).toThrow(/t3 .* before t2/)
    expect(() => ntpSample(100, 160, 170, 90)).toThrow(/t4 .* before t1/)
    expect(() => ntpSample(Number.NaN, 160, 170, 190)).toThrow(/t1 must be a finite/)
  })
})

describe('clock filter: RFC 5905 §10, keep the last samples and trust the lowest delay', () => {
  it('picks the minimum-delay sample of the window', () => {
    // Four pings from a client 10 min slow; the 3rd is the quickest (12 ms), so its offset wins.
    const samples = [
      ntpSample(...ping(0, 600_000, 80, 2, 20)), //  θ = 600 030, δ = 100
      ntpSample(...ping(1000, 600_000, 15, 2, 45)), // θ = 599 985, δ = 60
      ntpSample(...ping(2000, 600_000, 7, 2, 5)), //   θ = 600 001, δ = 12
      ntpSample(...ping(3000, 600_000, 30, 2, 10)), // θ = 600 010, δ = 40
    ]
    expect(samples.map((s) => [s.offset, s.delay])).toEqual([[600_030, 100], [599_985, 60], [600_001, 12], [600_010, 40]])
    let window: ClockSample[] = []
    for (const s of samples) window = clockFilterAdd(window, s)
    expect(clockFilterBest(window)).toEqual({ offset: 600_001, delay: 12 })
  })

  it('forgets samples older than the window (8 by default, as in RFC 5905 §10)', () => {
    let window: ClockSample[] = [{ offset: 1, delay: 1 }]
    for (let i = 0; i < 8; i++) window = clockFilterAdd(window, { offset: 100 + i, delay: 50 + i })
    expect(window).toHaveLength(8)
    // The 1 ms sample has left the window; the best left is the 50 ms one.
    expect(clockFilterBest(window)).toEqual({ offset: 100, delay: 50 })
    expect(clockFilterAdd(window, { offset: 0, delay: 1 }, 3)).toHaveLength(3)
  })

  it('prefers the newest sample on equal delay and skips unusable samples', () => {
    const window = [{ offset: 10, delay: 20 }, { offset: 11, delay: 20 }]
    expect(clockFilterBest(window)).toEqual({ offset: 11, delay: 20 })
    expect(clockFilterAdd(window, { offset: 0, delay: -5 })).toEqual(window)
    expect(clockFilterAdd(window, { offset: Number.NaN, delay: 1 })).toEqual(window)
    expect(clockFilterBest([])).toBeNull()
    expect(() => clockFilterAdd([], { offset: 0, delay: 1 }, 0)).toThrow(/at least 1/)
  })
})

describe('countdowns drawn from the server deadline', () => {
  it('shows the same remaining time on a screen whose clock is 10 minutes off', () => {
    // A timer due at server time 1 700 000 000 000 + 90 000; the server now reads 1 700 000 000 000.
    const serverMs = 1_700_000_000_000
    const deadline = serverMs + 90_000
    const honest = countdownMs(deadline, serverMs, 0)
    const slowScreen = countdownMs(deadline, serverMs - 600_000, 600_000)
    const fastScreen = countdownMs(deadline, serverMs + 600_000, -600_000)
    expect([honest, slowScreen, fastScreen]).toEqual([90_000, 90_000, 90_000])
    expect(serverNow(serverMs - 600_000, 600_000)).toBe(serverMs)
    // Once the deadline passes the countdown goes negative (overdue), it does not stop at 0.
    expect(countdownMs(deadline, serverMs + 95_000, 0)).toBe(-5_000)
  })
})
