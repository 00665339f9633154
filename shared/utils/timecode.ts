// SMPTE ST 12-1 timecode: HH:MM:SS:FF labels for frame counts, with drop-frame where the rate
// calls for it. Drop-frame counts the frames of 29.97 (30000/1001) fps video with 30 labels a
// second and keeps the labels in step with the wall clock by skipping labels: frames 00 and 01 at
// the start of every minute except minutes divisible by 10 (59.94 fps skips 00–03). No frames are
// dropped, only labels; drop-frame labels separate the frames with ';'.

export type TimecodeFps = 23.976 | 24 | 25 | 29.97 | 30 | 50 | 59.94 | 60
export interface TimecodeRate {
  fps: TimecodeFps
  drop?: boolean
}

interface RateFacts {
  /** Labels per second (the nominal rate): 30 for 29.97. */
  nominal: number
  /** Exact frames per second as a fraction. */
  num: number
  den: number
  /** Labels skipped at the start of each minute not divisible by 10, when drop-frame is allowed. */
  dropLabels: number
}

const RATES: Record<TimecodeFps, RateFacts> = {
  23.976: { nominal: 24, num: 24000, den: 1001, dropLabels: 0 },
  24: { nominal: 24, num: 24, den: 1, dropLabels: 0 },
  25: { nominal: 25, num: 25, den: 1, dropLabels: 0 },
  29.97: { nominal: 30, num: 30000, den: 1001, dropLabels: 2 },
  30: { nominal: 30, num: 30, den: 1, dropLabels: 0 },
  50: { nominal: 50, num: 50, den: 1, dropLabels: 0 },
  59.94: { nominal: 60, num: 60000, den: 1001, dropLabels: 4 },
  60: { nominal: 60, num: 60, den: 1, dropLabels: 0 },
}

export const TIMECODE_FPS: readonly TimecodeFps[] = [23.976, 24, 25, 29.97, 30, 50, 59.94, 60]

/** Every rate a camera can be set to: each fps, non-drop, and drop-frame after 29.97 and 59.94. */
export const TIMECODE_RATES: readonly TimecodeRate[] = TIMECODE_FPS.flatMap((fps): TimecodeRate[] =>
  fps === 29.97 || fps === 59.94 ? [{ fps, drop: false }, { fps, drop: true }] : [{ fps, drop: false }])

function rateFacts(rate: TimecodeRate): RateFacts & { drop: number } {
  const facts = (RATES as Record<number, RateFacts | undefined>)[rate?.fps]
  if (!facts) throw new RangeError(`${rate?.fps} fps is not a timecode rate Hobline knows; use one of ${TIMECODE_FPS.join(', ')}`)
  if (rate.drop && facts.dropLabels === 0) {
    throw new RangeError(`${rate.fps} fps has no drop-frame timecode; drop-frame exists only at 29.97 and 59.94 fps`)
  }
  return { ...facts, drop: rate.drop ? facts.dropLabels : 0 }
}

/** Frames in 24 hours of timecode labels at this rate: where the labels wrap back to 00:00:00. */
export function timecodeFramesPerDay(rate: TimecodeRate): number {
  const { nominal, drop } = rateFacts(rate)
  // 1440 minutes a day, 144 of them divisible by 10 and so without skipped labels.
  return 86400 * nominal - drop * (1440 - 144)
}

const pad = (n: number) => String(n).padStart(2, '0')

/** The label of a frame count (from 00:00:00:00); counts of a day or more wrap, as timecode does. */
export function framesToTimecode(frames: number, rate: TimecodeRate): string {
  const { nominal, drop } = rateFacts(rate)
  if (!Number.isSafeInteger(frames) || frames < 0) {
    throw new RangeError(`a frame count is a whole number from 0 (got ${frames})`)
  }
  let f = frames % timecodeFramesPerDay(rate)
  let minutes: number
  let label: number // label number within the minute: SS × nominal + FF
  if (drop === 0) {
    minutes = Math.floor(f / (60 * nominal))
    label = f % (60 * nominal)
  } else {
    // A block of ten minutes: the first minute keeps all its labels, the nine others lose `drop`.
    const perFullMinute = 60 * nominal
    const perShortMinute = perFullMinute - drop
    const perTen = perFullMinute + 9 * perShortMinute
    const tens = Math.floor(f / perTen)
    f %= perTen
    if (f < perFullMinute) {
      minutes = tens * 10
      label = f
    } else {
      f -= perFullMinute
      minutes = tens * 10 + 1 + Math.floor(f / perShortMinute)
      label = (f % perShortMinute) + drop
    }
  }
  const hh = Math.floor(minutes / 60)
  const mm = minutes % 60
  const ss = Math.floor(label / nominal)
  const ff = label % nominal
  return `${pad(hh)}:${pad(mm)}:${pad(ss)}${drop ? ';' : ':'}${pad(ff)}`
}

/** The frame count of a label; refuses labels that do not exist at this rate, saying why. */
export function timecodeToFrames(text: string, rate: TimecodeRate): number {
  const { nominal, drop } = rateFacts(rate)
  const name = `${rate.fps} fps${drop ? ' drop-frame' : ''}`
  const m = /^(\d{2}):(\d{2}):(\d{2})([:;])(\d{2})$/.exec(String(text).trim())
  if (!m) throw new RangeError(`"${text}" is not a timecode; write HH:MM:SS${drop ? ';' : ':'}FF, e.g. 01:02:03${drop ? ';' : ':'}04`)
  const [hh, mm, ss, ff] = [m[1], m[2], m[3], m[5]].map(Number) as [number, number, number, number]
  const sep = m[4]
  if (drop && sep !== ';') throw new RangeError(`"${text}": ${name} timecode separates the frames with ';' (HH:MM:SS;FF)`)
  if (!drop && sep !== ':') {
    throw new RangeError(`"${text}": ';' marks drop-frame timecode, which ${name} is not; separate the frames with ':'`)
  }
  if (hh > 23) throw new RangeError(`"${text}": hours run 00–23`)
  if (mm > 59) throw new RangeError(`"${text}": minutes run 00–59`)
  if (ss > 59) throw new RangeError(`"${text}": seconds run 00–59`)
  if (ff >= nominal) throw new RangeError(`"${text}": frames run 00–${pad(nominal - 1)} at ${rate.fps} fps`)
  const minutes = hh * 60 + mm
  if (drop && ss === 0 && ff < drop && mm % 10 !== 0) {
    throw new RangeError(
      `"${text}" does not exist in ${name} timecode: labels 00–${pad(drop - 1)} are skipped at the start of every minute `
      + `not divisible by 10; the next label is ${pad(hh)}:${pad(mm)}:00;${pad(drop)}`,
    )
  }
  return (minutes * 60 + ss) * nominal + ff - drop * (minutes - Math.floor(minutes / 10))
}

/**
 * Within this many frames of a frame's start (33 ns at 29.97 fps), a time is that frame's start: a
 * start time from framesToMs at 29.97 or 59.94 is a rounded binary fraction and may fall a hair short.
 */
const FRAME_START_TOLERANCE = 1e-6

/** The frame shown at a time from the start (the frame that contains that instant). */
export function msToFrames(ms: number, rate: TimecodeRate): number {
  const { num, den } = rateFacts({ fps: rate.fps })
  if (!Number.isFinite(ms) || ms < 0) throw new RangeError(`a time from the start is at least 0 ms (got ${ms})`)
  const exact = (ms * num) / (den * 1000)
  const nearest = Math.round(exact)
  return Math.abs(exact - nearest) <= FRAME_START_TOLERANCE ? nearest : Math.floor(exact)
}

/** When a frame starts, in ms from the start. */
export function framesToMs(frames: number, rate: TimecodeRate): number {
  const { num, den } = rateFacts({ fps: rate.fps })
  if (!Number.isSafeInteger(frames) || frames < 0) throw new RangeError(`a frame count is a whole number from 0 (got ${frames})`)
  return (frames * den * 1000) / num
}

/**
 * A rate written as text, as in `?rate=29.97df`: the fps, then `df` for drop-frame (or `ndf`
 * for non-drop; plain numbers are non-drop).
 */
export function parseTimecodeRate(text: string): TimecodeRate {
  const m = /^\s*(\d+(?:\.\d+)?)\s*(df|ndf)?\s*$/i.exec(String(text))
  const fps = m ? Number(m[1]) : NaN
  if (!m || !TIMECODE_FPS.includes(fps as TimecodeFps)) {
    throw new RangeError(`"${text}" is not a timecode rate; use one of ${TIMECODE_FPS.join(', ')}, with "df" after 29.97 or 59.94 for drop-frame`)
  }
  const rate: TimecodeRate = { fps: fps as TimecodeFps, drop: m[2]?.toLowerCase() === 'df' }
  rateFacts(rate) // refuses drop-frame where the rate has none
  return rate
}

/** The label written for a rate: "29.97df", "25" (what `?rate=` and parseTimecodeRate read). */
export function timecodeRateText(rate: TimecodeRate): string {
  return `${rate.fps}${rate.drop ? 'df' : ''}`
}

/** The rate in words, for screens: "29.97 fps drop-frame". */
export function timecodeRateName(rate: TimecodeRate): string {
  const hasDrop = rate.fps === 29.97 || rate.fps === 59.94
  return `${rate.fps} fps${rate.drop ? ' drop-frame' : hasDrop ? ' non-drop' : ''}`
}

/** Where cameras usually start their timecode: one hour in, 01:00:00:00 (01:00:00;00 in drop-frame). */
export function defaultStartTimecode(rate: TimecodeRate): string {
  return `01:00:00${rate.drop ? ';' : ':'}00`
}

/**
 * The label of the frame on screen `ms` after a start label (a camera that starts at 01:00:00:00):
 * the start's frame count plus the frames elapsed, wrapping after 23:59:59 as timecode does.
 */
export function timecodeAfter(start: string, ms: number, rate: TimecodeRate): string {
  return framesToTimecode((timecodeToFrames(start, rate) + msToFrames(ms, rate)) % timecodeFramesPerDay(rate), rate)
}
