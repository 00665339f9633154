// Money in integer minor units (pence, cents, yen). The number of minor-unit digits comes from one
// table of ISO 4217 (shared/data/iso4217-minor-units.ts: GBP 2, JPY 0, KWD 3, HUF 2), the same in the
// browser and on the server; Intl only supplies the symbol and the grouping, told how many digits to show.
import { ISO4217_NO_MINOR_UNIT, iso4217MinorDigits } from '../data/iso4217-minor-units'

export class MoneyError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'MoneyError'
  }
}

/** True for an ISO 4217 code the engine knows ("GBP", "EUR", "JPY"). */
export function isCurrencyCode(code: unknown): code is string {
  if (typeof code !== 'string' || !/^[A-Z]{3}$/.test(code)) return false
  const known = (Intl as unknown as { supportedValuesOf?: (k: string) => string[] }).supportedValuesOf
  if (known) return known('currency').includes(code)
  try {
    new Intl.NumberFormat('en', { style: 'currency', currency: code })
    return true
  } catch {
    return false
  }
}

function checkCurrency(currency: string): void {
  if (ISO4217_NO_MINOR_UNIT.includes(currency)) {
    throw new MoneyError(`"${currency}" has no minor unit in ISO 4217 (a metal, fund or test code), so it cannot price food; use a currency such as GBP, EUR or USD`)
  }
  if (!isCurrencyCode(currency)) throw new MoneyError(`"${currency}" is not an ISO 4217 currency code; use three capital letters such as GBP, EUR, USD or JPY`)
}

/** Digits after the decimal point for a currency, from ISO 4217: 2 for GBP and HUF, 0 for JPY, 3 for KWD. */
export function currencyMinorDigits(currency: string): number {
  checkCurrency(currency)
  return iso4217MinorDigits(currency)
}

/** Minor units as a decimal amount of the currency: 249 GBP → 2.49; 250 JPY → 250. */
export function minorToDecimal(minor: number, currency: string): number {
  if (!Number.isInteger(minor)) throw new MoneyError(`Money must be a whole number of minor units, not ${minor}`)
  const d = currencyMinorDigits(currency)
  return Number((minor / 10 ** d).toFixed(d))
}

/** Money for people, in the studio's locale: formatMoney(123450, 'EUR', 'de-DE') → "1.234,50 €". */
export function formatMoney(minor: number, currency: string, locale: string): string {
  const digits = currencyMinorDigits(currency)
  return new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits })
    .format(minorToDecimal(minor, currency))
}

/**
 * A price as written ("2.49", "2,49", "1,234.50", "1.234,50", "250") in minor units, exactly
 * (no floating point). With one separator, it is the decimal point unless exactly three digits
 * follow it in a currency with fewer minor digits ("1,234" GBP is 1234.00). More decimals than
 * the currency has are refused.
 */
export function parseMoneyToMinor(text: string, currency: string): number {
  const digits = currencyMinorDigits(currency)
  const s = String(text ?? '').trim().replace(/\s/g, '')
  const fail = (why: string) => new MoneyError(`"${text}" is not a price ${why}; write it like ${digits ? `2.${'49'.padEnd(digits, '0').slice(0, digits)}` : '250'}`)
  if (!/^\d[\d.,]*$/.test(s)) throw fail(/^-/.test(s) ? '(it is negative)' : '')
  const seps = [...s.matchAll(/[.,]/g)].map((m) => m.index!)
  let whole = s
  let frac = ''
  if (seps.length) {
    const last = seps[seps.length - 1]!
    const lastSep = s[last]!
    const others = seps.slice(0, -1).map((i) => s[i])
    const after = s.slice(last + 1)
    const grouping = others.length === 0 && after.length === 3 && digits < 3
    if (others.some((c) => c === lastSep) || grouping) {
      // all the same separator: grouping only ("1,234,567" or "1,234")
      if (!/^\d{1,3}([.,]\d{3})+$/.test(s) || new Set(seps.map((i) => s[i])).size > 1) throw fail('(its separators do not group thousands)')
      whole = s.replace(/[.,]/g, '')
    } else {
      whole = s.slice(0, last).replace(/[.,]/g, '')
      frac = after
      if (others.length && !/^\d{1,3}([.,]\d{3})*$/.test(s.slice(0, last))) throw fail('(its separators do not group thousands)')
    }
  }
  if (frac.length > digits) throw fail(digits ? `(${currency} has ${digits} decimal places)` : `(${currency} has no decimal places)`)
  if (!/^\d+$/.test(whole) || (frac && !/^\d+$/.test(frac))) throw fail('')
  const minor = Number(whole) * 10 ** digits + Number(frac.padEnd(digits, '0') || '0')
  if (!Number.isSafeInteger(minor)) throw fail('(it is too large)')
  return minor
}

/** Round an exact amount of minor units once, half away from zero, ignoring float noise below 1e-9. */
export function roundMinor(exact: number): number {
  const clean = Number(exact.toPrecision(12))
  return Math.sign(clean) * Math.round(Math.abs(clean))
}
