// SMPTE ST 12-1 timecode (shared/utils/timecode.ts). Worked values are derived below from the
// drop-frame rule of SMPTE ST 12-1 (29.97 fps: labels 00 and 01 skipped at the start of every
// minute except minutes divisible by 10; 59.94 fps: 00–03), and every label is compared with an
// independent oracle: FFmpeg's libavutil/timecode.c (av_timecode_adjust_ntsc_framenum2 and
// av_timecode_make_string), ported in tests/support/ffmpeg-timecode.ts.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  TIMECODE_FPS, framesToMs, framesToTimecode, msToFrames, parseTimecodeRate, timecodeFramesPerDay, timecodeToFrames,
  type TimecodeRate,
} from '../../shared/utils/timecode'
import { ROUNDED_FPS, avTimecodeMakeString } from '../support/ffmpeg-timecode'

const DF2997: TimecodeRate = { fps: 29.97, drop: true }
const DF5994: TimecodeRate = { fps: 59.94, drop: true }

// FFmpeg's av_timecode_make_string with AV_TIMECODE_FLAG_24HOURSMAX, ported in tests/support/ffmpeg-timecode.ts;
// `fps` is the rounded rate (30 for 29.97).
const ffmpegMakeString = (framenum: number, fps: number, drop: boolean) => avTimecodeMakeString(framenum, fps, drop)
const ROUNDED = ROUNDED_FPS

describe('29.97 fps drop-frame, worked values from the SMPTE ST 12-1 rule', () => {
  it('keeps every label through the first minute: 1799 frames = 00:00:59;29', () => {
    // Minute 0 is divisible by 10, so it keeps all 60 × 30 = 1800 labels, 0…1799.
    expect(framesToTimecode(1799, DF2997)).toBe('00:00:59;29')
  })
  it('skips 00 and 01 at minute 1: 1800 frames = 00:01:00;02', () => {
    expect(framesToTimecode(1800, DF2997)).toBe('00:01:00;02')
    expect(framesToTimecode(1801, DF2997)).toBe('00:01:00;03')
  })
  it('reaches 00:10:00;00 at 17982 frames, minute 10 keeping its 00', () => {
    // 10 minutes: 10 × 1800 labels − 9 minutes × 2 skipped = 17982.
    expect(framesToTimecode(17981, DF2997)).toBe('00:09:59;29')
    expect(framesToTimecode(17982, DF2997)).toBe('00:10:00;00')
    expect(framesToTimecode(17982 + 1800, DF2997)).toBe('00:11:00;02')
  })
  it('one hour is 107892 frames (6 × 17982; the figure is also quoted widely, from memory)', () => {
    expect(framesToTimecode(107_892, DF2997)).toBe('01:00:00;00')
    expect(timecodeToFrames('01:00:00;00', DF2997)).toBe(107_892)
  })
  it('a full 24 h is 2 589 408 frames, then the labels wrap', () => {
    // 144 blocks of ten minutes × 17982 = 2 589 408.
    expect(timecodeFramesPerDay(DF2997)).toBe(144 * 17_982)
    expect(framesToTimecode(2_589_407, DF2997)).toBe('23:59:59;29')
    expect(timecodeToFrames('23:59:59;29', DF2997)).toBe(2_589_407)
    expect(framesToTimecode(2_589_408, DF2997)).toBe('00:00:00;00')
    // In real time a drop-frame day is 2 589 408 × 1001/30000 s = 86 399.9136 s, 86.4 ms short of
    // 24 h (about 2.6 frames a day: a known residual of drop-frame, from memory).
    expect(framesToMs(2_589_408, { fps: 29.97 })).toBeCloseTo(86_399_913.6, 6)
  })
  it('reads labels back to frame counts', () => {
    expect(timecodeToFrames('00:01:00;02', DF2997)).toBe(1800)
    expect(timecodeToFrames('00:00:59;29', DF2997)).toBe(1799)
    expect(timecodeToFrames('00:10:00;00', DF2997)).toBe(17_982)
    expect(timecodeToFrames('00:10:00;01', DF2997)).toBe(17_983) // minute 10 keeps 00 and 01
  })
})

describe('59.94 fps drop-frame skips labels 00–03', () => {
  it('worked values', () => {
    // Minute 0: 60 × 60 = 3600 labels; ten minutes: 36 000 − 9 × 4 = 35 964.
    expect(framesToTimecode(3599, DF5994)).toBe('00:00:59;59')
    expect(framesToTimecode(3600, DF5994)).toBe('00:01:00;04')
    expect(framesToTimecode(35_964, DF5994)).toBe('00:10:00;00')
    expect(timecodeToFrames('00:01:00;04', DF5994)).toBe(3600)
    expect(timecodeFramesPerDay(DF5994)).toBe(144 * 35_964)
  })
  it('refuses the skipped labels 00–03', () => {
    for (const ff of ['00', '01', '02', '03']) expect(() => timecodeToFrames(`00:01:00;${ff}`, DF5994)).toThrow(/does not exist/)
  })
})

describe('non-drop rates count plain labels', () => {
  it('one hour of labels at each rate', () => {
    // HH:MM:SS:FF with the nominal label rate: 24 for 23.976, 30 for 29.97, 60 for 59.94.
    for (const fps of TIMECODE_FPS) {
      const nominal = ROUNDED[fps]!
      expect(framesToTimecode(3600 * nominal, { fps })).toBe('01:00:00:00')
      expect(timecodeToFrames('00:00:01:00', { fps })).toBe(nominal)
    }
    expect(framesToTimecode(90_000 + 24, { fps: 25 })).toBe('01:00:00:24')
    expect(framesToTimecode(1800, { fps: 29.97 })).toBe('00:01:00:00') // non-drop 29.97 keeps every label
  })
})

describe('against FFmpeg libavutil/timecode.c as an oracle (fast-check)', () => {
  for (const fps of TIMECODE_FPS) {
    for (const drop of fps === 29.97 || fps === 59.94 ? [false, true] : [false]) {
      const rate: TimecodeRate = { fps, drop }
      it(`${fps} fps ${drop ? 'drop-frame' : 'non-drop'}: same label for any frame over two days`, () => {
        fc.assert(fc.property(fc.integer({ min: 0, max: 2 * 86_400 * 60 }), (frames) => {
          expect(framesToTimecode(frames, rate)).toBe(ffmpegMakeString(frames, ROUNDED[fps]!, drop))
        }), { numRuns: 1000 })
      })
    }
  }
  it('29.97 drop-frame: same label for every frame of the first 20 minutes and around each minute', () => {
    const differ: string[] = []
    const check = (f: number) => {
      const ours = framesToTimecode(f, DF2997)
      const theirs = ffmpegMakeString(f, 30, true)
      if (ours !== theirs) differ.push(`${f}: ${ours} ≠ ${theirs}`)
    }
    for (let f = 0; f < 2 * 17_982; f++) check(f)
    for (let minute = 1; minute < 1440; minute++) {
      const at = timecodeToFrames(`${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}:00;${minute % 10 ? '02' : '00'}`, DF2997)
      for (let f = at - 3; f <= at + 3; f++) check(f)
    }
    expect(differ).toEqual([])
  })
  it('label → frames → label is the identity over a day, at every rate', () => {
    for (const rate of [DF2997, DF5994, { fps: 25 }, { fps: 23.976 }, { fps: 60 }] as TimecodeRate[]) {
      fc.assert(fc.property(fc.integer({ min: 0, max: timecodeFramesPerDay(rate) - 1 }), (frames) => {
        expect(timecodeToFrames(framesToTimecode(frames, rate), rate)).toBe(frames)
      }), { numRuns: 1000 })
    }
  })
})

describe('bad labels and rates get a clear message', () => {
  it('refuses the skipped drop-frame labels, naming the next valid one', () => {
    expect(() => timecodeToFrames('00:01:00;00', DF2997)).toThrow(/does not exist in 29.97 fps drop-frame.*next label is 00:01:00;02/)
    expect(() => timecodeToFrames('00:01:00;01', DF2997)).toThrow(/does not exist/)
    expect(() => timecodeToFrames('12:34:00;00', DF2997)).toThrow(/12:34:00;02/)
  })
  it('refuses drop-frame at rates that have none', () => {
    for (const fps of [23.976, 24, 25, 30, 50, 60] as const) {
      expect(() => framesToTimecode(0, { fps, drop: true })).toThrow(/no drop-frame timecode/)
      expect(() => timecodeToFrames('00:00:00;00', { fps, drop: true })).toThrow(/no drop-frame timecode/)
    }
  })
  it('refuses out-of-range fields, wrong separators, unknown rates and bad counts', () => {
    expect(() => timecodeToFrames('00:00:00;30', DF2997)).toThrow(/frames run 00–29/)
    expect(() => timecodeToFrames('00:00:00:25', { fps: 25 })).toThrow(/frames run 00–24/)
    expect(() => timecodeToFrames('24:00:00:00', { fps: 25 })).toThrow(/hours run 00–23/)
    expect(() => timecodeToFrames('00:60:00:00', { fps: 25 })).toThrow(/minutes run/)
    expect(() => timecodeToFrames('00:00:60:00', { fps: 25 })).toThrow(/seconds run/)
    expect(() => timecodeToFrames('00:01:00:02', DF2997)).toThrow(/separates the frames with ';'/)
    expect(() => timecodeToFrames('00:00:01;00', { fps: 25 })).toThrow(/';' marks drop-frame/)
    expect(() => timecodeToFrames('1:2:3:4', { fps: 25 })).toThrow(/HH:MM:SS:FF/)
    expect(() => framesToTimecode(0, { fps: 48 as never })).toThrow(/48 fps is not a timecode rate/)
    expect(() => framesToTimecode(-1, DF2997)).toThrow(/whole number from 0/)
    expect(() => framesToTimecode(1.5, DF2997)).toThrow(/whole number from 0/)
  })
})

describe('time ↔ frames at the exact rates (29.97 = 30000/1001)', () => {
  it('worked values', () => {
    // 30 frames at 30000/1001 fps last 30 × 1001/30000 s = 1.001 s.
    expect(framesToMs(30, { fps: 29.97 })).toBe(1001)
    expect(msToFrames(1001, { fps: 29.97 })).toBe(30)
    expect(msToFrames(1000, { fps: 29.97 })).toBe(29) // 29.97 frames: frame 29 is on screen
    expect(msToFrames(1000, { fps: 25 })).toBe(25)
    expect(msToFrames(39.999, { fps: 25 })).toBe(0)
    expect(msToFrames(40, { fps: 25 })).toBe(1)
    // 23.976 = 24000/1001: one hour of labels (86 400 frames) lasts 3603.6 s of real time.
    expect(framesToMs(86_400, { fps: 23.976 })).toBeCloseTo(3_603_600, 6)
    expect(framesToMs(3600, { fps: 59.94, drop: true })).toBeCloseTo(60_060, 6)
  })
  it('a frame start maps back to its own frame', () => {
    for (const fps of TIMECODE_FPS) {
      fc.assert(fc.property(fc.integer({ min: 0, max: 10_000_000 }), (frames) => {
        expect(msToFrames(framesToMs(frames, { fps }) + 1e-6, { fps })).toBe(frames)
      }), { numRuns: 300 })
    }
  })
  // The exact rates 30000/1001 and 60000/1001 (SMPTE ST 12-1): a frame's start time, as framesToMs
  // gives it, is that frame — for every one of the first 200,000 frames, with no offset added.
  it.each([29.97, 59.94] as const)('msToFrames(framesToMs(n)) === n for all n < 200,000 at %s fps', (fps) => {
    const wrong: number[] = []
    for (let n = 0; n < 200_000; n++) if (msToFrames(framesToMs(n, { fps }), { fps }) !== n) wrong.push(n)
    expect(wrong).toEqual([])
    // n = 31 was the first to come back as 30 before the fix
    expect(msToFrames(framesToMs(31, { fps }), { fps })).toBe(31)
  })
  it('a microsecond before a frame starts is still the frame before', () => {
    for (const fps of [29.97, 59.94, 23.976] as const) {
      for (const n of [1, 31, 1799, 17_982, 199_999]) expect(msToFrames(framesToMs(n, { fps }) - 0.001, { fps }), `${fps} ${n}`).toBe(n - 1)
    }
  })
  it('refuses negative times', () => {
    expect(() => msToFrames(-1, { fps: 25 })).toThrow(/at least 0 ms/)
  })
})

describe('parseTimecodeRate reads "29.97df" and friends', () => {
  it('reads rates', () => {
    expect(parseTimecodeRate('29.97df')).toEqual({ fps: 29.97, drop: true })
    expect(parseTimecodeRate('59.94DF')).toEqual({ fps: 59.94, drop: true })
    expect(parseTimecodeRate('29.97ndf')).toEqual({ fps: 29.97, drop: false })
    expect(parseTimecodeRate('25')).toEqual({ fps: 25, drop: false })
  })
  it('refuses unknown rates and drop-frame where there is none', () => {
    expect(() => parseTimecodeRate('12')).toThrow(/not a timecode rate/)
    expect(() => parseTimecodeRate('fast')).toThrow(/not a timecode rate/)
    expect(() => parseTimecodeRate('25df')).toThrow(/no drop-frame/)
  })
})
