// A studio's times in its own zone. Offsets checked against the IANA Time Zone Database rules for
// Europe/London (GMT in winter, BST = UTC+1 from the last Sunday of March to the last Sunday of
// October) and America/New_York (EST = UTC−5 in December), as published with tzdata.
import { describe, expect, it } from 'vitest'
import { dateTimeInZone, isTimeZone, timeZoneChoices } from '../../shared/utils/time-zone'
import { currencyChoices, localeChoices } from '../../shared/utils/place-choices'

describe('time zones', () => {
  it('knows IANA names and refuses others', () => {
    expect(isTimeZone('Europe/London')).toBe(true)
    expect(isTimeZone('UTC')).toBe(true)
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false)
    expect(isTimeZone('')).toBe(false)
    expect(isTimeZone(3)).toBe(false)
  })

  it('writes a moment in the studio\'s local time with its abbreviation', () => {
    const winter = new Date(Date.UTC(2026, 11, 9, 14, 30))
    expect(dateTimeInZone(winter, 'en-GB', 'UTC')).toBe('Wednesday, 9 December 2026 at 14:30 UTC')
    expect(dateTimeInZone(winter, 'en-GB', 'Europe/London')).toBe('Wednesday, 9 December 2026 at 14:30 GMT')
    // A zone's abbreviation is the one its locale uses: "EST" in American English, "GMT-5" in British.
    expect(dateTimeInZone(winter, 'en-US', 'America/New_York')).toBe('Wednesday, December 9, 2026 at 09:30 EST')
    expect(dateTimeInZone(winter, 'en-GB', 'America/New_York')).toBe('Wednesday, 9 December 2026 at 09:30 GMT-5')
    // Summer time in London: 14:30 UTC is 15:30 BST on 1 July 2026.
    expect(dateTimeInZone(new Date(Date.UTC(2026, 6, 1, 14, 30)), 'en-GB', 'Europe/London')).toBe('Wednesday, 1 July 2026 at 15:30 BST')
    // Across midnight: 23:30 UTC on 9 December is 10 December in Tokyo (UTC+9, no summer time).
    expect(dateTimeInZone(new Date(Date.UTC(2026, 11, 9, 23, 30)), 'en-GB', 'Asia/Tokyo')).toMatch(/^Thursday, 10 December 2026 at 08:30 /)
  })

  it('lists zones, languages and currencies by name, keeping a value already chosen', () => {
    const zones = timeZoneChoices('Europe/London')
    expect(zones.find((z) => z.value === 'Europe/London')?.label).toBe('Europe / London')
    expect(zones.some((z) => z.value === 'UTC')).toBe(true)
    const locales = localeChoices('cy-GB')
    expect(locales.find((l) => l.value === 'en-GB')?.label).toBe('British English')
    expect(locales.some((l) => l.value === 'cy-GB')).toBe(true)
    const currencies = currencyChoices('GBP')
    expect(currencies.find((c) => c.value === 'GBP')?.label).toBe('British Pound (GBP)')
    // Gold and test codes are not currencies prices are in (ISO 4217 minor unit "N.A.").
    expect(currencies.some((c) => c.value === 'XAU' || c.value === 'XTS')).toBe(false)
  })
})
