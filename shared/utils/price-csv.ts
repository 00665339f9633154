// A studio price list uploaded as CSV: one price a row, columns item, package size, unit, price,
// currency, shop, date (header names matched loosely: "Package size", "package_size", "size").
// Comma, semicolon or tab separated (detected from the header). Every fault is reported with its
// line number and column; good rows are kept even when others are wrong, so nothing typed is lost.
import { UNIT_NAMES } from '../data/unit-names'
import { parseCsv } from './csv'
import { isCurrencyCode, parseMoneyToMinor } from './money'
import { isUnitId, type UnitId } from './units'
import type { StudioPrice } from './cost'
import { fluidUnit, type FluidMeasure } from './fluid-measure'

export type PriceDraft = Omit<StudioPrice, 'id'> & { line: number }

export interface PriceCsvError {
  line: number
  column: string | null
  message: string
}

type Column = 'item' | 'packageSize' | 'unit' | 'price' | 'currency' | 'shop' | 'date'

const HEADERS: Record<Column, string[]> = {
  item: ['item', 'name', 'ingredient', 'product'],
  packageSize: ['package size', 'pack size', 'size', 'package', 'quantity', 'qty'],
  unit: ['unit', 'package unit', 'pack unit', 'units'],
  price: ['price', 'package price', 'cost'],
  currency: ['currency'],
  shop: ['shop', 'store', 'supplier', 'retailer'],
  date: ['date', 'price date', 'date seen'],
}
const LABEL: Record<Column, string> = { item: 'item', packageSize: 'package size', unit: 'unit', price: 'price', currency: 'currency', shop: 'shop', date: 'date' }
const EACH = new Set(['each', 'ea', 'item', 'items', 'unit', 'units', 'whole'])

const norm = (h: string) => h.trim().toLowerCase().replace(/[_\-\s]+/g, ' ')

/**
 * A unit as a price list writes it: a unit id, a unit name ("grams", "fl oz"), or "each" (null). A bare
 * "pint", "quart", "gallon" or "fl oz" is the studio's (imperial in a UK studio); "US pint" and
 * "imperial pint" say which.
 */
export function readPriceUnit(text: string, fluid: FluidMeasure = 'us'): UnitId | null | undefined {
  const t = text.trim()
  if (!t || EACH.has(t.toLowerCase())) return null
  if (isUnitId(t)) return fluidUnit(t, fluid)
  const hit = UNIT_NAMES.find((u) => (u.caseSensitive ? u.name === t : u.name === t.toLowerCase().replace(/\.$/, '')))
  if (!hit) return undefined
  return hit.generic === 'fluid' ? fluidUnit(hit.id, fluid) : hit.id
}

function validDate(s: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s)
  if (!m) return false
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])))
  return d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3])
}

export function parsePriceCsv(
  text: string, options: { defaultCurrency?: string; fluid?: FluidMeasure } = {},
): { prices: PriceDraft[]; errors: PriceCsvError[] } {
  const { records, errors: csvErrors } = parseCsv(text)
  const errors: PriceCsvError[] = csvErrors.map((e) => ({ line: e.line, column: null, message: e.message }))
  const header = records[0]
  if (!header) return { prices: [], errors: [...errors, { line: 1, column: null, message: 'The file is empty; the first line must name the columns: item, package size, unit, price, currency, shop, date' }] }

  const index: Partial<Record<Column, number>> = {}
  header.fields.forEach((h, i) => {
    const col = (Object.keys(HEADERS) as Column[]).find((c) => HEADERS[c].includes(norm(h)))
    if (!col) {
      if (h.trim()) errors.push({ line: header.line, column: h.trim(), message: `Line ${header.line}: column "${h.trim()}" is not one Hobline reads; it is ignored` })
    } else if (index[col] !== undefined) errors.push({ line: header.line, column: LABEL[col], message: `Line ${header.line}: two columns are "${LABEL[col]}"; keep one` })
    else index[col] = i
  })
  const required: Column[] = ['item', 'packageSize', 'unit', 'price', ...(options.defaultCurrency ? [] : (['currency'] as Column[]))]
  const absent = required.filter((c) => index[c] === undefined)
  if (absent.length) {
    errors.push({ line: header.line, column: null, message: `Line ${header.line}: the header has no ${absent.map((c) => `"${LABEL[c]}"`).join(', ')} column; the columns are: item, package size, unit, price, currency, shop, date` })
    return { prices: [], errors }
  }

  const prices: PriceDraft[] = []
  for (const rec of records.slice(1)) {
    const at = rec.line
    const rowErrors: PriceCsvError[] = []
    const bad = (col: Column, why: string) => rowErrors.push({ line: at, column: LABEL[col], message: `Line ${at}, ${LABEL[col]}: ${why}` })
    const get = (col: Column) => (index[col] === undefined ? '' : (rec.fields[index[col]!] ?? '').trim())
    if (rec.fields.length > header.fields.length) {
      rowErrors.push({ line: at, column: null, message: `Line ${at} has ${rec.fields.length} fields but the header has ${header.fields.length}; put a field holding the separator in double quotes` })
    }
    const item = get('item')
    if (!item) bad('item', 'empty; name the item')
    const sizeText = get('packageSize')
    const packageSize = /^\d+([.,]\d+)?$/.test(sizeText) ? Number(sizeText.replace(',', '.')) : Number.NaN
    if (!(packageSize > 0)) bad('packageSize', `"${sizeText}" is not a package size; write a number above zero, like 500 or 1.5`)
    const unitText = get('unit')
    const packageUnit = readPriceUnit(unitText, options.fluid)
    if (packageUnit === undefined) bad('unit', `"${unitText}" is not a unit Hobline knows; use g, kg, ml, l, oz, lb, tsp, cup, or "each"`)
    const currency = (get('currency') || options.defaultCurrency || '').toUpperCase()
    let priceMinor = Number.NaN
    if (!isCurrencyCode(currency)) bad('currency', currency ? `"${currency}" is not an ISO 4217 currency code; use three letters such as GBP, EUR or USD` : 'empty; write the currency code, such as GBP')
    else {
      try {
        priceMinor = parseMoneyToMinor(get('price'), currency)
      } catch (e) {
        bad('price', (e as Error).message)
      }
    }
    const date = get('date')
    if (date && !validDate(date)) bad('date', `"${date}" is not a date; write it as YYYY-MM-DD, like 2026-11-30`)
    if (rowErrors.length) errors.push(...rowErrors)
    else prices.push({ line: at, item, packageSize, packageUnit: packageUnit ?? null, priceMinor, currency, shop: get('shop') || null, date: date || null })
  }
  return { prices, errors: errors.sort((a, b) => a.line - b.line) }
}
