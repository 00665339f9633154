// The price list's form: what its inputs hold, and the request body made from them. The price is
// typed as a decimal in the currency ("2.49") and sent in exact minor units (249).
import type { UnitId } from '~~/shared/utils/units'
import type { PriceRow } from '~/types/api'

export interface PriceFormDraft {
  item: string
  packageSize: string
  packageUnit: string
  price: string
  currency: string
  shop: string
  boughtOn: string
}

export function emptyPriceDraft(currency: string): PriceFormDraft {
  return { item: '', packageSize: '', packageUnit: 'g', price: '', currency, shop: '', boughtOn: '' }
}

export function priceDraftFrom(p: PriceRow): PriceFormDraft {
  return {
    item: p.item, packageSize: String(p.packageSize), packageUnit: p.packageUnit,
    price: String(minorToDecimal(p.priceMinor, p.currency).toFixed(currencyMinorDigits(p.currency))),
    currency: p.currency, shop: p.shop ?? '', boughtOn: p.boughtOn ?? '',
  }
}

/** The body for POST or PATCH, or the field to fix and what to write there. */
export function priceBodyFrom(d: PriceFormDraft): { body?: Record<string, unknown>; field?: string; message?: string } {
  const currency = d.currency.trim().toUpperCase()
  if (!isCurrencyCode(currency)) return { field: 'currency', message: 'Currency: write the three-letter code of the currency, such as GBP, EUR or USD.' }
  const size = Number(d.packageSize.trim().replace(',', '.'))
  if (!d.packageSize.trim() || !Number.isFinite(size) || size <= 0) return { field: 'packageSize', message: 'Package size: write the package size as a number above zero, such as 500.' }
  let priceMinor: number
  try {
    priceMinor = parseMoneyToMinor(d.price, currency)
  } catch (e) {
    return { field: 'priceMinor', message: `Price: ${(e as Error).message}.` }
  }
  return {
    body: {
      item: d.item.trim(), packageSize: size, packageUnit: d.packageUnit, priceMinor, currency,
      shop: d.shop.trim() || null, boughtOn: d.boughtOn || null,
    },
  }
}

/**
 * Sends price drafts, one at a time: the form's own check first, then `send` with the body; the
 * message and the field to fix come from the check or from the server (useSubmit).
 */
export function usePriceSend() {
  let send = async () => {}
  const { pending, error, field, submit } = useSubmit(() => send())
  async function sendDraft(draft: PriceFormDraft, request: (body: Record<string, unknown>) => Promise<void>) {
    if (pending.value) return
    const made = priceBodyFrom(draft)
    if (!made.body) {
      error.value = made.message!
      field.value = made.field!
      return
    }
    send = () => request(made.body!)
    await submit()
  }
  return { pending, error, field, sendDraft }
}

/** "500 g", "6 each", "1 L". */
export function packageText(size: number, unit: string): string {
  return unit === 'each' ? `${size} each` : `${size} ${unitLabel(unit as UnitId, size)}`
}

/** The units a package can be sold in: each, then every unit id with its label. */
export const PACKAGE_UNITS: Array<{ id: string; label: string }> = [{ id: 'each', label: 'each' }, ...UNIT_IDS.map((u) => ({ id: u as string, label: u === 'cup' ? 'cup (US)' : unitLabel(u) }))]
