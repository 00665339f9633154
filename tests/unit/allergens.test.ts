// Allergen groups (shared/utils/allergens.ts) against Regulation (EU) No 1169/2011 Annex II and
// the US major food allergens (FALCPA 2004, section 203; sesame added by the FASTER Act 2021).
// Which foods contain which allergen is common kitchen knowledge unless a note says otherwise.
import { describe, expect, it } from 'vitest'
import {
  EU_ALLERGENS, EU_US_ALLERGEN_MAP, FDA_TREE_NUTS, US_ALLERGENS, allergenCertaintyText, allergenStateOf, euAllergenLabel, isEuAllergenId, isUsAllergenId,
  listRecipeAllergens, recipeFreeOf, suggestAllergens, usAllergenLabel, type IngredientAllergens,
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
  // FDA Q&A Edition 5 (January 2025), Appendix I: chestnut and coconut are not tree nuts.
  it('chestnuts and coconut → nothing (FDA Q&A Edition 5 removed them)', () => {
    expect(s('cooked chestnuts')).toMatchObject({ eu: [], us: [] })
    expect(s('desiccated coconut')).toMatchObject({ eu: [], us: [] })
  })
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

describe('facts against their sources', () => {
  const s = (item: string) => {
    const r = suggestAllergens(item)
    return { eu: r.eu, us: r.us, why: r.matches.map((m) => m.keyword) }
  }
  // FDA, Questions and Answers Regarding Food Allergens, Edition 5 (January 2025), Appendix I.
  it('the FDA names twelve tree nuts, no chestnut and no coconut (FDA Q&A Edition 5)', () => {
    expect(FDA_TREE_NUTS).toHaveLength(12)
    const names = FDA_TREE_NUTS.join(' ').toLowerCase()
    for (const gone of ['chestnut', 'coconut', 'beech', 'butternut', 'hickory', 'shea', 'ginkgo', 'pili', 'chinquapin', 'lichee']) {
      expect(names, gone).not.toContain(gone)
    }
    for (const nut of ['almond', 'black walnut', 'brazil nut', 'california walnut', 'cashew', 'hazelnut', 'heartnut', 'macadamia', 'pecan', 'pine nut', 'pistachio']) {
      expect(names, nut).toContain(nut)
    }
    expect(EU_US_ALLERGEN_MAP.find((m) => m.eu === 'tree-nuts')!.note).not.toMatch(/chestnut|from memory/)
  })
  it('every FDA tree nut name suggests US tree nuts', () => {
    for (const name of FDA_TREE_NUTS.flatMap((n) => n.replace(/\(.*\)/, '').split('/'))) {
      expect(suggestAllergens(name.trim()).us, name).toEqual(['tree-nuts'])
    }
  })
  // Regulation (EU) No 78/2014 amending Annex II of 1169/2011, item 1: "wheat (such as spelt and khorasan wheat)".
  it('Annex II item 1 follows the wording of Regulation (EU) No 78/2014', () => {
    expect(euAllergenLabel('cereals-gluten')).toContain('wheat (such as spelt and khorasan wheat)')
    expect(euAllergenLabel('cereals-gluten')).not.toMatch(/kamut/i)
    for (const c of ['rye', 'barley', 'oats']) expect(euAllergenLabel('cereals-gluten')).toContain(c)
  })
  // FALCPA 2004 section 203 names bass, flounder and cod as examples of fish; the rest is kitchen knowledge.
  it.each(['sea bass fillets', 'bass', 'flounder', 'dover sole', 'red snapper', 'catfish', 'smoked eel', 'cod roe', 'salmon roe', 'caviar'])(
    'fish: %s', (item) => expect(s(item)).toMatchObject({ eu: ['fish'], us: ['fish'] }),
  )
  it('crustaceans: crawfish', () => expect(s('crawfish tails')).toMatchObject({ eu: ['crustaceans'], us: ['crustacean-shellfish'] }))
  it('soy: hoisin and teriyaki (with wheat), natto', () => {
    expect(s('hoisin sauce')).toMatchObject({ eu: ['cereals-gluten', 'soybeans'], us: ['wheat', 'soybeans'] })
    expect(s('teriyaki marinade')).toMatchObject({ eu: ['cereals-gluten', 'soybeans'] })
    expect(s('natto')).toMatchObject({ eu: ['soybeans'], us: ['soybeans'] })
  })
  it('peanuts: arachis oil and monkey nuts are peanuts, not tree nuts', () => {
    expect(s('arachis oil')).toMatchObject({ eu: ['peanuts'], us: ['peanuts'] })
    expect(s('monkey nuts')).toEqual({ eu: ['peanuts'], us: ['peanuts'], why: ['monkey nut'] })
  })
  it.each(['burrata', 'aged gouda', 'queso fresco', 'skyr', 'vanilla buttercream'])('milk: %s (no word "cheese" or "milk")', (item) =>
    expect(s(item)).toMatchObject({ eu: ['milk'], us: ['milk'] }))
  // Einkorn, emmer, khorasan and spelt are species of Triticum (FDA Q&A Edition 5 reads "wheat" as any Triticum species).
  it.each(['sourdough loaf', 'croutons', 'orzo', 'ramen noodles', 'plain bagels', 'freekeh', 'einkorn', 'emmer', 'khorasan', 'triticale',
    'pie crust', 'ready-rolled shortcrust pastry', 'shortcrust', 'puff pastry', 'gnocchi', 'ravioli'])('wheat: %s', (item) =>
    expect(s(item)).toMatchObject({ us: expect.arrayContaining(['wheat']), eu: expect.arrayContaining(['cereals-gluten']) }))
  it('Worcestershire and Worcester sauce alone → fish', () => {
    expect(s('a dash of Worcestershire')).toMatchObject({ eu: ['fish'] })
    expect(s('Worcester sauce')).toMatchObject({ eu: ['fish'] })
  })
  it('stock cubes: "may contain" celery, flagged as a suggestion to check on the label', () => {
    const r = suggestAllergens('2 chicken stock cubes')
    expect(r.eu).toEqual(['celery'])
    expect(r.matches[0]).toMatchObject({ keyword: 'stock cube', mayContain: true })
    expect(r.matches[0]!.note).toMatch(/check the label/)
    expect(suggestAllergens('vegetable bouillon powder').matches[0]!.mayContain).toBe(true)
  })
})

describe('allergen certainty per ingredient', () => {
  const milk = { eu: ['milk'], us: ['milk'] } as IngredientAllergens
  const none = { eu: [], us: [] } as IngredientAllergens
  it('an ingredient with no state is suggested when it lists something, none declared when not; only checked is checked', () => {
    expect(allergenStateOf({ allergens: milk })).toBe('suggested')
    expect(allergenStateOf({ allergens: none })).toBe('none-declared')
    expect(allergenStateOf({ allergens: none, allergenState: 'checked' })).toBe('checked')
  })
  it('says who checked and when', () => {
    expect(allergenCertaintyText({ allergens: milk, allergenState: 'checked', allergensCheckedBy: 'Ada Cook', allergensCheckedAt: '2026-12-02T10:00:00Z' }))
      .toBe('checked by Ada Cook on 2 December 2026')
    expect(allergenCertaintyText({ allergens: milk })).toBe('suggested from the name, not checked')
    expect(allergenCertaintyText({ allergens: none })).toBe('none declared, not checked')
    // rows saved before certainty was stored are 'suggested', some with nothing suggested (salt)
    expect(allergenCertaintyText({ allergens: none, allergenState: 'suggested' })).toBe('none suggested from the name, not checked')
  })
  it('lists the unchecked items beside each group and for the recipe', () => {
    const list = listRecipeAllergens([
      { item: 'butter', allergens: milk, allergenState: 'checked' },
      { item: 'cream', allergens: milk, allergenState: 'suggested' },
      { item: 'salt', allergens: none },
    ])
    expect(list.eu[0]).toMatchObject({ id: 'milk', items: ['butter', 'cream'], unchecked: ['cream'] })
    expect(list.unchecked).toEqual(['cream', 'salt'])
  })
  it('"free of" counts only checked ingredients and says how many are unchecked', () => {
    const wheat = { eu: ['cereals-gluten'], us: ['wheat'] } as IngredientAllergens
    expect(recipeFreeOf([{ allergens: wheat, allergenState: 'checked' }, { allergens: none, allergenState: 'checked' }], 'milk'))
      .toEqual({ free: true, contains: false, unchecked: 0 })
    expect(recipeFreeOf([{ allergens: wheat, allergenState: 'checked' }, { allergens: none }], 'milk')).toEqual({ free: false, contains: false, unchecked: 1 })
    expect(recipeFreeOf([{ allergens: milk, allergenState: 'checked' }], 'milk')).toMatchObject({ free: false, contains: true })
  })
})
