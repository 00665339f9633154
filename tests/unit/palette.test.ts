// Contrast of Hobline's colours, by the definitions of WCAG 2.2 (shared/utils/contrast.ts).
import { describe, expect, it } from 'vitest'
import { palette, setThemes } from '../../tailwind.config'
import { contrastLevel, contrastRatio as contrast, relativeLuminance } from '../../shared/utils/contrast'

describe('contrast formula', () => {
  it('gives 21:1 for black on white, the maximum WCAG defines', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 6)
  })
  it('gives luminance 0 for black and 1 for white (WCAG 2.2 definition of relative luminance)', () => {
    expect(relativeLuminance('#000000')).toBe(0)
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 12)
  })
  it('names the levels at the WCAG 2.2 thresholds: 4.5:1 (SC 1.4.3) and 7:1 (SC 1.4.6)', () => {
    expect(contrastLevel(7)).toBe('AAA')
    expect(contrastLevel(6.99)).toBe('AA')
    expect(contrastLevel(4.5)).toBe('AA')
    expect(contrastLevel(4.49)).toBe('fail')
  })
  it('refuses a colour it cannot read', () => {
    expect(() => relativeLuminance('red')).toThrow(/#rrggbb/)
  })
  it('gives 4.54:1 for #767676 on white, the lightest grey usually quoted as passing AA (from memory)', () => {
    expect(contrast('#767676', '#ffffff')).toBeCloseTo(4.54, 2)
  })
})

describe('set theme (shoot screens) reaches AAA, 7:1, on both backgrounds', () => {
  const texts = ['bone', 'haze', 'saffron', 'ember', 'mint', 'sky'] as const
  for (const bg of ['night', 'panel'] as const) {
    for (const fg of texts) {
      it(`${fg} on ${bg}`, () => {
        expect(contrast(palette.set[fg], palette.set[bg])).toBeGreaterThanOrEqual(7)
      })
    }
  }
})

describe('every contrast theme of the shoot screens reaches AAA, 7:1 (WCAG 2.2 SC 1.4.6)', () => {
  const texts = ['bone', 'haze', 'saffron', 'ember', 'mint', 'sky'] as const
  for (const [name, theme] of Object.entries(setThemes)) {
    for (const bg of ['night', 'panel'] as const) {
      for (const fg of texts) {
        it(`${name}: ${fg} on ${bg}`, () => {
          expect(contrast(theme[fg], theme[bg])).toBeGreaterThanOrEqual(7)
        })
      }
    }
    for (const accent of ['saffron', 'ember', 'mint', 'sky'] as const) {
      it(`${name}: night text on a ${accent} button`, () => {
        expect(contrast(theme.night, theme[accent])).toBeGreaterThanOrEqual(7)
      })
    }
    it(`${name}: names the same colours as the night palette`, () => {
      expect(Object.keys(theme).sort()).toEqual(Object.keys(palette.set).sort())
    })
  }
})

describe('plan theme (planning pages) reaches AA, 4.5:1, for text', () => {
  const texts = ['ink', 'muted', 'paprika', 'basil', 'crust'] as const
  for (const bg of ['paper', 'card'] as const) {
    for (const fg of texts) {
      it(`${fg} on ${bg}`, () => {
        expect(contrast(palette.plan[fg], palette.plan[bg])).toBeGreaterThanOrEqual(4.5)
      })
    }
  }
  it('white text on the primary button', () => {
    expect(contrast('#ffffff', palette.plan.paprika)).toBeGreaterThanOrEqual(4.5)
  })
})

