// Price list upload: the CSV reader (shared/utils/csv.ts) against RFC 4180 section 2, and the
// price rows (shared/utils/price-csv.ts) with line-numbered errors. Prices are Brackenford Test
// Kitchen's (invented). Minor units per ISO 4217 through Intl (GBP 2, JPY 0).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { detectCsvDelimiter, parseCsv } from '../../shared/utils/csv'
import { parsePriceCsv, readPriceUnit } from '../../shared/utils/price-csv'

describe('parseCsv, RFC 4180 section 2', () => {
  it('rule 1–2: records end with CRLF (or LF, CR); the last line break is optional', () => {
    expect(parseCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx').records.map((r) => r.fields)).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']])
    expect(parseCsv('a,b\nc,d\n').records.map((r) => r.fields)).toEqual([['a', 'b'], ['c', 'd']])
    expect(parseCsv('a,b\rc,d').records.map((r) => r.fields)).toEqual([['a', 'b'], ['c', 'd']])
  })
  it('rule 4: spaces are part of a field', () => {
    expect(parseCsv(' a , b ').records[0]!.fields).toEqual([' a ', ' b '])
  })
  it('rule 5–6: quoted fields may hold commas and line breaks', () => {
    const r = parseCsv('"aaa","b\r\nbb","c,cc"\r\nzzz,yyy,xxx')
    expect(r.records.map((x) => x.fields)).toEqual([['aaa', 'b\r\nbb', 'c,cc'], ['zzz', 'yyy', 'xxx']])
    expect(r.records.map((x) => x.line)).toEqual([1, 3]) // the second record starts on line 3
  })
  it('rule 7: a double quote inside a quoted field is written twice', () => {
    expect(parseCsv('"aaa","b""bb","ccc"').records[0]!.fields).toEqual(['aaa', 'b"bb', 'ccc'])
  })
  it('keeps empty fields, skips blank lines and a byte-order mark', () => {
    const r = parseCsv('\uFEFFa,,c\n\n\nd,e,')
    expect(r.records).toEqual([{ line: 1, fields: ['a', '', 'c'] }, { line: 4, fields: ['d', 'e', ''] }])
  })
  it('reports an unclosed quote and stray quotes with line numbers', () => {
    expect(parseCsv('a,b\n"never closed,c\nd').errors).toEqual([{ line: 2, message: 'Line 2: a quoted field is never closed; end it with a double quote (")' }])
    const stray = parseCsv('a,b\nx"y,z\n"q"r,s\nok,1')
    expect(stray.errors.map((e) => e.line)).toEqual([2, 3])
    expect(stray.errors[1]!.message).toMatch(/text after a closing quote/)
    expect(stray.records.map((x) => x.fields[0])).toEqual(['a', 'ok'])
  })
  it('detects comma, semicolon and tab from the header', () => {
    expect(detectCsvDelimiter('item;size;unit\n1,5;2')).toBe(';')
    expect(detectCsvDelimiter('item\tsize')).toBe('\t')
    expect(detectCsvDelimiter('"a;b",c')).toBe(',')
    expect(detectCsvDelimiter('single')).toBe(',')
  })
  it('reads back what an RFC 4180 writer writes (property)', () => {
    const quote = (f: string) => (/[",\r\n]/.test(f) || f === '' ? `"${f.replace(/"/g, '""')}"` : f)
    fc.assert(
      fc.property(fc.array(fc.array(fc.string(), { minLength: 2, maxLength: 5 }), { minLength: 1, maxLength: 6 }), fc.constantFrom('\r\n', '\n'), (rows, eol) => {
        const text = rows.map((r) => r.map(quote).join(',')).join(eol)
        const parsed = parseCsv(text, ',')
        expect(parsed.errors).toEqual([])
        expect(parsed.records.map((r) => r.fields)).toEqual(rows)
      }),
    )
  })
})

describe('parsePriceCsv', () => {
  const good = [
    'item,package size,unit,price,currency,shop,date',
    'plain flour,1.5,kg,1.15,GBP,Millbrook Grocers,2026-11-28',
    'eggs,6,each,1.89,GBP,Millbrook Grocers,2026-11-28',
    '"butter, unsalted",250,g,2.10,GBP,"The ""Corner"" Dairy",',
    'milk,2,imperial pints,0.95,GBP,,2026-11-30',
  ].join('\r\n')
  it('reads good rows into prices in minor units, with line numbers', () => {
    const r = parsePriceCsv(good)
    expect(r.errors).toEqual([])
    expect(r.prices).toEqual([
      { line: 2, item: 'plain flour', packageSize: 1.5, packageUnit: 'kg', priceMinor: 115, currency: 'GBP', shop: 'Millbrook Grocers', date: '2026-11-28' },
      { line: 3, item: 'eggs', packageSize: 6, packageUnit: null, priceMinor: 189, currency: 'GBP', shop: 'Millbrook Grocers', date: '2026-11-28' },
      { line: 4, item: 'butter, unsalted', packageSize: 250, packageUnit: 'g', priceMinor: 210, currency: 'GBP', shop: 'The "Corner" Dairy', date: null },
      { line: 5, item: 'milk', packageSize: 2, packageUnit: 'imp-pint', priceMinor: 95, currency: 'GBP', shop: null, date: '2026-11-30' },
    ])
  })
  it('matches header names loosely and reads semicolon files with decimal commas', () => {
    const r = parsePriceCsv('Item;Package_Size;Unit;Price;Currency\nKartoffeln;2,5;kg;3,49;EUR\nReis;1;kg;250;JPY')
    expect(r.errors).toEqual([])
    expect(r.prices.map((p) => [p.item, p.packageSize, p.priceMinor, p.currency])).toEqual([['Kartoffeln', 2.5, 349, 'EUR'], ['Reis', 1, 250, 'JPY']])
  })
  it('uses the studio currency when the file has no currency column', () => {
    const r = parsePriceCsv('item,size,unit,price\nonions,1,kg,0.89', { defaultCurrency: 'GBP' })
    expect(r.prices[0]).toMatchObject({ currency: 'GBP', priceMinor: 89 })
  })
  it('reports each bad row by line and column, says what to fix, and keeps the good rows', () => {
    const r = parsePriceCsv([
      'item,package size,unit,price,currency,shop,date',
      'plain flour,1.5,kg,1.15,GBP,,', //              2: good
      ',500,g,1.00,GBP,,', //                          3: no item
      'rice,0,kg,1.00,GBP,,', //                       4: size zero
      'oats,1,bucket,1.00,GBP,,', //                   5: unknown unit
      'tea,80,each,2.4.9,GBP,,', //                    6: bad price
      'yen thing,1,kg,250.5,JPY,,', //                 7: JPY has no decimals
      'sugar,1,kg,0.99,XYZ,,', //                      8: unknown currency
      'salt,750,g,0.65,GBP,,2026-02-30', //            9: no such date
      'pepper,100,g,1.20,GBP,Shop,2026-11-28,extra', // 10: too many fields
    ].join('\n'))
    expect(r.prices.map((p) => p.line)).toEqual([2])
    expect(r.errors.map((e) => [e.line, e.column])).toEqual([
      [3, 'item'], [4, 'package size'], [5, 'unit'], [6, 'price'], [7, 'price'], [8, 'currency'], [9, 'date'], [10, null],
    ])
    expect(r.errors[0]!.message).toBe('Line 3, item: empty; name the item')
    expect(r.errors[2]!.message).toMatch(/^Line 5, unit: "bucket" is not a unit Hobline knows/)
    expect(r.errors[4]!.message).toMatch(/JPY has no decimal places/)
    expect(r.errors[6]!.message).toMatch(/"2026-02-30" is not a date; write it as YYYY-MM-DD/)
  })
  it('refuses a file without the needed columns, naming them', () => {
    const r = parsePriceCsv('name,cost\nflour,1.00')
    expect(r.prices).toEqual([])
    expect(r.errors.at(-1)!.message).toMatch(/the header has no "package size", "unit", "currency" column/)
    expect(parsePriceCsv('').errors[0]!.message).toMatch(/The file is empty/)
  })
  it('notes unknown and duplicate columns on line 1', () => {
    const r = parsePriceCsv('item,size,unit,price,currency,colour,price\nx,1,g,1,GBP,red,2')
    expect(r.errors.map((e) => e.message)).toEqual([
      'Line 1: column "colour" is not one Hobline reads; it is ignored',
      'Line 1: two columns are "price"; keep one',
    ])
  })
  it('reads price-list units: ids, names and "each"', () => {
    expect(readPriceUnit('kg')).toBe('kg')
    expect(readPriceUnit('Grams')).toBe('g')
    expect(readPriceUnit('fl oz')).toBe('floz')
    expect(readPriceUnit('imp-pint')).toBe('imp-pint')
    expect(readPriceUnit('each')).toBeNull()
    expect(readPriceUnit('')).toBeNull()
    expect(readPriceUnit('bucket')).toBeUndefined()
  })
})
