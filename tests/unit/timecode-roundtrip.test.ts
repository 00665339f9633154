// Round trips and start offsets of SMPTE ST 12-1 timecode (shared/utils/timecode.ts), by property
// test over every rate Hobline offers, drop-frame and non-drop. The independent reference for labels
// is FFmpeg's libavutil/timecode.c, ported line by line from its two functions
// av_timecode_adjust_ntsc_framenum2() and av_timecode_make_string() in tests/support/ffmpeg-timecode.ts.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { ROUNDED_FPS as ROUNDED, avTimecodeMakeString } from '../support/ffmpeg-timecode'
import {
  TIMECODE_RATES, defaultStartTimecode, framesToMs, framesToTimecode, msToFrames, parseTimecodeRate, timecodeAfter,
  timecodeFramesPerDay, timecodeRateName, timecodeRateText, timecodeToFrames, type TimecodeRate,
} from '../../shared/utils/timecode'

/** Every rate a camera can be set to: each fps, and drop-frame where SMPTE ST 12-1 has it (29.97, 59.94). */
const EVERY_RATE = TIMECODE_RATES
it('offers every rate of the issue: 23.976, 24, 25, 29.97 DF and NDF, 30, 50, 59.94 DF and NDF, 60', () => {
  expect(EVERY_RATE.map(timecodeRateText)).toEqual(['23.976', '24', '25', '29.97', '29.97df', '30', '50', '59.94', '59.94df', '60'])
})

const name = (rate: TimecodeRate) => timecodeRateName(rate)

describe('the reference port itself, on the worked values of SMPTE ST 12-1 drop-frame', () => {
  // 29.97 DF: labels ;00 and ;01 skipped at each minute not divisible by 10; 59.94 DF: ;00–;03.
  it.each([
    [1800, 30, '00:01:00;02'], [17_982, 30, '00:10:00;00'], [1799, 30, '00:00:59;29'], [107_892, 30, '01:00:00;00'],
    [3600, 60, '00:01:00;04'], [35_964, 60, '00:10:00;00'],
  ])('frame %i at %i labels a second is %s', (frame, fps, label) => {
    expect(avTimecodeMakeString(frame, fps, true)).toBe(label)
    expect(framesToTimecode(frame, { fps: fps === 30 ? 29.97 : 59.94, drop: true })).toBe(label)
  })
})

for (const rate of EVERY_RATE) describe(`round trips at ${timecodeRateName(rate)}`, () => {
  const day = timecodeFramesPerDay(rate)
  it(`${'framesToMs → msToFrames'} gives the frame back, for any frame over ten days`, () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 10 * day }), (frames) => {
      expect(msToFrames(framesToMs(frames, rate), rate)).toBe(frames)
    }), { numRuns: 2000 })
  })
  it('msToFrames → framesToMs lands at or before the time, within one frame', () => {
    // The frame shown at a time started at that time or less than one frame period before it; an
    // instant within a millionth of a frame of the next frame's start counts as that frame (a start
    // time from framesToMs is a rounded binary fraction at 29.97 and 59.94).
    const period = framesToMs(1, rate)
    fc.assert(fc.property(fc.double({ min: 0, max: 864_000_000, noNaN: true }), (ms) => {
      const start = framesToMs(msToFrames(ms, rate), rate)
      expect(start).toBeLessThanOrEqual(ms + period * 1e-6)
      expect(ms - start).toBeLessThan(period)
    }), { numRuns: 2000 })
  })
  it('timecodeToFrames ∘ framesToTimecode is the identity over a day, and labels match FFmpeg', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: day - 1 }), (frames) => {
      const label = framesToTimecode(frames, rate)
      expect(timecodeToFrames(label, rate)).toBe(frames)
      expect(label).toBe(avTimecodeMakeString(frames, ROUNDED[rate.fps]!, !!rate.drop))
    }), { numRuns: 2000 })
  })
  it('with a start timecode, the label after a recording time is FFmpeg\'s label with that start', () => {
    const start = defaultStartTimecode(rate)
    const startFrames = timecodeToFrames(start, rate)
    fc.assert(fc.property(fc.integer({ min: 0, max: 12 * 3600_000 }), (ms) => {
      expect(timecodeAfter(start, ms, rate)).toBe(avTimecodeMakeString(msToFrames(ms, rate), ROUNDED[rate.fps]!, !!rate.drop, startFrames))
    }), { numRuns: 1000 })
  })
  it(`names itself the way ?rate= reads it (${name(rate)})`, () => {
    expect(parseTimecodeRate(timecodeRateText(rate))).toEqual({ fps: rate.fps, drop: !!rate.drop })
  })
})

describe('start offsets, worked by hand', () => {
  it('a camera starting at 01:00:00:00 at 25 fps: 12.345 s of recording is frame 308, 01:00:12:08', () => {
    // 12.345 s × 25 = 308.625 → frame 308 on screen; 308 = 12 s × 25 + 8.
    expect(timecodeAfter('01:00:00:00', 12_345, { fps: 25 })).toBe('01:00:12:08')
  })
  it('29.97 drop-frame from 01:00:00;00: one minute of real time is 1798 frames, 01:00:59;28', () => {
    // 60 s × 30000/1001 = 1798.2 → frame 1798 = 59 s × 30 + 28 (minute 60 is divisible by 10: no labels skipped).
    expect(timecodeAfter('01:00:00;00', 60_000, { fps: 29.97, drop: true })).toBe('01:00:59;28')
    // 61 s → 1828.17 → frame 1828: frame 1800 is 01:01:00;02 (;00 and ;01 skipped), 28 frames later
    // is label 30 of the minute, 01:01:01;00.
    expect(timecodeAfter('01:00:00;00', 61_000, { fps: 29.97, drop: true })).toBe('01:01:01;00')
  })
  it('ten minutes of 29.97 drop-frame keep to the wall clock: 600.6 s after 01:00:00;00 is 01:10:00;00', () => {
    // 17982 frames × 1001/30000 s = 600.0 s; drop-frame exists so that this lands on 01:10:00;00.
    expect(timecodeAfter('01:00:00;00', framesToMs(17_982, { fps: 29.97 }), { fps: 29.97, drop: true })).toBe('01:10:00;00')
  })
  it('59.94 drop-frame: 1 s of recording from 01:00:00;00 is frame 59, 01:00:00;59', () => {
    // 1 s × 60000/1001 = 59.94 → frame 59.
    expect(timecodeAfter('01:00:00;00', 1000, { fps: 59.94, drop: true })).toBe('01:00:00;59')
  })
  it('23.976 from 10:00:00:00: 1 h of real time is 86 313 frames (3600 × 24000/1001 = 86 313.69), 10:59:56:09', () => {
    // 86313 = 3596 s × 24 + 9 → 00:59:56:09 after the start.
    expect(timecodeAfter('10:00:00:00', 3600_000, { fps: 23.976 })).toBe('10:59:56:09')
  })
  it('wraps past midnight like a camera: 23:59:59:24 + 40 ms at 25 fps is 00:00:00:00', () => {
    expect(timecodeAfter('23:59:59:24', 40, { fps: 25 })).toBe('00:00:00:00')
  })
  it('refuses a start that does not exist at the rate, saying what to write', () => {
    expect(() => timecodeAfter('01:01:00;00', 0, { fps: 29.97, drop: true })).toThrow(/01:01:00;02/)
    expect(() => timecodeAfter('01:00:00:00', 0, { fps: 29.97, drop: true })).toThrow(/separates the frames with ';'/)
  })
})
