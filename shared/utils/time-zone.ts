// A studio's time zone (an IANA Time Zone Database name such as "Europe/London"), so the times it
// sends out, such as when an invitation stops working, are written in the studio's own local time
// with the zone's abbreviation ("14:30 GMT"), not in UTC.
import type { Choice } from './place-choices'

/** Whether the runtime knows `name` as a time zone. */
export function isTimeZone(name: unknown): name is string {
  if (typeof name !== 'string' || name.length === 0 || name.length > 64) return false
  try {
    new Intl.DateTimeFormat('en', { timeZone: name })
    return true
  } catch {
    return false
  }
}

/** Every time zone the runtime knows, as "Europe/London" → "Europe / London", with `current` kept. */
export function timeZoneChoices(current: string): Choice[] {
  const names = new Set([...Intl.supportedValuesOf('timeZone'), 'UTC'])
  if (current) names.add(current)
  return [...names].sort().map((value) => ({ value, label: value.replaceAll('_', ' ').replaceAll('/', ' / ') }))
}

/**
 * A moment in words in a time zone: "Wednesday, 9 December 2026 at 14:30 GMT". English words; a
 * locale in another language falls back to British English rather than mix languages.
 */
export function dateTimeInZone(when: Date, locale: string, timeZone: string): string {
  const english = /^en(-|$)/i.test(locale) && Intl.DateTimeFormat.supportedLocalesOf([locale]).length > 0
  const zone = isTimeZone(timeZone) ? timeZone : 'UTC'
  const format = new Intl.DateTimeFormat(english ? locale : 'en-GB', {
    weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone: zone,
  })
  if (zone === 'UTC') return `${format.format(when)} UTC`
  const abbreviation = new Intl.DateTimeFormat(english ? locale : 'en-GB', { timeZone: zone, timeZoneName: 'short' })
    .formatToParts(when).find((p) => p.type === 'timeZoneName')?.value ?? zone
  return `${format.format(when)} ${abbreviation}`
}
