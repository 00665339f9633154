// Minutes and seconds as a kitchen clock reads them: "4:05", "1:02:09" from an hour. The one
// formatter of elapsed, remaining and planned times on every screen and in every message.

export type ClockRounding = 'up' | 'down' | 'nearest'

/**
 * `m:ss` for a whole number of seconds, `h:mm:ss` from an hour (or always `m:ss` with
 * `hours: false`, as the plan's timeline writes "75:05"). Negative input counts as zero.
 */
export function clockText(seconds: number, options: { hours?: boolean } = {}): string {
  const total = Math.max(0, Math.trunc(seconds))
  const pad = (n: number) => String(n).padStart(2, '0')
  if (options.hours === false || total < 3600) return `${Math.floor(total / 60)}:${pad(total % 60)}`
  return `${Math.floor(total / 3600)}:${pad(Math.floor((total % 3600) / 60))}:${pad(total % 60)}`
}

/**
 * The same for milliseconds. A countdown rounds up (0:00 shows only when the time is up), elapsed
 * time rounds down, a planned figure to the nearest second.
 */
export function clockTextMs(ms: number, rounding: ClockRounding = 'up', options: { hours?: boolean } = {}): string {
  const s = Math.max(0, ms) / 1000
  const whole = rounding === 'up' ? Math.ceil(s) : rounding === 'down' ? Math.floor(s) : Math.round(s)
  return clockText(whole, options)
}

/**
 * Seconds from a time as a cook types it: minutes ("12", "0.5", "7,5") or a clock ("12:30",
 * "1:02:00"); null when it is neither. Seconds and minutes after a colon run 0–59.
 */
export function readClockText(text: string): number | null {
  const t = text.trim().replace(',', '.')
  if (/^\d+(\.\d+)?$/.test(t)) return Math.round(Number(t) * 60)
  const parts = /^(\d+):([0-5]\d)(?::([0-5]\d))?$/.exec(t)
  if (!parts) return null
  const [, a, b, c] = parts
  return c === undefined ? Number(a) * 60 + Number(b) : Number(a) * 3600 + Number(b) * 60 + Number(c)
}
