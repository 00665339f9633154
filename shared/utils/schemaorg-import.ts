// schema.org Recipe JSON-LD → a Hobline recipe draft, with a list of what could not be understood
// (each with the schema.org field and the reason), for a preview before saving.
// Read: name, description, recipeYield (number, text such as "4 servings", a list such as
// ["4", "4 servings"], or a QuantitativeValue), keywords, recipeCategory and recipeCuisine (as
// tags), prepTime / cookTime / totalTime (ISO 8601), recipeIngredient (each line through
// parseQuantity; a line ending in ":" with no amount starts an ingredient group) and
// recipeInstructions (schemaorg-steps.ts). Hobline's own fields come back from "hobline:"
// properties (schemaorg-export.ts) where present.
import type { RecipeDraft, RecipeImportProblem, RecipeIngredientDraft } from '../types/recipe'
import { isEuAllergenId, isUsAllergenId, suggestAllergens, type IngredientAllergens } from './allergens'
import { parseIsoDuration } from './duration'
import { parseQuantity, type QuantityParseOptions } from './quantity'
import {
  MAX_LIST_READ, MAX_RECIPE_ITEMS, capProblems, cleanSchemaText, isJsonObject, quoteValue, readRecipeInput, schemaText, type JsonObject,
} from './schemaorg-read'
import { hoblineProperty, readSchemaOrgInstructions } from './schemaorg-steps'
import { INGREDIENT_KEY, makeIngredientKey } from './step-text'

export interface SchemaOrgImport {
  recipe: RecipeDraft
  problems: RecipeImportProblem[]
  /** Image URLs the recipe names (photos are uploaded separately, so they are only listed). */
  images: string[]
}

const DEFAULT_SERVINGS = 4

function readYield(value: unknown, problems: RecipeImportProblem[]): { servings: number; yieldText: string | null } {
  const entries = (Array.isArray(value) ? value.slice(0, MAX_LIST_READ) : [value]).map((v) => (isJsonObject(v) && v.value !== undefined ? v.value : v))
  let servings: number | null = null
  let yieldText: string | null = null
  for (const v of entries) {
    const text = typeof v === 'number' ? String(v) : typeof v === 'string' ? cleanSchemaText(v) : null
    if (!text) continue
    const m = /(\d+(?:[.,]\d+)?)/.exec(text)
    const n = m ? Number(m[1]!.replace(',', '.')) : null
    if (servings === null && n !== null && n > 0) servings = n
    // "4", "4 servings", "serves 4" say no more than the number of servings itself
    const plain = n !== null && n === servings && new RegExp(`^(?:serves\\s+|makes\\s+)?${m![1]!.replace('.', '\\.')}(?:\\s+(?:servings?|portions?|people|persons?))?$`, 'i').test(text)
    if (!plain && yieldText === null) yieldText = text
  }
  if (servings === null) {
    problems.push({ field: 'recipeYield', reason: value === undefined ? `missing; assumed ${DEFAULT_SERVINGS} servings, check it` : `${quoteValue(value)} gives no number of servings; assumed ${DEFAULT_SERVINGS}, check it` })
    servings = DEFAULT_SERVINGS
  }
  return { servings, yieldText }
}

function readTime(node: JsonObject, key: string, problems: RecipeImportProblem[]): number | null {
  const v = node[key]
  if (v === undefined || v === null || v === '') return null
  if (String(v).length > 64) {
    problems.push({ field: key, reason: `${quoteValue(v)} is too long for an ISO 8601 duration such as PT1H30M` })
    return null
  }
  try {
    return parseIsoDuration(String(v))
  } catch (e) {
    problems.push({ field: key, reason: (e as Error).message })
    return null
  }
}

function readTags(node: JsonObject): string[] {
  const out: string[] = []
  for (const key of ['keywords', 'recipeCategory', 'recipeCuisine']) {
    const v = node[key]
    const list = Array.isArray(v) ? v : typeof v === 'string' ? (key === 'keywords' ? v.split(',', MAX_LIST_READ) : [v]) : []
    for (const t of list.slice(0, MAX_LIST_READ)) {
      if (out.length >= 30) break // recipe-schemas.ts: at most 30 tags
      const tag = typeof t === 'string' ? cleanSchemaText(t) : ''
      if (tag && !out.some((x) => x.toLowerCase() === tag.toLowerCase())) out.push(tag)
    }
  }
  return out
}

function readAllergens(v: unknown): IngredientAllergens | null {
  if (!isJsonObject(v) || !Array.isArray(v.eu) || !Array.isArray(v.us)) return null
  if (!v.eu.every(isEuAllergenId) || !v.us.every(isUsAllergenId)) return null
  return { eu: [...v.eu], us: [...v.us] }
}

function readIngredients(node: JsonObject, problems: RecipeImportProblem[], options: QuantityParseOptions): RecipeIngredientDraft[] {
  const field = node.recipeIngredient !== undefined ? 'recipeIngredient' : 'ingredients'
  const raw = node[field]
  const lines: unknown[] = Array.isArray(raw) ? raw : typeof raw === 'string' ? raw.split(/\r?\n/) : []
  if (raw === undefined) problems.push({ field: 'recipeIngredient', reason: 'missing; the recipe has no ingredients yet' })
  const extra = hoblineProperty(node, 'ingredients')
  const extras = Array.isArray(extra) ? extra : []
  const out: RecipeIngredientDraft[] = []
  let group: string | null = null
  // Group headings are lines too: read up to twice as many lines as ingredients are kept.
  let read = 0
  lines.slice(0, 2 * MAX_RECIPE_ITEMS).forEach((line, i) => {
    if (out.length >= MAX_RECIPE_ITEMS) return
    read = i + 1
    const at = `${field}[${i}]`
    if (typeof line !== 'string') return void problems.push({ field: at, reason: 'not a line of text; skipped' })
    const text = cleanSchemaText(line)
    if (!text) return
    const p = parseQuantity(text, options)
    if (p.min === null && !p.toTaste && /:$/.test(text)) {
      group = text.replace(/:$/, '').trim() || null
      return
    }
    for (const w of p.warnings) problems.push({ field: at, reason: w })
    const x = isJsonObject(extras[out.length]) ? (extras[out.length] as JsonObject) : null
    const key = typeof x?.key === 'string' && INGREDIENT_KEY.test(x.key) && !out.some((o) => o.key === x.key) ? x.key : makeIngredientKey(p.item, out.map((o) => o.key))
    const allergens = readAllergens(x?.allergens) ?? (({ eu, us }) => ({ eu, us }))(suggestAllergens(p.item))
    out.push({
      key, position: out.length + 1, min: p.min, max: p.max, unit: p.unit, item: p.item, prep: p.prep, optional: p.optional,
      toTaste: p.toTaste, stated: p.stated, group: x && (typeof x.group === 'string' || x.group === null) ? (x.group as string | null) : group, allergens,
    })
  })
  if (lines.length > read) problems.push({ field, reason: `lists ${lines.length} lines; Hobline keeps at most ${MAX_RECIPE_ITEMS} ingredients, so the lines after the first ${read} were not read` })
  if (extra !== undefined && extras.length !== out.length) {
    problems.push({ field: 'hobline:ingredients', reason: `lists ${extras.length} ingredients but recipeIngredient has ${out.length}; matched them in order as far as they go` })
  }
  return out
}

function readImages(v: unknown): string[] {
  return (Array.isArray(v) ? v.slice(0, MAX_LIST_READ) : [v]).flatMap((x) => (typeof x === 'string' ? [x] : isJsonObject(x) && typeof x.url === 'string' ? [x.url] : []))
}

/**
 * Import a schema.org Recipe from a JSON-LD object, JSON-LD text, or an HTML page that embeds it.
 * Throws RecipeImportError (with a message that says what to give instead) when there is no
 * recipe at all; otherwise returns the draft and what could not be understood.
 */
export function importSchemaOrgRecipe(input: unknown, options: QuantityParseOptions = {}): SchemaOrgImport {
  const { recipes, problems } = readRecipeInput(input)
  const node = recipes[0]!
  if (recipes.length > 1) problems.push({ field: '@type', reason: `the input holds ${recipes.length} recipes; imported the first, "${schemaText(node.name) ?? 'untitled'}"` })
  let title = schemaText(node.name)
  if (!title) {
    problems.push({ field: 'name', reason: 'missing; the title is "Untitled recipe" until you change it' })
    title = 'Untitled recipe'
  }
  const { servings, yieldText } = readYield(node.recipeYield, problems)
  const ingredients = readIngredients(node, problems, options)
  const instructions = readSchemaOrgInstructions(node.recipeInstructions)
  problems.push(...instructions.problems)
  const notesExt = hoblineProperty(node, 'notes')
  const notes = [typeof notesExt === 'string' ? notesExt : null, ...instructions.tips.map((t) => `Tip: ${t}`)].filter(Boolean).join('\n') || null
  const recipe: RecipeDraft = {
    title,
    summary: schemaText(node.description),
    servings,
    yieldText,
    tags: readTags(node),
    notes,
    times: { prep: readTime(node, 'prepTime', problems), cook: readTime(node, 'cookTime', problems), total: readTime(node, 'totalTime', problems) },
    ingredients,
    steps: instructions.steps,
  }
  return { recipe, problems: capProblems(problems), images: readImages(node.image) }
}
