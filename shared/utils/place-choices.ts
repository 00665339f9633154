// The choices a studio's settings offer for how money and dates are written and which currency
// prices are in, named in words ("English (United Kingdom)", "Euro") rather than as codes. Names
// come from the runtime's Intl.DisplayNames (CLDR); the codes stay what is stored.
import { ISO4217_NO_MINOR_UNIT } from '../data/iso4217-minor-units'

export interface Choice {
  value: string
  label: string
}

/** Language-and-country settings a cooking studio is likely to be in (common practice); any other stays choosable once set. */
export const COMMON_LOCALES = [
  'en-GB', 'en-US', 'en-IE', 'en-AU', 'en-CA', 'en-NZ', 'en-ZA', 'en-IN', 'en-SG', 'de-DE', 'de-AT', 'de-CH', 'fr-FR', 'fr-BE', 'fr-CA', 'fr-CH',
  'es-ES', 'es-MX', 'es-AR', 'it-IT', 'nl-NL', 'nl-BE', 'pt-PT', 'pt-BR', 'sv-SE', 'da-DK', 'nb-NO', 'fi-FI', 'pl-PL', 'cs-CZ', 'hu-HU', 'el-GR',
  'tr-TR', 'ja-JP', 'ko-KR', 'zh-CN', 'zh-TW', 'hi-IN', 'ar-AE', 'he-IL',
] as const

function displayName(type: 'language' | 'currency', code: string, inLocale: string): string {
  try {
    return new Intl.DisplayNames([inLocale, 'en'], { type }).of(code) ?? code
  } catch {
    return code
  }
}

/** The language-and-country choices, named in `inLocale`, with `current` kept when it is not a common one. */
export function localeChoices(current: string, inLocale = 'en-GB'): Choice[] {
  const codes = new Set<string>(COMMON_LOCALES)
  if (current) codes.add(current)
  return [...codes]
    .map((code) => ({ value: code, label: displayName('language', code, inLocale) }))
    .sort((a, b) => a.label.localeCompare(b.label, inLocale))
}

/** Every currency the runtime knows that prices can be in (not gold, funds or test codes), named in `inLocale`. */
export function currencyChoices(current: string, inLocale = 'en-GB'): Choice[] {
  const codes = new Set(Intl.supportedValuesOf('currency').filter((c) => !ISO4217_NO_MINOR_UNIT.includes(c)))
  if (current) codes.add(current)
  return [...codes]
    .map((code) => ({ value: code, label: `${displayName('currency', code, inLocale)} (${code})` }))
    .sort((a, b) => a.label.localeCompare(b.label, inLocale))
}
