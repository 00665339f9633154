// The alarm sounds (shared/utils/alarm-sounds.ts, public/sounds/): the committed WAV files read back
// by the WAVE form's own rules, equal to what the synthesis makes now, each tone at the pitch its
// pattern names, and eight patterns that differ from each other.
//
// Sources:
// - File layout: Microsoft/IBM Multimedia Programming Interface and Data Specifications 1.0
//   (1991), WAVE chunk: a RIFF chunk of form type "WAVE" holding a "fmt " chunk (wFormatTag 1 for
//   PCM, nChannels, nSamplesPerSec, nAvgBytesPerSec, nBlockAlign, wBitsPerSample) and a "data"
//   chunk; little-endian sizes; a chunk of odd size is followed by a pad byte; 16-bit PCM samples
//   are signed.
// - Pitch: the Goertzel algorithm (G. Goertzel, "An algorithm for the evaluation of finite
//   trigonometric series", American Mathematical Monthly 65, 1958) gives a DFT term at any
//   frequency; the largest term is the tone's pitch.
// - Notes: ISO 16 (A4 = 440 Hz) and equal temperament, f = 440·2^((n−49)/12) for piano key n.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import {
  ALARM_PARTIALS, ALARM_PATTERNS, ALARM_SAMPLE_RATE, COUNT_TICK_PATH, COUNT_TICK_PATTERN, alarmSlotFor, alarmSoundPath,
  patternDurationMs, patternMainHz, patternSpans, patternWav, synthesizePattern, wavBytes,
} from '../../shared/utils/alarm-sounds'

const readPublic = (path: string) => new Uint8Array(readFileSync(new URL(`../../public${path}`, import.meta.url)))

interface Wave { formatTag: number; channels: number; sampleRate: number; byteRate: number; blockAlign: number; bits: number; samples: Int16Array }

/** Reads a RIFF WAVE file chunk by chunk, as the 1991 specification lays it out. */
function readWave(bytes: Uint8Array): Wave {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  const id = (at: number) => String.fromCharCode(...bytes.subarray(at, at + 4))
  if (id(0) !== 'RIFF' || id(8) !== 'WAVE') throw new Error('not a RIFF WAVE file')
  if (view.getUint32(4, true) !== bytes.length - 8) throw new Error('RIFF size is not the file length − 8')
  let fmt: Omit<Wave, 'samples'> | null = null
  let samples: Int16Array | null = null
  for (let at = 12; at + 8 <= bytes.length;) {
    const size = view.getUint32(at + 4, true)
    const body = at + 8
    if (id(at) === 'fmt ') {
      fmt = {
        formatTag: view.getUint16(body, true), channels: view.getUint16(body + 2, true), sampleRate: view.getUint32(body + 4, true),
        byteRate: view.getUint32(body + 8, true), blockAlign: view.getUint16(body + 12, true), bits: view.getUint16(body + 14, true),
      }
    } else if (id(at) === 'data') {
      samples = new Int16Array(size / 2)
      for (let i = 0; i < samples.length; i++) samples[i] = view.getInt16(body + i * 2, true)
    }
    at = body + size + (size % 2)
  }
  if (!fmt || !samples) throw new Error('a WAVE file needs a "fmt " and a "data" chunk')
  return { ...fmt, samples }
}

/** |X(f)|² of samples at frequency f by the Goertzel recurrence s[n] = x[n] + 2cos(ω)s[n−1] − s[n−2]. */
function goertzelPower(x: ArrayLike<number>, sampleRate: number, hz: number): number {
  const w = (2 * Math.PI * hz) / sampleRate
  const c = 2 * Math.cos(w)
  let s1 = 0
  let s2 = 0
  for (let i = 0; i < x.length; i++) {
    const s = x[i]! + c * s1 - s2
    s2 = s1
    s1 = s
  }
  return s1 * s1 + s2 * s2 - c * s1 * s2
}

/** The frequency with the largest Goertzel power between lo and hi: a 5 Hz scan, then 0.05 Hz steps
 * around the best. */
function peakHz(x: ArrayLike<number>, sampleRate: number, lo = 150, hi = 4000): number {
  const best = (from: number, to: number, step: number) => {
    let at = from
    let top = -1
    for (let f = from; f <= to; f += step) {
      const p = goertzelPower(x, sampleRate, f)
      if (p > top) [top, at] = [p, f]
    }
    return at
  }
  const coarse = best(lo, hi, 5)
  return best(coarse - 6, coarse + 6, 0.05)
}

/** The Hann-windowed middle of a tone, past its fade in and before its fade out. */
function steadyPart(samples: Int16Array, start: number, length: number, fadeIn: number, fadeOut: number): Float64Array {
  const from = start + fadeIn
  const n = length - fadeIn - fadeOut
  return Float64Array.from({ length: n }, (_, i) => (samples[from + i]! / 32768) * 0.5 * (1 - Math.cos((2 * Math.PI * i) / (n - 1))))
}

const files = ALARM_PATTERNS.map((pattern) => ({ pattern, path: alarmSoundPath(pattern.slot) }))
const waves = new Map(files.map(({ path }) => [path, readWave(readPublic(path))]))

describe('alarm files: the WAVE form (Microsoft/IBM RIFF specification 1.0, 1991, WAVE chunk)', () => {
  it('has one pattern per timer slot, 0 to 7, served as alarm-slot-1 … alarm-slot-8', () => {
    expect(ALARM_PATTERNS.map((p) => p.slot)).toEqual([0, 1, 2, 3, 4, 5, 6, 7])
    expect(files.map((f) => f.path)).toEqual([1, 2, 3, 4, 5, 6, 7, 8].map((n) => `/sounds/alarm-slot-${n}.wav`))
    expect(() => alarmSoundPath(8)).toThrow(/0 to 7/)
  })

  for (const { pattern, path } of [...files, { pattern: COUNT_TICK_PATTERN, path: COUNT_TICK_PATH }]) {
    it(`${path}: PCM, mono, 22050 Hz, 16 bits, as long as its pattern, under 80 KB`, () => {
      const bytes = readPublic(path)
      const wave = readWave(bytes)
      expect(wave.formatTag).toBe(1) // WAVE_FORMAT_PCM
      expect(wave.channels).toBe(1)
      expect(wave.sampleRate).toBe(22050)
      expect(wave.bits).toBe(16)
      expect(wave.blockAlign).toBe(wave.channels * (wave.bits / 8)) // nChannels × bytes per sample
      expect(wave.byteRate).toBe(wave.sampleRate * wave.blockAlign) // nAvgBytesPerSec
      const ms = (wave.samples.length / wave.sampleRate) * 1000
      expect(ms).toBeCloseTo(patternDurationMs(pattern), -1) // within 5 ms (rounding per tone)
      if (pattern.slot >= 0) {
        expect(ms).toBeGreaterThanOrEqual(1000)
        expect(ms).toBeLessThanOrEqual(1500)
      }
      expect(bytes.length).toBeLessThan(80 * 1024)
    })

    it(`${path}: equals what the synthesis makes now (run scripts/make-alarm-sounds.ts when not)`, () => {
      expect(Buffer.from(readPublic(path)).equals(Buffer.from(patternWav(pattern)))).toBe(true)
    })
  }

  it('writes a header a reader can check field by field', () => {
    const bytes = wavBytes(Int16Array.from([0, 32767, -32768, 1]), 8000)
    expect(bytes.length).toBe(44 + 8)
    const wave = readWave(bytes)
    expect({ ...wave, samples: [...wave.samples] }).toEqual({
      formatTag: 1, channels: 1, sampleRate: 8000, byteRate: 16000, blockAlign: 2, bits: 16, samples: [0, 32767, -32768, 1],
    })
  })
})

describe('alarm pitches (Goertzel 1958; ISO 16 A4 = 440 Hz, equal temperament)', () => {
  it('uses only equal-tempered notes: f = 440·2^((n−49)/12) to 0.01 Hz', () => {
    for (const pattern of [...ALARM_PATTERNS, COUNT_TICK_PATTERN]) {
      for (const { hz } of pattern.tones) {
        if (hz === null) continue
        const key = Math.round(49 + 12 * Math.log2(hz / 440))
        expect(Math.abs(hz - 440 * 2 ** ((key - 49) / 12)), `${pattern.name} ${hz} Hz`).toBeLessThan(0.01)
      }
    }
    expect(440 * 2 ** ((61 - 49) / 12)).toBe(880) // A5, key 61: one octave above A4
  })

  it('finds a pure test tone to within 0.1 Hz (the detector itself)', () => {
    const x = Float64Array.from(
      { length: 2000 },
      (_, i) => Math.sin((2 * Math.PI * 1000 * i) / ALARM_SAMPLE_RATE) * 0.5 * (1 - Math.cos((2 * Math.PI * i) / 1999)),
    )
    expect(Math.abs(peakHz(x, ALARM_SAMPLE_RATE) - 1000)).toBeLessThan(0.1)
  })

  for (const { pattern, path } of files) {
    it(`${path} (${pattern.title}): every tone sounds at its pattern's frequency within 2 Hz`, () => {
      const wave = waves.get(path)!
      const fadeIn = Math.round((pattern.attackMs * wave.sampleRate) / 1000)
      const fadeOut = Math.round((pattern.releaseMs * wave.sampleRate) / 1000)
      const tones = patternSpans(pattern, wave.sampleRate).filter((s) => s.hz !== null)
      expect(tones.length).toBeGreaterThan(0)
      for (const span of tones) {
        const found = peakHz(steadyPart(wave.samples, span.start, span.length, fadeIn, fadeOut), wave.sampleRate)
        expect(Math.abs(found - span.hz!), `tone at sample ${span.start}: found ${found.toFixed(2)} Hz`).toBeLessThan(2)
      }
    })

    it(`${path}: the file's dominant frequency is the pattern's main pitch, ${patternMainHz(pattern)} Hz, within 2 Hz`, () => {
      const wave = waves.get(path)!
      const x = Float64Array.from(wave.samples, (v) => v / 32768)
      // Candidates on a 1 Hz grid (the whole file resolves about 0.8 Hz), refined around the best.
      let best = 0
      let top = -1
      for (let f = 150; f <= 4000; f += 1) {
        const p = goertzelPower(x, wave.sampleRate, f)
        if (p > top) [top, best] = [p, f]
      }
      expect(Math.abs(best - patternMainHz(pattern))).toBeLessThanOrEqual(2)
    })
  }

  it('is silent between tones: every rest is all zero samples', () => {
    for (const { pattern, path } of files) {
      const wave = waves.get(path)!
      for (const span of patternSpans(pattern, wave.sampleRate).filter((s) => s.hz === null)) {
        expect(wave.samples.subarray(span.start, span.start + span.length).every((v) => v === 0), path).toBe(true)
      }
    }
  })
})

describe('alarm shapes: no clicks, no two alike', () => {
  for (const pattern of ALARM_PATTERNS) {
    it(`${pattern.name}: starts and ends at 0, and no step between samples is steeper than the tone's own slope`, () => {
      const x = synthesizePattern(pattern)
      expect(x[0]).toBe(0)
      expect(x[x.length - 1]).toBe(0)
      // A sum of sines a·sin(ωt) changes by at most Σ a·ω per second (its derivative); a click is a
      // jump well above that. Allow 5 % for the fade.
      const levels = ALARM_PARTIALS.reduce((s, [, l]) => s + l, 0)
      const highest = Math.max(...pattern.tones.map((t) => t.hz ?? 0))
      const slope = (pattern.gain / levels) * ALARM_PARTIALS.reduce((s, [m, l]) => s + (l * 2 * Math.PI * m * highest) / ALARM_SAMPLE_RATE, 0)
      let steepest = 0
      for (let i = 1; i < x.length; i++) steepest = Math.max(steepest, Math.abs(x[i]! - x[i - 1]!))
      expect(steepest).toBeLessThanOrEqual(slope * 1.05)
      expect(Math.max(...x.map(Math.abs))).toBeLessThanOrEqual(pattern.gain)
    })
  }

  it('gives every slot its own pattern, name and main pitch (main pitches at least a semitone apart)', () => {
    const shapes = ALARM_PATTERNS.map((p) => JSON.stringify(p.tones))
    expect(new Set(shapes).size).toBe(8)
    expect(new Set(ALARM_PATTERNS.map((p) => p.name)).size).toBe(8)
    const mains = ALARM_PATTERNS.map(patternMainHz).sort((a, b) => a - b)
    for (let i = 1; i < mains.length; i++) expect(mains[i]! / mains[i - 1]!).toBeGreaterThanOrEqual(2 ** (1 / 12) - 1e-4)
  })

  it('gives every slot its own rhythm (tone and rest lengths in order)', () => {
    const rhythms = ALARM_PATTERNS.map((p) => p.tones.map((t) => `${t.hz === null ? 'rest' : 'tone'}${t.ms}`).join(' '))
    expect(new Set(rhythms).size).toBe(8)
  })

  it('rings a timer by its named sound, else by its own slot', () => {
    expect(alarmSlotFor({ slot: 2, sound: null })).toBe(2)
    expect(alarmSlotFor({ slot: 2, sound: 'trill' })).toBe(6)
    expect(alarmSlotFor({ slot: 5, sound: 'no-such-sound' })).toBe(5)
  })
})
