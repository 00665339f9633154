// Allergen groups (shared/utils/allergens.ts) against Regulation (EU) No 1169/2011 Annex II and
// the US major food allergens (FALCPA 2004, section 203; sesame added by the FASTER Act 2021).
// Which foods contain which allergen is common kitchen knowledge unless a note says otherwise.
import { describe, expect, it } from 'vitest'
import {
  EU_ALLERGENS, EU_US_ALLERGEN_MAP, US_ALLERGENS, euAllergenLabel, isEuAllergenId, isUsAllergenId, listRecipeAllergens,
  suggestAllergens, usAllergenLabel,
} from '../../shared/utils/allergens'

describe('the lists', () => {
  it('EU 1169/2011 Annex II has 14 groups, numbered 1–14 in the Annex order', () => {
    expect(EU_ALLERGENS.map((a) => a.id)).toEqual([
      'cereals-gluten', 'crustaceans', 'eggs', 'fish', 'peanuts', 'soybeans', 'milk', 'tree-nuts',
      'celery', 'mustard', 'sesame', 'sulphites', 'lupin', 'molluscs',
    ])
    expect(EU_ALLERGENS.map((a) => a.annexItem)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14])
  })
  it('Annex II item 12 states the 10 mg/kg or 10 mg/L threshold; item 8 names the eight nuts', () => {
    expect(euAllergenLabel('sulphites')).toMatch(/10 mg\/kg or 10 mg\/L/)
    for (const nut of ['almonds', 'hazelnuts', 'walnuts', 'cashews', 'pecans', 'Brazil nuts', 'pistachios', 'macadamia']) {
      expect(euAllergenLabel('tree-nuts')).toContain(nut)
    }
  })
  it('the US has 9: the 8 of FALCPA 2004 plus sesame by the FASTER Act 2021', () => {
    expect(US_ALLERGENS).toHaveLength(9)
    expect(US_ALLERGENS.filter((a) => a.law === 'FALCPA 2004').map((a) => a.id).sort()).toEqual(
      ['crustacean-shellfish', 'eggs', 'fish', 'milk', 'peanuts', 'soybeans', 'tree-nuts', 'wheat'],
    )
    expect(US_ALLERGENS.find((a) => a.id === 'sesame')!.law).toBe('FASTER Act 2021')
    expect(usAllergenLabel('crustacean-shellfish')).toBe('Crustacean shellfish')
  })
  it('maps every EU group to its US counterpart or none', () => {
    expect(EU_US_ALLERGEN_MAP.map((m) => m.eu)).toEqual(EU_ALLERGENS.map((a) => a.id))
    const by = Object.fromEntries(EU_US_ALLERGEN_MAP.map((m) => [m.eu, m]))
    expect(by['cereals-gluten']).toMatchObject({ us: 'wheat', relation: 'partial' })
    expect(by.crustaceans).toMatchObject({ us: 'crustacean-shellfish', relation: 'same' })
    expect(by.molluscs).toMatchObject({ us: null, relation: 'none' }) // FALCPA names crustacean shellfish only
    expect(by.sesame).toMatchObject({ us: 'sesame', relation: 'same' })
    for (const id of ['celery', 'mustard', 'sulphites', 'lupin'] as const) expect(by[id]!.us).toBeNull()
    // every US allergen has an EU counterpart
    for (const us of US_ALLERGENS) expect(EU_US_ALLERGEN_MAP.some((m) => m.us === us.id)).toBe(true)
  })
  it('checks ids', () => {
    expect(isEuAllergenId('lupin')).toBe(true)
    expect(isEuAllergenId('wheat')).toBe(false)
    expect(isUsAllergenId('wheat')).toBe(true)
    expect(isUsAllergenId('celery')).toBe(false)
  })
})

describe('suggestAllergens from the ingredient name, with the matched keyword', () => {
  const s = (item: string) => {
    const r = suggestAllergens(item)
    return { eu: r.eu, us: r.us, why: r.matches.map((m) => m.keyword) }
  }
  it('butter → milk', () => expect(s('unsalted butter')).toEqual({ eu: ['milk'], us: ['milk'], why: ['butter'] }))
  it('soy sauce → soybeans and cereals containing gluten (wheat)', () =>
    expect(s('light soy sauce')).toEqual({ eu: ['cereals-gluten', 'soybeans'], us: ['wheat', 'soybeans'], why: ['soy sauce'] }))
  it('tahini → sesame', () => expect(s('tahini')).toEqual({ eu: ['sesame'], us: ['sesame'], why: ['tahini'] }))
  it('prawns → crustaceans (plural read)', () => expect(s('raw king prawns')).toEqual({ eu: ['crustaceans'], us: ['crustacean-shellfish'], why: ['prawn'] }))
  it('mussels → molluscs in the EU, nothing in the US', () => expect(s('mussels')).toEqual({ eu: ['molluscs'], us: [], why: ['mussel'] }))
  it('anchovies → fish ("y" → "ies" plural)', () => expect(s('anchovies in oil').eu).toEqual(['fish']))
  it('plain flour → wheat; rice flour → nothing', () => {
    expect(s('plain flour').us).toEqual(['wheat'])
    expect(s('rice flour')).toEqual({ eu: [], us: [], why: ['rice flour'] })
  })
  it('rolled oats → EU cereals containing gluten but not US wheat', () => expect(s('rolled oats')).toMatchObject({ eu: ['cereals-gluten'], us: [] }))
  it('pine nuts → US tree nuts only (not among the eight EU nuts)', () => expect(s('toasted pine nuts')).toMatchObject({ eu: [], us: ['tree-nuts'] }))
  it('egg noodles → eggs and wheat; brioche → wheat, eggs, milk', () => {
    expect(s('egg noodles')).toMatchObject({ eu: ['cereals-gluten', 'eggs'], us: ['eggs', 'wheat'] })
    expect(s('brioche buns')).toMatchObject({ eu: ['cereals-gluten', 'eggs', 'milk'] })
  })
  it('reads accents and apostrophes: crème fraîche and goat\'s cheese → milk', () => {
    expect(s('crème fraîche').eu).toEqual(['milk'])
    expect(s("goat's cheese").eu).toEqual(['milk'])
  })
  it('longer keywords win: peanut butter is peanuts, not milk; coconut milk, cocoa butter and butter beans are neither', () => {
    expect(s('smooth peanut butter')).toEqual({ eu: ['peanuts'], us: ['peanuts'], why: ['peanut butter'] })
    expect(s('coconut milk')).toMatchObject({ eu: [], us: [] })
    expect(s('cocoa butter')).toMatchObject({ eu: [], us: [] })
    expect(s('butter beans')).toMatchObject({ eu: [], us: [] })
  })
  it('matches whole words only: eggplant, nutmeg, butternut squash, basmati rice suggest nothing', () => {
    for (const item of ['eggplant', 'nutmeg', 'butternut squash', 'basmati rice', 'kale']) expect(s(item), item).toMatchObject({ eu: [], us: [] })
  })
  it('combines several keywords and carries notes for doubtful ones', () => {
    const r = suggestAllergens('mayonnaise with Dijon mustard')
    expect(r.eu).toEqual(['eggs', 'mustard'])
    const w = suggestAllergens('dry white wine')
    expect(w.eu).toEqual(['sulphites'])
    expect(w.matches[0]!.note).toMatch(/check the label/)
  })
})

describe('listRecipeAllergens', () => {
  it('lists each group with the items that contain it, in list order, and flags optional-only groups', () => {
    const list = listRecipeAllergens([
      { item: 'butter', allergens: { eu: ['milk'], us: ['milk'] } },
      { item: 'plain flour', allergens: { eu: ['cereals-gluten'], us: ['wheat'] } },
      { item: 'parmesan', optional: true, allergens: { eu: ['milk'], us: ['milk'] } },
      { item: 'toasted sesame seeds', optional: true, allergens: { eu: ['sesame'], us: ['sesame'] } },
      { item: 'salt', allergens: { eu: [], us: [] } },
    ])
    expect(list.eu.map((e) => [e.id, e.items, e.optionalOnly])).toEqual([
      ['cereals-gluten', ['plain flour'], false],
      ['milk', ['butter', 'parmesan'], false],
      ['sesame', ['toasted sesame seeds'], true],
    ])
    expect(list.us.map((e) => e.id)).toEqual(['milk', 'wheat', 'sesame'])
    expect(list.us[1]!.label).toBe('Wheat')
  })
})
