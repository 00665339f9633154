// Step cautions (shared/utils/cautions.ts). Food-safety figures against USDA FSIS as published,
// °C by NIST SP 811 (t/°C = (t/°F − 32)/1.8, worked by hand below).
import { describe, expect, it } from 'vitest'
import { CAUTIONS, CAUTION_IDS, FOOD_SAFETY_FIGURES, fahrenheitWithCelsius, isCautionId, suggestStepCautions } from '../../shared/utils/cautions'

describe('food-safety figures (USDA FSIS)', () => {
  it('"Danger Zone" 40–140 °F, 2 hours, 1 hour above 90 °F (USDA FSIS, "Danger Zone" (40 °F – 140 °F))', () => {
    expect(FOOD_SAFETY_FIGURES).toMatchObject({ dangerZoneLowF: 40, dangerZoneHighF: 140, hoursOutMax: 2, hotDayF: 90, hoursOutHotDay: 1 })
  })
  it('safe minimum internal temperatures (USDA FSIS, Safe Minimum Internal Temperature Chart)', () => {
    expect(FOOD_SAFETY_FIGURES).toMatchObject({ poultryF: 165, groundMeatF: 160, wholeCutsF: 145, wholeCutsRestMinutes: 3, fishF: 145 })
  })
  it('gives °C to one decimal: (40−32)/1.8 = 4.4, (140−32)/1.8 = 60, (90−32)/1.8 = 32.2, (165−32)/1.8 = 73.9, (160−32)/1.8 = 71.1, (145−32)/1.8 = 62.8', () => {
    expect(fahrenheitWithCelsius(40)).toBe('40 °F (4.4 °C)')
    expect(fahrenheitWithCelsius(140)).toBe('140 °F (60 °C)')
    expect(fahrenheitWithCelsius(90)).toBe('90 °F (32.2 °C)')
    expect(fahrenheitWithCelsius(165)).toBe('165 °F (73.9 °C)')
    expect(fahrenheitWithCelsius(160)).toBe('160 °F (71.1 °C)')
    expect(fahrenheitWithCelsius(145)).toBe('145 °F (62.8 °C)')
  })
})

describe('caution texts', () => {
  it('the hot-holding caution quotes the Danger Zone in °F and °C and the 2-hour rule, and defers to local rules', () => {
    const t = CAUTIONS['hot-holding'].text
    expect(t).toContain('40–140 °F (4.4–60 °C)')
    expect(t).toContain('"Danger Zone"')
    expect(t).toContain('no more than 2 hours (1 hour above 90 °F, 32.2 °C)')
    expect(t).toMatch(/local food-safety rules/)
    expect(CAUTIONS['hot-holding'].source).toMatch(/USDA FSIS/)
  })
  it('the raw-meat caution quotes the FSIS chart and defers to local rules', () => {
    const t = CAUTIONS['raw-meat'].text
    expect(t).toContain('poultry 165 °F (73.9 °C)')
    expect(t).toContain('145 °F (62.8 °C) with a 3-minute rest')
    expect(t).toMatch(/local food-safety rules/)
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
})
