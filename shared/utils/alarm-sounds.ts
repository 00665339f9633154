// Hobline's alarm sounds, made from data: each timer slot has a pattern of tones and rests, and
// the synthesis below turns a pattern into 16-bit PCM samples and a WAV file. The files in
// public/sounds/ are written by scripts/make-alarm-sounds.ts from these patterns; the unit test
// checks that they are still what this code makes.
//
// Tones are equal-tempered notes (A4 = 440 Hz, f = 440·2^((n−49)/12) for piano key n), rounded
// to 0.01 Hz. Every tone fades in and out on a raised-cosine curve, so no tone starts or stops
// with a click, and each slot has its own rhythm and pitch so two timers never sound alike.

export const ALARM_SAMPLE_RATE = 22050

/** A tone (hz) or a rest (hz null), ms long. */
export interface AlarmTone {
  hz: number | null
  ms: number
}

export interface AlarmPattern {
  /** The timer slot it rings for, 0 … 7; also how a timer names it (`sound`). */
  slot: number
  name: string
  /** What it sounds like, for a settings list. */
  title: string
  tones: readonly AlarmTone[]
  /** Fade in and fade out of every tone, ms. */
  attackMs: number
  releaseMs: number
  /** Peak level, 0–1 of full scale. */
  gain: number
}

/** Overtones as multiples of the tone's frequency and their levels (1 = the tone itself): a
 * little brightness so a tablet's small speaker carries the sound. */
export const ALARM_PARTIALS: ReadonlyArray<readonly [multiple: number, level: number]> = [[1, 1], [2, 0.3], [3, 0.12]]

const t = (hz: number | null, ms: number): AlarmTone => ({ hz, ms })
const rest = (ms: number) => t(null, ms)
const soft = { attackMs: 10, releaseMs: 30, gain: 0.6 }

// Notes used (piano key number, Hz): C5 52 523.25 · D5 54 587.33 · E5 56 659.26 · F5 57 698.46 ·
// F♯5 58 739.99 · G5 59 783.99 · A5 61 880 · B5 63 987.77 · C6 64 1046.5 · D6 66 1174.66 ·
// E6 68 1318.51 · G6 71 1567.98 · A6 73 1760.
export const ALARM_PATTERNS: readonly AlarmPattern[] = [
  { slot: 0, name: 'rise', title: 'Two rising tones', ...soft, tones: [t(1046.5, 220), rest(70), t(1567.98, 420), rest(490)] },
  { slot: 1, name: 'triple', title: 'Three short beeps', ...soft, tones: [t(880, 130), rest(90), t(880, 130), rest(90), t(880, 130), rest(630)] },
  { slot: 2, name: 'fall', title: 'Two falling tones', ...soft, tones: [t(783.99, 420), rest(70), t(523.25, 260), rest(450)] },
  {
    slot: 3, name: 'quick', title: 'Four quick high beeps', ...soft, attackMs: 8, releaseMs: 20,
    tones: [t(1174.66, 90), rest(60), t(1174.66, 90), rest(60), t(1174.66, 90), rest(60), t(1174.66, 90), rest(660)],
  },
  { slot: 4, name: 'swell', title: 'One long swelling tone', ...soft, attackMs: 250, releaseMs: 300, tones: [t(659.26, 900), rest(300)] },
  { slot: 5, name: 'climb', title: 'Three climbing notes', ...soft, tones: [t(587.33, 160), rest(40), t(739.99, 160), rest(40), t(987.77, 440), rest(360)] },
  {
    slot: 6, name: 'trill', title: 'A fast trill', ...soft, attackMs: 8, releaseMs: 20,
    tones: [t(1318.51, 80), t(1046.5, 80), t(1318.51, 80), t(1046.5, 80), t(1318.51, 80), t(1046.5, 80), t(1318.51, 160), rest(560)],
  },
  { slot: 7, name: 'pair', title: 'Two long even tones', ...soft, tones: [t(698.46, 320), rest(160), t(698.46, 320), rest(400)] },
]

/** The soft tick of a 3-2-1 count-in. */
export const COUNT_TICK_PATTERN: AlarmPattern = {
  slot: -1, name: 'tick', title: 'Count-in tick', attackMs: 4, releaseMs: 40, gain: 0.3, tones: [t(1760, 50), rest(30)],
}

/** Where a slot's sound is served (slot 0 → alarm-slot-1.wav). */
export function alarmSoundPath(slot: number): string {
  if (!Number.isInteger(slot) || slot < 0 || slot >= ALARM_PATTERNS.length) {
    throw new RangeError(`slot must be a whole number from 0 to ${ALARM_PATTERNS.length - 1} (got ${slot})`)
  }
  return `/sounds/alarm-slot-${slot + 1}.wav`
}
export const COUNT_TICK_PATH = '/sounds/count-tick.wav'

/** The slot whose sound a timer rings: the one its `sound` names, else its own slot. */
export function alarmSlotFor(timer: { slot: number; sound: string | null }): number {
  const named = timer.sound ? ALARM_PATTERNS.find((p) => p.name === timer.sound) : undefined
  if (named) return named.slot
  return Number.isInteger(timer.slot) && timer.slot >= 0 && timer.slot < ALARM_PATTERNS.length ? timer.slot : 0
}

export function patternDurationMs(pattern: AlarmPattern): number {
  return pattern.tones.reduce((sum, tone) => sum + tone.ms, 0)
}

/** The frequency a pattern holds longest (its main pitch). */
export function patternMainHz(pattern: AlarmPattern): number {
  const held = new Map<number, number>()
  for (const tone of pattern.tones) if (tone.hz !== null) held.set(tone.hz, (held.get(tone.hz) ?? 0) + tone.ms)
  if (held.size === 0) throw new RangeError(`pattern "${pattern.name}" has no tones`)
  return [...held].sort((a, b) => b[1] - a[1])[0]![0]
}

/** Where each tone and rest starts and how many samples it has, at a sample rate. */
export function patternSpans(pattern: AlarmPattern, sampleRate = ALARM_SAMPLE_RATE): Array<AlarmTone & { start: number; length: number }> {
  let start = 0
  return pattern.tones.map((tone) => {
    const length = Math.round((tone.ms * sampleRate) / 1000)
    const span = { ...tone, start, length }
    start += length
    return span
  })
}

/** Raised-cosine fade: 0 at x = 0, 1 from x = 1 on. */
const fade = (x: number) => (x >= 1 ? 1 : 0.5 * (1 - Math.cos(Math.PI * x)))

/** The pattern as samples from −1 to 1, each tone faded in and out to exactly 0 at its ends. */
export function synthesizePattern(pattern: AlarmPattern, sampleRate = ALARM_SAMPLE_RATE): Float32Array {
  const spans = patternSpans(pattern, sampleRate)
  const out = new Float32Array(spans.reduce((n, s) => n + s.length, 0))
  const attack = Math.max(1, (pattern.attackMs * sampleRate) / 1000)
  const release = Math.max(1, (pattern.releaseMs * sampleRate) / 1000)
  const levels = ALARM_PARTIALS.reduce((sum, [, level]) => sum + level, 0)
  for (const span of spans) {
    if (span.hz === null) continue
    const w = (2 * Math.PI * span.hz) / sampleRate
    for (let i = 0; i < span.length; i++) {
      const envelope = Math.min(fade(i / attack), fade((span.length - 1 - i) / release))
      let v = 0
      for (const [multiple, level] of ALARM_PARTIALS) v += level * Math.sin(w * multiple * i)
      out[span.start + i] = (pattern.gain * envelope * v) / levels
    }
  }
  return out
}

/** Samples from −1 to 1 as signed 16-bit integers (clipped, rounded to the nearest step). */
export function toPcm16(samples: Float32Array): Int16Array {
  const out = new Int16Array(samples.length)
  for (let i = 0; i < samples.length; i++) out[i] = Math.round(Math.max(-1, Math.min(1, samples[i]!)) * 32767)
  return out
}

/** A RIFF WAVE file of mono 16-bit PCM: the "fmt " chunk (PCM, format tag 1) and the "data" chunk,
 * little-endian, as the WAVE form is defined by Microsoft and IBM (1991). */
export function wavBytes(pcm: Int16Array, sampleRate = ALARM_SAMPLE_RATE): Uint8Array {
  const channels = 1
  const bytesPerSample = 2
  const dataBytes = pcm.length * bytesPerSample // even, so the data chunk needs no pad byte
  const bytes = new Uint8Array(44 + dataBytes)
  const view = new DataView(bytes.buffer)
  const tag = (at: number, text: string) => [...text].forEach((c, i) => view.setUint8(at + i, c.charCodeAt(0)))
  tag(0, 'RIFF')
  view.setUint32(4, 36 + dataBytes, true)
  tag(8, 'WAVE')
  tag(12, 'fmt ')
  view.setUint32(16, 16, true)
  view.setUint16(20, 1, true) // WAVE_FORMAT_PCM
  view.setUint16(22, channels, true)
  view.setUint32(24, sampleRate, true)
  view.setUint32(28, sampleRate * channels * bytesPerSample, true)
  view.setUint16(32, channels * bytesPerSample, true)
  view.setUint16(34, bytesPerSample * 8, true)
  tag(36, 'data')
  view.setUint32(40, dataBytes, true)
  for (let i = 0; i < pcm.length; i++) view.setInt16(44 + i * 2, pcm[i]!, true)
  return bytes
}

/** A pattern's WAV file, as written to public/sounds/. */
export function patternWav(pattern: AlarmPattern, sampleRate = ALARM_SAMPLE_RATE): Uint8Array {
  return wavBytes(toPcm16(synthesizePattern(pattern, sampleRate)), sampleRate)
}
