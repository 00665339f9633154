// Kitchen units (shared/utils/units.ts) against their published definitions.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  UNIT_IDS, UnitConversionError, convertAmount, convertTemperature, isUnitId, nearestGasMark, ovenTemperatureText,
  unitBaseSize, unitKind, unitLabel, type UnitId,
} from '../../shared/utils/units'

describe('US customary volume, NIST Handbook 44 Appendix C (gallon = 231 in³ = 3.785411784 L)', () => {
  // Values computed by hand from the gallon: 3785.411784 mL / 128 = 29.5735295625 mL per fl oz.
  it('fluid ounce = 1/128 gallon = 29.5735295625 mL', () => {
    expect(convertAmount(1, 'floz', 'ml')).toBeCloseTo(29.5735295625, 10)
  })
  it('cup = 8 fl oz = 236.5882365 mL', () => {
    expect(convertAmount(1, 'cup', 'ml')).toBeCloseTo(236.5882365, 9)
  })
  it('tablespoon = ½ fl oz = 14.78676478125 mL; teaspoon = 1/6 fl oz = 4.92892159375 mL', () => {
    expect(convertAmount(1, 'tbsp', 'ml')).toBeCloseTo(14.78676478125, 11)
    expect(convertAmount(1, 'tsp', 'ml')).toBeCloseTo(4.92892159375, 11)
  })
  it('pint = 16 fl oz = 473.176473 mL; quart = 32 fl oz = 946.352946 mL; gallon = 3.785411784 L', () => {
    expect(convertAmount(1, 'pint', 'ml')).toBeCloseTo(473.176473, 9)
    expect(convertAmount(1, 'quart', 'ml')).toBeCloseTo(946.352946, 9)
    expect(convertAmount(1, 'gallon', 'l')).toBeCloseTo(3.785411784, 12)
  })
  it('gives the kitchen ratios exactly: 3 tsp = 1 tbsp, 16 tbsp = 1 cup, 2 cups = 1 pint, 4 quarts = 1 gallon', () => {
    expect(convertAmount(3, 'tsp', 'tbsp')).toBe(1)
    expect(convertAmount(16, 'tbsp', 'cup')).toBe(1)
    expect(convertAmount(48, 'tsp', 'cup')).toBe(1)
    expect(convertAmount(2, 'cup', 'pint')).toBe(1)
    expect(convertAmount(2, 'pint', 'quart')).toBe(1)
    expect(convertAmount(4, 'quart', 'gallon')).toBe(1)
    expect(convertAmount(1, 'cup', 'floz')).toBe(8)
  })
})

describe('avoirdupois mass, NIST Handbook 44 Appendix C (international pound of 1959)', () => {
  it('pound = 0.45359237 kg exactly', () => {
    expect(convertAmount(1, 'lb', 'kg')).toBeCloseTo(0.45359237, 14)
    expect(convertAmount(1, 'lb', 'g')).toBeCloseTo(453.59237, 11)
  })
  it('ounce = 1/16 lb = 28.349523125 g', () => {
    expect(convertAmount(1, 'oz', 'g')).toBeCloseTo(28.349523125, 11)
    expect(convertAmount(16, 'oz', 'lb')).toBe(1)
  })
  it('metric prefixes: 1 kg = 1000 g = 10⁶ mg', () => {
    expect(convertAmount(1, 'kg', 'g')).toBe(1000)
    expect(convertAmount(1, 'g', 'mg')).toBe(1000)
  })
})

describe('UK imperial volume, Weights and Measures Act 1985 Schedule 1 (gallon = 4.54609 L)', () => {
  it('pint = gallon/8 = 568.26125 mL; fluid ounce = pint/20 = 28.4130625 mL; quart = 2 pints', () => {
    expect(convertAmount(1, 'imp-gallon', 'l')).toBeCloseTo(4.54609, 12)
    expect(convertAmount(1, 'imp-pint', 'ml')).toBeCloseTo(568.26125, 10)
    expect(convertAmount(1, 'imp-floz', 'ml')).toBeCloseTo(28.4130625, 11)
    expect(convertAmount(1, 'imp-quart', 'imp-pint')).toBe(2)
    expect(convertAmount(20, 'imp-floz', 'imp-pint')).toBe(1)
  })
  it('keeps imperial and US pints apart: 1 imperial pint ≈ 1.200950 US pints', () => {
    // 568.26125 / 473.176473 = 1.2009499…, computed from the two definitions above.
    expect(convertAmount(1, 'imp-pint', 'pint')).toBeCloseTo(1.20095, 5)
  })
})

describe('metric cup (250 mL, the Australian, New Zealand and Canadian convention; no statute)', () => {
  it('is 250 mL and about 1.0567 US cups', () => {
    expect(convertAmount(1, 'metric-cup', 'ml')).toBe(250)
    // 250 / 236.5882365 = 1.05668821…
    expect(convertAmount(1, 'metric-cup', 'cup')).toBeCloseTo(1.0566882, 6)
  })
})

describe('mass ↔ volume only through a density', () => {
  it('converts with a given density (water at about 1 g/mL: 1 cup → 236.588 g)', () => {
    expect(convertAmount(1, 'cup', 'g', { gramsPerMl: 1 })).toBeCloseTo(236.5882365, 9)
    expect(convertAmount(236.5882365, 'g', 'cup', { gramsPerMl: 1 })).toBeCloseTo(1, 12)
    // 125 g per US cup (USDA SR Legacy NDB 20081, all-purpose flour; from memory) → 1 lb is about 3.63 cups
    const flour = 125 / 236.5882365
    expect(convertAmount(1, 'lb', 'cup', { gramsPerMl: flour })).toBeCloseTo(453.59237 / 125, 10)
  })
  it('refuses without a density and names the item', () => {
    expect(() => convertAmount(1, 'cup', 'g', { item: 'rolled oats' })).toThrow(/No density is known for "rolled oats"/)
    expect(() => convertAmount(1, 'cup', 'g')).toThrow(UnitConversionError)
    let caught: unknown
    try {
      convertAmount(2, 'oz', 'tbsp', { item: 'honey', gramsPerMl: 0 })
    } catch (e) {
      caught = e
    }
    expect(caught).toBeInstanceOf(UnitConversionError)
    expect((caught as UnitConversionError).code).toBe('no-density')
  })
  it('refuses to convert counted units and unknown units, saying what to use', () => {
    expect(() => convertAmount(2, 'clove', 'g')).toThrow(/cloves.*counted/)
    expect(() => convertAmount(1, 'cup', 'bucket' as UnitId)).toThrow(/"bucket" is not a unit.*tsp, tbsp/)
    expect(() => convertAmount(Number.NaN, 'cup', 'ml')).toThrow(/finite/)
    expect(convertAmount(3, 'clove', 'clove')).toBe(3)
  })
})

describe('unit facts', () => {
  it('names units as cooks write them, singular and plural', () => {
    expect(unitLabel('cup', 1)).toBe('cup')
    expect(unitLabel('cup', 2)).toBe('cups')
    expect(unitLabel('cup', 0.5)).toBe('cup')
    expect(unitLabel('pinch', 3)).toBe('pinches')
    expect(unitLabel('ml', 500)).toBe('mL')
  })
  it('knows kinds, ids and base sizes', () => {
    expect(unitKind('tbsp')).toBe('volume')
    expect(unitKind('oz')).toBe('mass')
    expect(unitKind('clove')).toBe('count')
    expect(isUnitId('metric-cup')).toBe(true)
    expect(isUnitId('toString')).toBe(false)
    expect(unitBaseSize('l')).toBe(1000)
    for (const id of ['tsp', 'tbsp', 'cup', 'floz', 'pint', 'quart', 'ml', 'l', 'g', 'kg', 'oz', 'lb', 'metric-cup'] as const) {
      expect(UNIT_IDS).toContain(id)
    }
  })
})

describe('round trips (property tests)', () => {
  const measured = UNIT_IDS.filter((u) => unitKind(u) !== 'count')
  const volumes = measured.filter((u) => unitKind(u) === 'volume')
  const masses = measured.filter((u) => unitKind(u) === 'mass')
  it('converting there and back returns the amount (same kind)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.constantFrom(...measured), fc.constantFrom(...measured), (v, a, b) => {
        fc.pre(unitKind(a) === unitKind(b))
        const back = convertAmount(convertAmount(v, a, b), b, a)
        expect(Math.abs(back - v) / v).toBeLessThan(1e-12)
      }),
    )
  })
  it('converting volume → mass → volume through a density returns the amount', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
        fc.constantFrom(...volumes),
        fc.constantFrom(...masses),
        fc.double({ min: 0.05, max: 3, noNaN: true }),
        (v, vol, mass, d) => {
          const back = convertAmount(convertAmount(v, vol, mass, { gramsPerMl: d }), mass, vol, { gramsPerMl: d })
          expect(Math.abs(back - v) / v).toBeLessThan(1e-12)
        },
      ),
    )
  })
  it('°C → °F → °C returns the temperature', () => {
    fc.assert(
      fc.property(fc.double({ min: -273.15, max: 1000, noNaN: true }), (c) => {
        expect(convertTemperature(convertTemperature(c, 'C'), 'F')).toBeCloseTo(c, 9)
      }),
    )
  })
})

describe('temperature, NIST SP 811 (t/°C = (t/°F − 32)/1.8)', () => {
  it('fixed points: 32 °F = 0 °C, 212 °F = 100 °C, −40 °F = −40 °C', () => {
    expect(convertTemperature(32, 'F')).toBe(0)
    expect(convertTemperature(212, 'F')).toBe(100)
    expect(convertTemperature(-40, 'F')).toBe(-40)
    expect(convertTemperature(100, 'C')).toBe(212)
  })
  it('oven settings: 350 °F = 176.67 °C; 180 °C = 356 °F; 220 °C = 428 °F', () => {
    expect(convertTemperature(350, 'F')).toBeCloseTo(176.6667, 4)
    expect(convertTemperature(180, 'C')).toBeCloseTo(356, 10)
    expect(convertTemperature(220, 'C')).toBeCloseTo(428, 10)
  })
  it('shows an oven setting in the other scale to 5 degrees, keeping the exact value (rounding: common practice)', () => {
    expect(ovenTemperatureText(180, 'C')).toEqual({ text: '355 °F', exact: 356, scale: 'F' })
    expect(ovenTemperatureText(350, 'F').text).toBe('175 °C') // 176.67 °C
    expect(ovenTemperatureText(425, 'F').text).toBe('220 °C') // 218.33 °C
  })
  it('refuses an unknown scale or a non-number', () => {
    expect(() => convertTemperature(1, 'K' as 'C')).toThrow(/"C" or "F"/)
    expect(() => convertTemperature(Number.POSITIVE_INFINITY, 'C')).toThrow(/finite/)
  })
})

describe('gas marks, always approximate (common practice: mark n ≈ 250 °F + 25 °F·n; from memory)', () => {
  it('180 °C and 350 °F are gas mark 4; 220 °C is mark 7; 475 °F is mark 9', () => {
    expect(nearestGasMark(180).mark).toBe(4)
    expect(nearestGasMark(350, 'F').mark).toBe(4)
    expect(nearestGasMark(220).mark).toBe(7)
    expect(nearestGasMark(475, 'F')).toMatchObject({ mark: 9, nominalF: 475, approximate: true })
  })
  it('labels every answer approximate and says tables disagree beyond 1–8', () => {
    const g = nearestGasMark(190)
    expect(g.approximate).toBe(true)
    expect(g.note).toMatch(/disagree.*beyond marks 1–8/)
  })
  it('clamps to 1–9 and says so outside the dial', () => {
    expect(nearestGasMark(100)).toMatchObject({ mark: 1 })
    expect(nearestGasMark(100).note).toMatch(/cooler than gas mark 1/)
    expect(nearestGasMark(300)).toMatchObject({ mark: 9 })
    expect(nearestGasMark(300).note).toMatch(/hotter than gas mark 9/)
  })
})
