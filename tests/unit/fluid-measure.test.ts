// Fluid measures by studio (shared/utils/fluid-measure.ts). Imperial pint: Weights and Measures Act
// 1985, Schedule 1 (gallon = 4.54609 L exactly, pint = gallon ÷ 8 = 568.26125 mL). US pint: NIST
// Handbook 44, Appendix C (231 in³ gallon ÷ 8 = 473.176473 mL).
import { describe, expect, it } from 'vitest'
import { fluidMeasureForLocale, fluidMeasureText, fluidUnit, studioFluidMeasure } from '../../shared/utils/fluid-measure'
import { parseQuantity } from '../../shared/utils/quantity'
import { readPriceUnit, parsePriceCsv } from '../../shared/utils/price-csv'
import { convertAmount } from '../../shared/utils/units'
import { scaleRecipeIngredients } from '../../shared/utils/scale'

describe('which pint a studio means', () => {
  it('defaults from the locale: en-GB imperial, en-US and others US', () => {
    expect(fluidMeasureForLocale('en-GB')).toBe('imperial')
    expect(fluidMeasureForLocale('cy-GB')).toBe('imperial')
    expect(fluidMeasureForLocale('en-US')).toBe('us')
    expect(fluidMeasureForLocale('de-DE')).toBe('us')
    expect(studioFluidMeasure({ locale: 'en-GB', fluidMeasure: null })).toBe('imperial')
    expect(studioFluidMeasure({ locale: 'en-GB', fluidMeasure: 'us' })).toBe('us')
  })
  it('Weights and Measures Act 1985: an imperial pint is 568.26125 mL, 20.1 % more than the US pint of 473.176 mL', () => {
    expect(convertAmount(1, fluidUnit('pint', 'imperial'), 'ml')).toBeCloseTo(568.26125, 9)
    expect(convertAmount(1, fluidUnit('pint', 'us'), 'ml')).toBeCloseTo(473.176473, 6)
    expect(1 - 473.176473 / 568.26125).toBeCloseTo(0.167, 3) // read as US, a UK pint loses 16.7 %
    expect(fluidUnit('cup', 'imperial')).toBe('cup')
    expect(fluidMeasureText('imperial')).toBe('Imperial fluid measures: 1 pint = 568 mL (UK, Weights and Measures Act 1985)')
    expect(fluidMeasureText('us')).toMatch(/1 pint = 473 mL/)
  })
  it('parsing passes the choice: "1 pint milk" in a UK studio is 568 mL', () => {
    const q = parseQuantity('1 pint milk', { fluid: 'imperial' })
    expect(q.unit).toBe('imp-pint')
    const shown = scaleRecipeIngredients([{ key: 'milk', item: 'milk', min: 1, max: 1, unit: q.unit, prep: null, optional: false, toTaste: false, group: null } as never], 4, 4,
      { system: 'metric' })
    expect(shown.ingredients[0]!.text).toMatch(/^570 mL|^568 mL/)
    expect(convertAmount(1, q.unit!, 'ml')).toBeCloseTo(568.26125, 9)
  })
  it('scaling and display: 3 litres in US units shows imperial pints in an imperial studio, quarts in a US one', () => {
    const ing = [{ key: 'stock', item: 'stock', min: 3, max: 3, unit: 'l', prep: null, optional: false, toTaste: false, group: null } as never]
    // 3000 mL ÷ 568.26125 = 5.28 imperial pints → 5¼; ÷ 946.35 mL = 3.17 US quarts → 3¼
    expect(scaleRecipeIngredients(ing, 4, 4, { system: 'us', fluid: 'imperial' }).ingredients[0]!.text).toBe('5¼ imperial pints')
    expect(scaleRecipeIngredients(ing, 4, 4, { system: 'us', fluid: 'us' }).ingredients[0]!.text).toBe('3¼ quarts')
  })
  it('price lists: a bare "pint" unit is the studio\'s pint; "US pint" and "imperial pint" say which', () => {
    expect(readPriceUnit('pint', 'imperial')).toBe('imp-pint')
    expect(readPriceUnit('pints', 'imperial')).toBe('imp-pint')
    expect(readPriceUnit('pint', 'us')).toBe('pint')
    expect(readPriceUnit('imperial pint', 'us')).toBe('imp-pint')
    const { prices } = parsePriceCsv('item,size,unit,price,currency\nmilk,4,pints,1.45,GBP\n', { fluid: 'imperial' })
    expect(prices[0]!.packageUnit).toBe('imp-pint')
  })
})
