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

/** The offset of `timeZone` from UTC at the moment `utcMs`, in ms (Europe/London in July: +3 600 000). */
function zoneOffsetMs(utcMs: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit',
  }).formatToParts(new Date(utcMs))
  const n = (type: string) => Number(parts.find((p) => p.type === type)?.value)
  return Date.UTC(n('year'), n('month') - 1, n('day'), n('hour'), n('minute'), n('second')) - Math.floor(utcMs / 1000) * 1000
}

/**
 * The moment a wall-clock time on a day happens in a time zone: ('2026-12-10', '08:30', 'Europe/London')
 * → 2026-12-10T08:30:00Z (GMT in December), ('2026-07-10', '08:30', 'Europe/London') → 07:30Z (BST).
 * The offset is read twice, so a time just after a change of offset lands right; a time that a
 * change skips (01:30 on the spring-forward night) comes out an hour later, as a clock would show it.
 */
export function zonedTimeToUtc(date: string, time: string, timeZone: string): Date {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number]
  const [h, min] = time.split(':').map(Number) as [number, number]
  const zone = isTimeZone(timeZone) ? timeZone : 'UTC'
  const wall = Date.UTC(y, m - 1, d, h, min)
  const first = wall - zoneOffsetMs(wall, zone)
  return new Date(wall - zoneOffsetMs(first, zone))
}
