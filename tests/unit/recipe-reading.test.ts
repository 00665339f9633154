// Reading recipes as pages write them: a corpus of ingredient lines and step texts written for
// these tests (tests/fixtures/ingredient-lines.tsv, step-texts.tsv), each with its expected
// reading. Add a line here for every misreading found.
// Amounts are compared as written (1½ cups is 1.5 US cups), not converted; the conversions the
// display makes are checked in scale.test.ts and below against their sources.
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { parseQuantity } from '../../shared/utils/quantity'
import { readStepTime } from '../../shared/utils/step-time-read'
import { formatIngredientAmount } from '../../shared/utils/scale'
import { conversionSource, statedDensity } from '../../shared/utils/stated-density'
import { convertAmount } from '../../shared/utils/units'
import { importSchemaOrgRecipe } from '../../shared/utils/schemaorg-import'
import { recipeCreateSchema } from '../../shared/utils/recipe-schemas'

function table(name: string): string[][] {
  const rows = readFileSync(resolve(import.meta.dirname, '../fixtures', name), 'utf8').split('\n').filter((l) => l && !l.startsWith('#'))
  return rows.slice(1).map((r) => r.split('\t'))
}
const opt = (v: string | undefined) => (v === undefined || v === '-' ? null : v)
const num = (v: string) => (v === '-' ? null : Number(v))
const round = (v: number | null) => (v === null ? null : Math.round(v * 1e6) / 1e6)

function measure(v: string) {
  if (v === '-') return null
  const [amount, unit] = v.split(' ')
  const [lo, hi] = amount!.split('-').map(Number)
  return { min: lo!, max: hi ?? lo!, unit: unit! }
}

const ingredientRows = table('ingredient-lines.tsv')
const stepRows = table('step-texts.tsv')

describe('the corpus', () => {
  it('holds at least 200 lines, each with its expected reading', () => {
    expect(ingredientRows.length + stepRows.length).toBeGreaterThanOrEqual(200)
    for (const r of ingredientRows) expect(r, r[0]).toHaveLength(8)
    for (const r of stepRows) expect(r, r[0]).toHaveLength(6)
  })
})

describe('ingredient lines', () => {
  it.each(ingredientRows)('%s', (line, min, max, unit, item, prep, flags, stated) => {
    const p = parseQuantity(line!)
    const lo = num(min!)
    expect({
      min: round(p.min), max: round(p.max), unit: p.unit, item: p.item, prep: p.prep, optional: p.optional, toTaste: p.toTaste,
      stated: p.stated && { ...p.stated, min: round(p.stated.min), max: round(p.stated.max) },
    }).toEqual({
      min: lo, max: max ? num(max) : lo, unit: opt(unit), item, prep: opt(prep), optional: flags!.includes('o'), toTaste: flags!.includes('t'),
      stated: measure(stated!),
    })
    expect(p.warnings).toEqual([])
  })
})

describe('step texts', () => {
  it.each(stepRows)('%s', (text, min, max, kind, station, wait) => {
    const r = readStepTime(text!)
    const minutes = (s: number | null) => (s === null ? null : s / 60)
    expect({ min: minutes(r.durationMin), max: minutes(r.durationMax), kind: r.kind, station: r.station, handsOn: r.handsOn }).toEqual({
      min: num(min!), max: num(max!), kind: opt(kind), station: opt(station), handsOn: wait === 'y' ? false : wait === 'n' ? true : null,
    })
  })
})

describe('stated equivalents in use', () => {
  const sugar = { min: 0.5, max: 0.5, unit: 'cup' as const, toTaste: false, stated: parseQuantity('½ cup (100g) sugar').stated }
  it('shows the stated grams when the display is metric, scaled, and says where they came from', () => {
    expect(formatIngredientAmount(sugar, (v) => v * 2, { system: 'metric' })).toMatchObject({ text: '200 g', source: 'stated', sourceText: 'stated in the recipe beside 1 cup' })
    // in US units the cups are shown as written
    expect(formatIngredientAmount(sugar, (v) => v, { system: 'us' })).toMatchObject({ text: '½ cup', source: 'written', sourceText: '' })
  })
  it('says when an amount is converted, and from what', () => {
    // NIST Handbook 44 (2024), Appendix C: 1 US cup = 8 US fl oz = 236.5882365 mL, so ½ cup = 118.29 mL → 120 mL in 10 mL steps
    const milk = { min: 0.5, max: 0.5, unit: 'cup' as const, toTaste: false, stated: null }
    expect(formatIngredientAmount(milk, (v) => v, { system: 'metric' })).toMatchObject({ text: '120 mL', source: 'converted', sourceText: 'converted from ½ cup' })
    expect(convertAmount(1, 'cup', 'ml')).toBeCloseTo(236.5882365, 9)
    // the amount it came from is the written one, scaled: 300 mL for 4 is 450 mL for 6 = 1.902 US cups
    const milk300 = { min: 300, max: 300, unit: 'ml' as const, toTaste: false, stated: null }
    expect(formatIngredientAmount(milk300, (v) => (v * 6) / 4, { system: 'us' })).toMatchObject({
      text: '2 cups', exactText: 'exactly 1.902 cups', sourceText: 'converted from 450 mL',
    })
  })
  it('gives the author\'s own density for costing: 100 g in ½ US cup', () => {
    const d = statedDensity({ item: 'sugar', ...sugar })
    expect(d).toEqual({ item: 'sugar', grams: 100, amount: 0.5, unit: 'cup' })
    // 1 lb = 453.59237 g exactly (NIST Handbook 44, Appendix C; Weights and Measures Act 1985, Schedule 1)
    expect(statedDensity({ item: 'pork', min: 450, max: 450, unit: 'ml', stated: { min: 1, max: 1, unit: 'lb' } })).toEqual({ item: 'pork', grams: 453.59237, amount: 450, unit: 'ml' })
    // and the cost line says which density it used: the recipe's own, else the USDA entry
    expect(conversionSource({ item: 'sugar', ...sugar }, 'kg')).toBe('the recipe\'s own measure: ½ cup = 100 g')
    expect(conversionSource({ item: 'sugar', ...sugar }, 'cup')).toBeNull()
    expect(conversionSource({ item: 'butter', min: 1, max: 1, unit: 'cup', stated: null }, 'g')).toMatch(/^USDA SR Legacy NDB \d+/)
    // volume beside volume, or a counted unit, gives no density
    expect(statedDensity({ item: 'milk', min: 1, max: 1, unit: 'cup', stated: { min: 240, max: 240, unit: 'ml' } })).toBeNull()
  })
})

describe('what is read always fits the recipe', () => {
  it('leaves out a stated measure or a step time the recipe would refuse, so the import is never refused for it', () => {
    const r = importSchemaOrgRecipe(JSON.stringify({
      '@context': 'https://schema.org', '@type': 'Recipe', name: 'Edges', recipeYield: '2',
      recipeIngredient: ['1 cup (0 g) flour', '1 cup / 0 ml milk', '1 cup (5-2 g) oats', '1 cup (2000000 g) rice'],
      recipeInstructions: ['Marinate for 200 hours.', 'Cure for 6 days.'],
    }))
    expect(r.recipe.ingredients.map((i) => i.stated)).toEqual([null, null, null, null])
    // 200 hours is over the week a step may last (recipe-schemas.ts): left for a person; 6 days is read
    expect(r.recipe.steps.map((s) => [s.durationMin, s.readFromText])).toEqual([[null, ['handsOn']], [6 * 86400, ['duration', 'handsOn']]])
    expect(recipeCreateSchema.safeParse(r.recipe).success).toBe(true)
  })
})
