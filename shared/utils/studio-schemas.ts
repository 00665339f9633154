// The body of "Open a studio" for a member who is already signed in (POST /api/studios): the studio's
// name, and the locale and currency its money and dates are written in. Each message names the field
// by the label the form gives it (pages/studios/new.vue: Studio name, Locale, Currency). Locales are BCP 47 language tags (as
// Intl reads them); currencies ISO 4217 codes (isCurrencyCode, shared/utils/money.ts).
import { z } from 'zod'
import { isCurrencyCode } from './money'
import { isTimeZone } from './time-zone'

/** Whether a locale is a language tag Intl accepts as written, such as en-GB or de-DE. */
export function isLocaleTag(tag: string): boolean {
  if (!/^[a-z]{2,3}(-[A-Z][a-z]{3})?(-[A-Z]{2}|-\d{3})?$/.test(tag)) return false
  try {
    return Intl.getCanonicalLocales(tag)[0] === tag
  } catch {
    return false
  }
}

/** The new-studio form's labels where they differ from the shared table (shared/utils/field-labels.ts). */
export const NEW_STUDIO_LABELS = { name: 'Studio name' }

export const newStudioBodySchema = z.object({
  name: z.string({ error: 'give the studio a name.' }).trim()
    .min(1, 'give the studio a name.').max(120, 'write at most 120 characters.'),
  locale: z.string({ error: 'choose the language and country from the list.' }).trim()
    .refine(isLocaleTag, 'choose the language and country from the list (written like en-GB or de-DE).'),
  currency: z.string({ error: 'choose the currency from the list.' }).trim().toUpperCase()
    .refine(isCurrencyCode, 'choose the currency from the list (a three-letter code such as GBP, EUR or USD).'),
  timeZone: z.string({ error: 'choose the time zone from the list.' }).refine(isTimeZone, 'choose the time zone from the list, such as Europe/London.')
    .optional().default('UTC'),
})
