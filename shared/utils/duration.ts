// ISO 8601 durations as schema.org uses them (prepTime, cookTime, totalTime, performTime):
// PnYnMnWnDTnHnMnS, "P" first, "T" before the time part, at least one component, and a decimal
// fraction (point or comma) allowed on the lowest-order component only (ISO 8601-1:2019, 5.5.2).
// A day is taken as 24 h (the nominal day). Years and months have no fixed length, so a non-zero
// year or month is refused rather than guessed.

const NUM = '(\\d+(?:[.,]\\d+)?)'
const ISO_DURATION = new RegExp(`^P(?:${NUM}Y)?(?:${NUM}M)?(?:${NUM}W)?(?:${NUM}D)?(?:T(?:${NUM}H)?(?:${NUM}M)?(?:${NUM}S)?)?$`)
const SECONDS = [0, 0, 604800, 86400, 3600, 60, 1] // Y and M have none

export class DurationFormatError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'DurationFormatError'
  }
}

/** Seconds in an ISO 8601 duration such as PT20M, PT1H30M, P0DT45M or PT0.5S. */
export function parseIsoDuration(text: string): number {
  if (typeof text !== 'string') throw new DurationFormatError(`A duration must be text such as PT20M, not ${typeof text}`)
  const src = text.trim().toUpperCase()
  const example = 'such as PT20M (20 minutes) or PT1H30M (1 hour 30 minutes)'
  const m = ISO_DURATION.exec(src)
  if (!m || src === 'P' || src.endsWith('T')) {
    const hint = /^-/.test(src) ? '; negative durations are not allowed' : /^\d/.test(src) ? '; it must start with "P"' : ''
    throw new DurationFormatError(`"${text}" is not an ISO 8601 duration ${example}${hint}`)
  }
  const parts = m.slice(1)
  const present = parts.map((p, i) => (p === undefined ? -1 : i)).filter((i) => i >= 0)
  const last = present[present.length - 1]!
  let seconds = 0
  for (const i of present) {
    const raw = parts[i]!
    if (/[.,]/.test(raw) && i !== last) {
      throw new DurationFormatError(`"${text}": only the last component of an ISO 8601 duration may have a decimal fraction`)
    }
    const value = Number(raw.replace(',', '.'))
    if ((i === 0 || i === 1) && value !== 0) {
      throw new DurationFormatError(`"${text}": years and months have no fixed length; give the duration in days, hours, minutes or seconds (for example P2D or PT36H)`)
    }
    seconds += value * SECONDS[i]!
  }
  return seconds
}

/** The ISO 8601 duration for a number of seconds: 5400 → PT1H30M, 0 → PT0S, 90000 → P1DT1H. */
export function toIsoDuration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) throw new DurationFormatError(`A duration must be zero or more seconds, not ${seconds}`)
  let ms = Math.round(seconds * 1000)
  const days = Math.floor(ms / 86_400_000)
  ms -= days * 86_400_000
  const h = Math.floor(ms / 3_600_000)
  ms -= h * 3_600_000
  const min = Math.floor(ms / 60_000)
  ms -= min * 60_000
  const s = ms / 1000
  let time = ''
  if (h) time += `${h}H`
  if (min) time += `${min}M`
  if (s) time += `${s}S`
  if (!days && !time) return 'PT0S'
  return `P${days ? `${days}D` : ''}${time ? `T${time}` : ''}`
}

/** A duration as cooks say it: 45 → "45 s", 150 → "2 min 30 s", 5400 → "1 h 30 min". */
export function durationText(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) throw new DurationFormatError(`A duration must be zero or more seconds, not ${seconds}`)
  const total = Math.round(seconds)
  const h = Math.floor(total / 3600)
  const min = Math.floor((total % 3600) / 60)
  const s = total % 60
  const out: string[] = []
  if (h) out.push(`${h} h`)
  if (min) out.push(`${min} min`)
  if (s || !out.length) out.push(`${s} s`)
  return out.join(' ')
}

/** A range such as 480–600 s → "8–10 min"; equal ends or a missing end → one duration. */
export function durationRangeText(min: number | null, max: number | null): string {
  if (min == null && max == null) return ''
  const lo = min ?? max!
  const hi = max ?? min!
  if (lo === hi) return durationText(lo)
  if (lo % 60 === 0 && hi % 60 === 0 && hi < 3600) return `${lo / 60}–${hi / 60} min`
  return `${durationText(lo)} – ${durationText(hi)}`
}
