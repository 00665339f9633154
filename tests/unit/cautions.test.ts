// Step cautions (shared/utils/cautions.ts). Food-safety figures against USDA FSIS as published
// (Safe Minimum Internal Temperature Chart; "Danger Zone" (40 °F – 140 °F)) and UK food hygiene
// guidance on hot holding (63 °C or above); °C by NIST SP 811 (t/°C = (t/°F − 32)/1.8, worked by
// hand below) and rounded the safe way to whole degrees.
import { describe, expect, it } from 'vitest'
import {
  CAUTIONS, CAUTION_IDS, FOOD_SAFETY_FIGURES, UK_HOT_HOLDING_C, cautionsFor, countryOfLocale, fahrenheitWithCelsius, isCautionId, safeCelsius,
  suggestStepCautions,
} from '../../shared/utils/cautions'

describe('food-safety figures (USDA FSIS)', () => {
  it('"Danger Zone" 40–140 °F, 2 hours, 1 hour above 90 °F (USDA FSIS, "Danger Zone" (40 °F – 140 °F))', () => {
    expect(FOOD_SAFETY_FIGURES).toMatchObject({ dangerZoneLowF: 40, dangerZoneHighF: 140, hoursOutMax: 2, hotDayF: 90, hoursOutHotDay: 1 })
  })
  it('safe minimum internal temperatures (USDA FSIS, Safe Minimum Internal Temperature Chart)', () => {
    expect(FOOD_SAFETY_FIGURES).toMatchObject({ poultryF: 165, groundMeatF: 160, wholeCutsF: 145, wholeCutsRestMinutes: 3, fishF: 145 })
  })
  it('shellfish 145 °F, egg dishes 160 °F, leftovers 165 °F, ground poultry 165 °F (USDA FSIS, Safe Minimum Internal Temperature Chart)', () => {
    expect(FOOD_SAFETY_FIGURES).toMatchObject({ shellfishF: 145, eggDishesF: 160, leftoversF: 165, groundPoultryF: 165 })
  })
  it('UK hot holding is 63 °C or above (UK food hygiene guidance on hot holding)', () => expect(UK_HOT_HOLDING_C).toBe(63))
  it('rounds °C the safe way: a minimum up, a limit to stay below down', () => {
    // (165−32)/1.8 = 73.9 → 74; (160−32)/1.8 = 71.1 → 72; (145−32)/1.8 = 62.8 → 63; (140−32)/1.8 = 60 exactly
    expect(fahrenheitWithCelsius(165)).toBe('165 °F (74 °C)')
    expect(fahrenheitWithCelsius(160)).toBe('160 °F (72 °C)')
    expect(fahrenheitWithCelsius(145)).toBe('145 °F (63 °C)')
    expect(fahrenheitWithCelsius(140)).toBe('140 °F (60 °C)')
    // (40−32)/1.8 = 4.4 → 4 and (90−32)/1.8 = 32.2 → 32: limits to stay below round down
    expect(safeCelsius(40, 'max')).toBe(4)
    expect(safeCelsius(90, 'max')).toBe(32)
    for (let f = 32; f <= 212; f++) {
      const c = (f - 32) / 1.8
      expect(safeCelsius(f, 'min'), String(f)).toBeGreaterThanOrEqual(c - 1e-9)
      expect(safeCelsius(f, 'max'), String(f)).toBeLessThanOrEqual(c + 1e-9)
    }
  })
})

describe('hot holding by the studio\'s country, the other beside it', () => {
  it('reads the country from the locale', () => {
    expect(countryOfLocale('en-GB')).toBe('GB')
    expect(countryOfLocale('en-US')).toBe('US')
    expect(countryOfLocale('fr')).toBe('US')
  })
  it('a UK studio sees 63 °C first (UK food hygiene guidance) and USDA FSIS 140 °F (60 °C) beside it', () => {
    const t = cautionsFor('GB')['hot-holding'].text
    expect(t.indexOf('63 °C')).toBeGreaterThan(-1)
    expect(t.indexOf('63 °C')).toBeLessThan(t.indexOf('140 °F (60 °C)'))
    expect(cautionsFor('GB')['hot-holding'].source).toMatch(/^UK food hygiene guidance on hot holding \(63 °C\)/)
  })
  it('a US studio sees USDA FSIS 140 °F (60 °C) first and the UK 63 °C beside it', () => {
    const t = cautionsFor('US')['hot-holding'].text
    expect(t.indexOf('140 °F (60 °C)')).toBeLessThan(t.indexOf('63 °C'))
    expect(t).toMatch(/local food-safety rules/)
  })
})

describe('caution texts', () => {
  it('the hot-holding caution quotes the Danger Zone in °F and °C and the 2-hour rule, and defers to local rules', () => {
    const t = CAUTIONS['hot-holding'].text
    expect(t).toContain('40–140 °F (4–60 °C)')
    expect(t).toContain('"Danger Zone"')
    expect(t).toContain('no more than 2 hours (1 hour above 90 °F, 32 °C)')
    expect(t).toMatch(/local food-safety rules/)
    expect(CAUTIONS['hot-holding'].source).toMatch(/USDA FSIS/)
  })
  it('the raw-meat caution quotes the FSIS chart and defers to local rules', () => {
    const t = CAUTIONS['raw-meat'].text
    expect(t).toContain('poultry 165 °F (74 °C)')
    expect(t).toContain('ground meat 160 °F (72 °C), ground poultry 165 °F (74 °C)')
    expect(t).toContain('145 °F (63 °C) with a 3-minute rest')
    expect(t).toContain('fish and shellfish 145 °F (63 °C)')
    expect(t).toMatch(/local food-safety rules/)
  })
  it('egg dishes 160 °F and leftovers 165 °F (USDA FSIS), each deferring to local rules; the allergen caution does too', () => {
    expect(CAUTIONS['egg-dish'].text).toContain('160 °F (72 °C)')
    expect(CAUTIONS.reheating.text).toContain('165 °F (74 °C)')
    for (const id of ['egg-dish', 'reheating', 'allergen', 'raw-meat', 'hot-holding'] as const) {
      expect(CAUTIONS[id].text, id).toMatch(/Follow your local food-safety rules\.$/)
    }
  })
  it('has every id with a label, a text and a source; trade advice is marked common practice', () => {
    expect(CAUTION_IDS).toEqual(expect.arrayContaining(['hot-oil', 'oven', 'knife', 'blending-hot', 'allergen', 'hot-holding']))
    for (const id of CAUTION_IDS) {
      expect(CAUTIONS[id]).toMatchObject({ id })
      expect(CAUTIONS[id].label.length).toBeGreaterThan(2)
      expect(CAUTIONS[id].text.length).toBeGreaterThan(40)
      expect(CAUTIONS[id].source.length).toBeGreaterThan(5)
    }
    expect(CAUTIONS['hot-oil'].source).toBe('common practice')
    expect(isCautionId('knife')).toBe(true)
    expect(isCautionId('lava')).toBe(false)
  })
})

describe('suggestStepCautions', () => {
  it('suggests cautions from a step and says which word suggested each', () => {
    expect(suggestStepCautions('Deep-fry the fritters in batches until golden.')).toEqual([{ id: 'hot-oil', matched: 'Deep-fry' }])
    expect(suggestStepCautions('Finely chop the onion.')).toEqual([{ id: 'knife', matched: 'chop' }])
    expect(suggestStepCautions('Roast in the oven for 40 minutes.').map((c) => c.id)).toEqual(['oven'])
  })
  it('suggests blending-hot only when the blended liquid is hot', () => {
    expect(suggestStepCautions('Blend the hot soup until smooth.').map((c) => c.id)).toContain('blending-hot')
    expect(suggestStepCautions('Blend the berries with yoghurt.').map((c) => c.id)).not.toContain('blending-hot')
  })
  it('suggests raw-meat and hot-holding, and nothing for a plain step', () => {
    expect(suggestStepCautions('Pat the chicken thighs dry.').map((c) => c.id)).toEqual(['raw-meat'])
    expect(suggestStepCautions('Keep warm in a low oven until serving.').map((c) => c.id)).toEqual(['oven', 'hot-holding'])
    expect(suggestStepCautions('Stir in the yoghurt.')).toEqual([])
  })
  it('suggests a hot pan for a hot dry pan, egg dish and reheating where the text names them, shellfish as raw', () => {
    expect(suggestStepCautions('Cook each round in a hot dry pan until puffed.').map((c) => c.id)).toEqual(['hot-pan'])
    expect(suggestStepCautions('Pour the eggs in and cook the frittata until set.').map((c) => c.id)).toContain('egg-dish')
    expect(suggestStepCautions('Reheat the leftovers until steaming.').map((c) => c.id)).toContain('reheating')
    expect(suggestStepCautions('Scrub the mussels.').map((c) => c.id)).toEqual(['raw-meat'])
  })
})
