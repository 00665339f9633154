// Minor-unit digits (shared/data/iso4217-minor-units.ts, shared/utils/money.ts) against ISO 4217
// List One, "Minor unit" column: HUF, COP and IDR have 2 (CLDR, which Intl follows, says 0), JPY 0,
// KWD 3, CLF 4; XAU has none ("N.A."). The same table serves the browser, which parses prices, and
// the server, which formats them, so a price typed in one is read the same in the other.
import { describe, expect, it } from 'vitest'
import { ISO4217_MINOR_DIGITS, iso4217MinorDigits } from '../../shared/data/iso4217-minor-units'
import { currencyMinorDigits, formatMoney, isCurrencyCode, minorToDecimal, parseMoneyToMinor } from '../../shared/utils/money'

describe('minor-unit digits from ISO 4217, not from the runtime', () => {
  it('ISO 4217: HUF, COP and IDR have 2 minor-unit digits', () => {
    for (const c of ['HUF', 'COP', 'IDR']) expect(currencyMinorDigits(c), c).toBe(2)
  })
  it('ISO 4217: JPY, KRW, ISK, CLP 0; BHD, KWD, JOD, OMR, TND 3; CLF 4; GBP, EUR, USD 2', () => {
    for (const c of ['JPY', 'KRW', 'ISK', 'CLP', 'VND']) expect(currencyMinorDigits(c), c).toBe(0)
    for (const c of ['BHD', 'KWD', 'JOD', 'OMR', 'TND', 'IQD', 'LYD']) expect(currencyMinorDigits(c), c).toBe(3)
    expect(iso4217MinorDigits('CLF')).toBe(4) // a unit of account this runtime's Intl does not list
    for (const c of ['GBP', 'EUR', 'USD', 'CHF', 'INR']) expect(currencyMinorDigits(c), c).toBe(2)
  })
  it('ISO 4217: gold (XAU) has no minor unit and is refused as a price currency', () => {
    expect(() => currencyMinorDigits('XAU')).toThrow(/no minor unit in ISO 4217/)
  })
  it('does not follow whatever Intl says: a runtime whose Intl gives HUF 0 digits still reads 2', () => {
    const intlDigits = new Intl.NumberFormat('en', { style: 'currency', currency: 'HUF' }).resolvedOptions().maximumFractionDigits
    expect(iso4217MinorDigits('HUF')).toBe(2)
    expect(currencyMinorDigits('HUF')).toBe(2)
    // Whatever this runtime's CLDR says (this Node says 0), "1234,50" HUF is 123 450 minor units both ways.
    expect([0, 2]).toContain(intlDigits)
    expect(parseMoneyToMinor('1234,50', 'HUF')).toBe(123_450)
    expect(minorToDecimal(123_450, 'HUF')).toBe(1234.5)
    expect(formatMoney(123_450, 'HUF', 'en')).toMatch(/1,234\.50/)
    expect(formatMoney(150_000, 'IDR', 'en')).toMatch(/1,500\.00/)
  })
  it('a price parsed and then formatted keeps its value for every tabled currency and a 2-digit one', () => {
    const codes = [...Object.keys(ISO4217_MINOR_DIGITS), 'COP'].filter((c) => isCurrencyCode(c))
    expect(codes.length).toBeGreaterThan(20)
    for (const c of codes) {
      const d = currencyMinorDigits(c)
      const text = d ? `12.${'3'.repeat(d)}` : '12'
      const minor = parseMoneyToMinor(text, c)
      expect(minorToDecimal(minor, c), c).toBe(Number(text))
    }
  })
})
