// Allergen groups: the 14 of Regulation (EU) No 1169/2011 Annex II and the 9 major food
// allergens of the United States (FALCPA 2004, plus sesame by the FASTER Act 2021, in force
// 1 January 2023); the mapping between them; the tree nuts the FDA names (Questions and Answers
// Regarding Food Allergens, Edition 5, January 2025, Appendix I: twelve, no chestnut, no coconut); and suggestions from an ingredient's name by a
// keyword table (shared/data/allergen-keywords.ts). Suggestions are for the user to confirm:
// a recipe lists what the user confirmed, and product labels always win.
import { ALLERGEN_KEYWORDS } from '../data/allergen-keywords'

export const EU_ALLERGENS = [
  { id: 'cereals-gluten', annexItem: 1, label: 'Cereals containing gluten (wheat (such as spelt and khorasan wheat), rye, barley, oats)' },
  { id: 'crustaceans', annexItem: 2, label: 'Crustaceans' },
  { id: 'eggs', annexItem: 3, label: 'Eggs' },
  { id: 'fish', annexItem: 4, label: 'Fish' },
  { id: 'peanuts', annexItem: 5, label: 'Peanuts' },
  { id: 'soybeans', annexItem: 6, label: 'Soybeans' },
  { id: 'milk', annexItem: 7, label: 'Milk (including lactose)' },
  { id: 'tree-nuts', annexItem: 8, label: 'Nuts (almonds, hazelnuts, walnuts, cashews, pecans, Brazil nuts, pistachios, macadamia)' },
  { id: 'celery', annexItem: 9, label: 'Celery' },
  { id: 'mustard', annexItem: 10, label: 'Mustard' },
  { id: 'sesame', annexItem: 11, label: 'Sesame seeds' },
  { id: 'sulphites', annexItem: 12, label: 'Sulphur dioxide and sulphites (above 10 mg/kg or 10 mg/L as SO₂)' },
  { id: 'lupin', annexItem: 13, label: 'Lupin' },
  { id: 'molluscs', annexItem: 14, label: 'Molluscs' },
] as const
export type EuAllergenId = (typeof EU_ALLERGENS)[number]['id']

export const US_ALLERGENS = [
  { id: 'milk', law: 'FALCPA 2004', label: 'Milk' },
  { id: 'eggs', law: 'FALCPA 2004', label: 'Eggs' },
  { id: 'fish', law: 'FALCPA 2004', label: 'Fish' },
  { id: 'crustacean-shellfish', law: 'FALCPA 2004', label: 'Crustacean shellfish' },
  { id: 'tree-nuts', law: 'FALCPA 2004', label: 'Tree nuts' },
  { id: 'peanuts', law: 'FALCPA 2004', label: 'Peanuts' },
  { id: 'wheat', law: 'FALCPA 2004', label: 'Wheat' },
  { id: 'soybeans', law: 'FALCPA 2004', label: 'Soybeans' },
  { id: 'sesame', law: 'FASTER Act 2021', label: 'Sesame' },
] as const
export type UsAllergenId = (typeof US_ALLERGENS)[number]['id']

/**
 * The tree nuts the FDA considers major food allergens, by common or usual name: Questions and Answers
 * Regarding Food Allergens (Edition 5, January 2025), Appendix I. Twelve; beech nut, butternut, chestnut,
 * chinquapin, coconut, ginkgo, hickory, lichee, pili and shea nut were removed from the earlier list.
 */
export const FDA_TREE_NUTS = [
  'Almond', 'Black walnut', 'Brazil nut', 'California walnut', 'Cashew', 'Filbert/Hazelnut', 'Heartnut/Japanese walnut',
  'Macadamia nut/Bush nut', 'Pecan', 'Pine nut/Pinon nut', 'Pistachio', 'Walnut (English, Persian)',
] as const

/** What an ingredient contains, in both lists (stored with the ingredient). */
export interface IngredientAllergens {
  eu: EuAllergenId[]
  us: UsAllergenId[]
}

/**
 * How sure an ingredient's allergens are: 'suggested' (read from its name by the keyword table, nobody
 * has checked), 'checked' (a person checked the label: who and when are stored beside it), or
 * 'none-declared' (nothing is known: no keyword matched and nobody has checked). Only 'checked' is
 * evidence that an ingredient is free of something.
 */
export const ALLERGEN_STATES = ['suggested', 'checked', 'none-declared'] as const
export type AllergenState = (typeof ALLERGEN_STATES)[number]

export interface AllergenCertainty {
  allergenState?: AllergenState | null
  allergensCheckedBy?: string | null
  allergensCheckedAt?: string | Date | null
}

/** The state of an ingredient that does not say: suggested when it lists something, none declared when not. */
export function allergenStateOf(i: { allergens: IngredientAllergens } & AllergenCertainty): AllergenState {
  if (i.allergenState && (ALLERGEN_STATES as readonly string[]).includes(i.allergenState)) return i.allergenState
  return i.allergens.eu.length || i.allergens.us.length ? 'suggested' : 'none-declared'
}

/** "checked by Ada Lovelace on 2 December 2026", "suggested from the name, not checked", "none declared, not checked". */
export function allergenCertaintyText(i: { allergens: IngredientAllergens } & AllergenCertainty, locale = 'en-GB'): string {
  const state = allergenStateOf(i)
  if (state === 'checked') {
    const when = i.allergensCheckedAt ? new Date(i.allergensCheckedAt) : null
    const date = when && !Number.isNaN(when.getTime()) ? ` on ${when.toLocaleDateString(locale, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' })}` : ''
    return `checked${i.allergensCheckedBy ? ` by ${i.allergensCheckedBy}` : ''}${date}`
  }
  if (state === 'none-declared') return 'none declared, not checked'
  return i.allergens.eu.length || i.allergens.us.length ? 'suggested from the name, not checked' : 'none suggested from the name, not checked'
}

export interface AllergenMapping {
  eu: EuAllergenId
  us: UsAllergenId | null
  relation: 'same' | 'partial' | 'none'
  note: string
}

/** Each EU group beside its US counterpart. */
export const EU_US_ALLERGEN_MAP: readonly AllergenMapping[] = [
  { eu: 'cereals-gluten', us: 'wheat', relation: 'partial', note: 'Wheat is one of the EU cereals; rye, barley and oats are EU-only.' },
  { eu: 'crustaceans', us: 'crustacean-shellfish', relation: 'same', note: '' },
  { eu: 'eggs', us: 'eggs', relation: 'same', note: '' },
  { eu: 'fish', us: 'fish', relation: 'same', note: '' },
  { eu: 'peanuts', us: 'peanuts', relation: 'same', note: '' },
  { eu: 'soybeans', us: 'soybeans', relation: 'same', note: '' },
  { eu: 'milk', us: 'milk', relation: 'same', note: '' },
  { eu: 'tree-nuts', us: 'tree-nuts', relation: 'partial', note: 'The EU names eight nuts; the FDA names twelve tree nuts (Q&A Edition 5, January 2025), among them pine nuts and four walnuts.' },
  { eu: 'celery', us: null, relation: 'none', note: 'Not a US major allergen.' },
  { eu: 'mustard', us: null, relation: 'none', note: 'Not a US major allergen.' },
  { eu: 'sesame', us: 'sesame', relation: 'same', note: 'US major allergen since 1 January 2023 (FASTER Act 2021).' },
  { eu: 'sulphites', us: null, relation: 'none', note: 'Not a US major allergen (US rules declare sulfites separately).' },
  { eu: 'lupin', us: null, relation: 'none', note: 'Not a US major allergen.' },
  { eu: 'molluscs', us: null, relation: 'none', note: 'Not a US major allergen: FALCPA names crustacean shellfish only.' },
]

export function isEuAllergenId(v: unknown): v is EuAllergenId {
  return EU_ALLERGENS.some((a) => a.id === v)
}
export function isUsAllergenId(v: unknown): v is UsAllergenId {
  return US_ALLERGENS.some((a) => a.id === v)
}
export function euAllergenLabel(id: EuAllergenId): string {
  return EU_ALLERGENS.find((a) => a.id === id)!.label
}
export function usAllergenLabel(id: UsAllergenId): string {
  return US_ALLERGENS.find((a) => a.id === id)!.label
}

/** Lower case, accents and apostrophes dropped, everything else that is not a letter or digit a space. */
function normaliseName(s: string): string {
  return ` ${s.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/['’]/g, '').replace(/[^a-z0-9]+/g, ' ').trim()} `
}

function keywordPattern(kw: string): RegExp {
  const esc = kw.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
  const body = esc.endsWith('y') ? `${esc.slice(0, -1)}(?:y|ies)` : `${esc}(?:s|es)?`
  return new RegExp(` ${body} `)
}

const compiled = ALLERGEN_KEYWORDS.flatMap((entry) =>
  entry.keywords.map((kw) => ({ kw: normaliseName(kw).trim(), re: keywordPattern(normaliseName(kw).trim()), entry })),
).sort((a, b) => b.kw.length - a.kw.length)

export interface AllergenMatch {
  keyword: string
  eu: EuAllergenId[]
  us: UsAllergenId[]
  note?: string
  /** A compound item (stock cube): the groups are what it often contains, to check on its label. */
  mayContain?: boolean
}

export interface AllergenSuggestion extends IngredientAllergens {
  /** Why: each keyword found in the item and what it suggested. */
  matches: AllergenMatch[]
}

const EU_ORDER = EU_ALLERGENS.map((a) => a.id) as EuAllergenId[]
const US_ORDER = US_ALLERGENS.map((a) => a.id) as UsAllergenId[]

/**
 * Allergen groups an ingredient's name suggests, and why. Longer keywords are matched first and
 * consume their words, so "peanut butter" suggests peanuts and not milk, and "coconut milk" nothing.
 */
export function suggestAllergens(item: string): AllergenSuggestion {
  let text = normaliseName(item)
  const matches: AllergenMatch[] = []
  for (const { kw, re, entry } of compiled) {
    const m = re.exec(text)
    if (!m) continue
    text = text.slice(0, m.index) + ' '.repeat(m[0].length - 1) + text.slice(m.index + m[0].length - 1)
    matches.push({
      keyword: kw, eu: [...entry.eu], us: [...entry.us], ...(entry.note ? { note: entry.note } : {}), ...(entry.mayContain ? { mayContain: true } : {}),
    })
  }
  const eu = EU_ORDER.filter((id) => matches.some((m) => m.eu.includes(id)))
  const us = US_ORDER.filter((id) => matches.some((m) => m.us.includes(id)))
  return { eu, us, matches }
}

export interface RecipeAllergenEntry<Id> {
  id: Id
  label: string
  /** Items that contain it, in recipe order. */
  items: string[]
  /** True when only optional ingredients contain it. */
  optionalOnly: boolean
  /** Of `items`, those whose allergens nobody has checked (suggested from the name). */
  unchecked: string[]
}

/** The allergens of a recipe from its ingredients' confirmed allergens, in the order of each list. */
export function listRecipeAllergens(ingredients: ReadonlyArray<{ item: string; optional?: boolean; allergens: IngredientAllergens } & AllergenCertainty>): {
  eu: RecipeAllergenEntry<EuAllergenId>[]
  us: RecipeAllergenEntry<UsAllergenId>[]
  /** Every ingredient whose allergens nobody has checked, in recipe order. */
  unchecked: string[]
} {
  const collect = <Id extends string>(order: Id[], pick: (a: IngredientAllergens) => readonly string[], label: (id: Id) => string) =>
    order
      .map((id) => {
        const having = ingredients.filter((i) => pick(i.allergens).includes(id))
        return {
          id, label: label(id), items: having.map((i) => i.item), optionalOnly: having.every((i) => i.optional === true),
          unchecked: having.filter((i) => allergenStateOf(i) !== 'checked').map((i) => i.item),
        }
      })
      .filter((e) => e.items.length > 0)
  return {
    eu: collect(EU_ORDER, (a) => a.eu, euAllergenLabel),
    us: collect(US_ORDER, (a) => a.us, usAllergenLabel),
    unchecked: ingredients.filter((i) => allergenStateOf(i) !== 'checked').map((i) => i.item),
  }
}

/**
 * Whether a recipe is free of an allergen group (EU or US id), counting only checked ingredients: it is
 * free when no ingredient lists the group and every ingredient has been checked. `unchecked` says how
 * many ingredients stand between a "maybe" and a "yes".
 */
export function recipeFreeOf(
  ingredients: ReadonlyArray<{ allergens: IngredientAllergens } & AllergenCertainty>, id: string,
): { free: boolean; contains: boolean; unchecked: number } {
  const contains = ingredients.some((i) => (i.allergens.eu as string[]).includes(id) || (i.allergens.us as string[]).includes(id))
  const unchecked = ingredients.filter((i) => allergenStateOf(i) !== 'checked').length
  return { free: !contains && unchecked === 0, contains, unchecked }
}
