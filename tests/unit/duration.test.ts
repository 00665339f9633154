// ISO 8601 durations (shared/utils/duration.ts), as schema.org Recipe uses them for prepTime,
// cookTime, totalTime and HowToDirection.performTime.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { DurationFormatError, durationRangeText, durationText, parseIsoDuration, toIsoDuration } from '../../shared/utils/duration'

describe('parseIsoDuration (ISO 8601-1:2019, 5.5.2 duration)', () => {
  it('reads the forms schema.org examples use: PT20M, PT1H30M, P0DT45M', () => {
    expect(parseIsoDuration('PT20M')).toBe(1200)
    expect(parseIsoDuration('PT1H30M')).toBe(5400)
    expect(parseIsoDuration('P0DT45M')).toBe(2700)
  })
  it('reads days as 24 h and weeks as 7 days', () => {
    expect(parseIsoDuration('P1DT2H')).toBe(93600)
    expect(parseIsoDuration('P1W')).toBe(604800)
  })
  it('reads a decimal fraction (point or comma) on the lowest-order component', () => {
    expect(parseIsoDuration('PT0.5S')).toBe(0.5)
    expect(parseIsoDuration('PT1,5H')).toBe(5400)
    expect(parseIsoDuration('PT2M30.25S')).toBe(150.25)
  })
  it('accepts zero years and months, as some exporters write them (P0Y0M0DT0H35M)', () => {
    expect(parseIsoDuration('P0Y0M0DT0H35M0S')).toBe(2100)
  })
  it('tolerates surrounding space and lower case', () => {
    expect(parseIsoDuration(' pt15m ')).toBe(900)
  })
  it('refuses garbage with a message that shows the right form', () => {
    for (const bad of ['', 'P', 'PT', '20 minutes', '1H30M', 'PT1H2H', 'P1DT', 'PTM', 'PT-5M', 'PT1.5H30M']) {
      expect(() => parseIsoDuration(bad), bad).toThrow(DurationFormatError)
    }
    expect(() => parseIsoDuration('20 minutes')).toThrow(/not an ISO 8601 duration such as PT20M/)
    expect(() => parseIsoDuration('1H30M')).toThrow(/must start with "P"/)
    expect(() => parseIsoDuration('-PT5M')).toThrow(/negative/)
    expect(() => parseIsoDuration('PT1.5H30M')).toThrow(/only the last component/)
    expect(() => parseIsoDuration(42 as unknown as string)).toThrow(/must be text/)
  })
  it('refuses non-zero years and months, which have no fixed length', () => {
    expect(() => parseIsoDuration('P1M')).toThrow(/years and months have no fixed length/)
    expect(() => parseIsoDuration('P1Y')).toThrow(/years and months/)
    // "M" after "T" is minutes, not months
    expect(parseIsoDuration('PT1M')).toBe(60)
  })
})

describe('toIsoDuration', () => {
  it('writes the shortest ISO 8601 form', () => {
    expect(toIsoDuration(5400)).toBe('PT1H30M')
    expect(toIsoDuration(1200)).toBe('PT20M')
    expect(toIsoDuration(0)).toBe('PT0S')
    expect(toIsoDuration(0.5)).toBe('PT0.5S')
    expect(toIsoDuration(90000)).toBe('P1DT1H')
    expect(toIsoDuration(86400)).toBe('P1D')
    expect(toIsoDuration(3661)).toBe('PT1H1M1S')
  })
  it('refuses negative and non-finite input', () => {
    expect(() => toIsoDuration(-1)).toThrow(/zero or more seconds/)
    expect(() => toIsoDuration(Number.NaN)).toThrow(DurationFormatError)
  })
  it('round-trips any millisecond-resolution duration (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 30 * 86_400_000 }), (ms) => {
        expect(parseIsoDuration(toIsoDuration(ms / 1000))).toBeCloseTo(ms / 1000, 9)
      }),
    )
  })
  it('parse → write → parse is stable for generated ISO strings (property)', () => {
    const iso = fc
      .record({ d: fc.nat(9), h: fc.nat(23), m: fc.nat(59), s: fc.nat(59) })
      .map(({ d, h, m, s }) => `P${d}DT${h}H${m}M${s}S`)
    fc.assert(
      fc.property(iso, (text) => {
        const secs = parseIsoDuration(text)
        expect(parseIsoDuration(toIsoDuration(secs))).toBe(secs)
      }),
    )
  })
})

describe('duration text for screens (common practice: h, min, s)', () => {
  it('speaks hours, minutes and seconds', () => {
    expect(durationText(45)).toBe('45 s')
    expect(durationText(150)).toBe('2 min 30 s')
    expect(durationText(5400)).toBe('1 h 30 min')
    expect(durationText(0)).toBe('0 s')
  })
  it('shows a range compactly', () => {
    expect(durationRangeText(480, 600)).toBe('8–10 min')
    expect(durationRangeText(300, 300)).toBe('5 min')
    expect(durationRangeText(null, 90)).toBe('1 min 30 s')
    expect(durationRangeText(3000, 4200)).toBe('50 min – 1 h 10 min')
    expect(durationRangeText(null, null)).toBe('')
  })
})
