// Clock text: minutes and seconds as kitchen timers and video editors write them (common practice:
// m:ss under an hour, h:mm:ss from an hour, seconds always two digits).
import { describe, expect, it } from 'vitest'
import { clockText, clockTextMs, readClockText } from '../../shared/utils/clock-text'

describe('clockText', () => {
  it('writes m:ss under an hour and h:mm:ss from an hour', () => {
    expect(clockText(0)).toBe('0:00')
    expect(clockText(65)).toBe('1:05')
    expect(clockText(3599)).toBe('59:59')
    expect(clockText(3600)).toBe('1:00:00')
    expect(clockText(3 * 3600 + 2 * 60 + 9)).toBe('3:02:09')
  })
  it('keeps minutes past sixty when asked to (the plan timeline)', () => {
    expect(clockText(75 * 60 + 5, { hours: false })).toBe('75:05')
  })
  it('counts negative time as zero', () => {
    expect(clockText(-5)).toBe('0:00')
  })
})

describe('clockTextMs', () => {
  it('rounds a countdown up, elapsed time down and a planned figure to the nearest second', () => {
    expect(clockTextMs(1)).toBe('0:01')
    expect(clockTextMs(59_001)).toBe('1:00')
    expect(clockTextMs(59_999, 'down')).toBe('0:59')
    expect(clockTextMs(59_500, 'nearest')).toBe('1:00')
    expect(clockTextMs(59_499, 'nearest')).toBe('0:59')
  })
})

describe('readClockText: a time as a cook types it', () => {
  // Kitchen-timer convention (common practice): a bare number is minutes, "m:ss" minutes and seconds.
  it('reads minutes, decimal minutes and clocks', () => {
    expect(readClockText('12')).toBe(720)
    expect(readClockText('0.5')).toBe(30)
    expect(readClockText('7,5')).toBe(450)
    expect(readClockText('12:30')).toBe(750)
    expect(readClockText('0:01')).toBe(1)
    expect(readClockText('1:02:09')).toBe(3729)
    // clockText writes what readClockText reads back.
    for (const s of [1, 59, 60, 754, 3599, 3729, 86_400]) expect(readClockText(clockText(s))).toBe(s)
  })

  it('refuses what is not a time', () => {
    for (const t of ['', 'ten', '12:60', '1:2', '-3', '12:30:75', '5 min']) expect(readClockText(t)).toBeNull()
  })
})
