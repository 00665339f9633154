// Finding schema.org Recipe nodes in what a user pastes or uploads: a JSON-LD object or string,
// or an HTML page that embeds <script type="application/ld+json"> blocks (W3C JSON-LD 1.1,
// "Embedding JSON-LD in HTML Documents"), with the recipe at the top, in an array, inside
// "@graph", or under another node (a WebPage's mainEntity). "@type" may be a string or an array,
// plain ("Recipe"), prefixed ("schema:Recipe") or a full IRI ("https://schema.org/Recipe").
import type { RecipeImportProblem } from '../types/recipe'

export class RecipeImportError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'RecipeImportError'
  }
}

export type JsonObject = Record<string, unknown>

export const isJsonObject = (v: unknown): v is JsonObject => typeof v === 'object' && v !== null && !Array.isArray(v)

/** The local names of a node's @type: ["Recipe", "NewsArticle"]. */
export function schemaTypes(node: unknown): string[] {
  if (!isJsonObject(node)) return []
  const t = node['@type']
  return (Array.isArray(t) ? t : [t]).filter((x): x is string => typeof x === 'string').map((x) => x.replace(/^(?:https?:\/\/schema\.org\/|schema:)/, ''))
}

export const hasSchemaType = (node: unknown, type: string) => schemaTypes(node).includes(type)

const SCRIPT = /<script\b[^>]*?\btype\s*=\s*(["']?)application\/ld\+json\1[^>]*>([\s\S]*?)<\/script\s*>/gi

/** The JSON-LD blocks of an HTML page, each parsed; a block that is not JSON is listed as a problem. */
export function extractJsonLdFromHtml(html: string): { blocks: unknown[]; problems: RecipeImportProblem[] } {
  const blocks: unknown[] = []
  const problems: RecipeImportProblem[] = []
  let n = 0
  for (const m of html.matchAll(SCRIPT)) {
    n++
    const body = m[2]!.trim().replace(/^<!--|-->$/g, '').replace(/^\s*(?:\/\/)?\s*<!\[CDATA\[|(?:\/\/)?\s*\]\]>\s*$/g, '').trim()
    try {
      blocks.push(JSON.parse(body))
    } catch (e) {
      problems.push({ field: `script[${n}]`, reason: `the JSON-LD block is not valid JSON (${(e as Error).message})` })
    }
  }
  return { blocks, problems }
}

/** Every Recipe node in parsed JSON-LD, in document order (not looking inside a found recipe). */
export function findRecipeNodes(data: unknown): JsonObject[] {
  const found: JsonObject[] = []
  const seen = new Set<unknown>()
  const walk = (v: unknown, depth: number) => {
    if (depth > 12 || v === null || typeof v !== 'object' || seen.has(v)) return
    seen.add(v)
    if (Array.isArray(v)) return v.forEach((x) => walk(x, depth + 1))
    if (hasSchemaType(v, 'Recipe')) return void found.push(v as JsonObject)
    for (const x of Object.values(v)) walk(x, depth + 1)
  }
  walk(data, 0)
  return found
}

/** Parse what the user gave (object, JSON text or HTML) and return the Recipe nodes found. */
export function readRecipeInput(input: unknown): { recipes: JsonObject[]; problems: RecipeImportProblem[] } {
  if (typeof input === 'string') {
    const text = input.replace(/^\uFEFF/, '').trim()
    if (!text) throw new RecipeImportError('Nothing to import: paste a schema.org Recipe as JSON-LD, or an HTML page that embeds one')
    if (text.startsWith('{') || text.startsWith('[')) {
      let data: unknown
      try {
        data = JSON.parse(text)
      } catch (e) {
        throw new RecipeImportError(`The text looks like JSON but is not valid JSON: ${(e as Error).message}`)
      }
      return readRecipeInput(data)
    }
    if (!/<[a-z!]/i.test(text)) throw new RecipeImportError('This is neither JSON-LD nor HTML: paste a schema.org Recipe as JSON-LD, or an HTML page that embeds one')
    const { blocks, problems } = extractJsonLdFromHtml(text)
    if (!blocks.length && !problems.length) throw new RecipeImportError('The HTML page has no <script type="application/ld+json"> block, so it holds no schema.org Recipe to import')
    const recipes = blocks.flatMap(findRecipeNodes)
    if (!recipes.length) throw new RecipeImportError(`No schema.org Recipe was found in the page's JSON-LD${problems.length ? ` (${problems.map((p) => p.reason).join('; ')})` : ''}`)
    return { recipes, problems }
  }
  if (input === null || typeof input !== 'object') throw new RecipeImportError('Nothing to import: give a schema.org Recipe as a JSON-LD object or text, or an HTML page')
  const recipes = findRecipeNodes(input)
  if (!recipes.length) throw new RecipeImportError('No schema.org Recipe was found: the JSON-LD has no node with "@type": "Recipe"')
  return { recipes, problems: [] }
}

const ENTITIES: Record<string, string> = {
  amp: '&', lt: '<', gt: '>', quot: '"', apos: "'", nbsp: ' ', deg: '°', frac12: '½', frac14: '¼', frac34: '¾',
  ndash: '–', mdash: '—', hellip: '…', lsquo: '‘', rsquo: '’', ldquo: '“', rdquo: '”', times: '×', eacute: 'é',
  egrave: 'è', agrave: 'à', aacute: 'á', ccedil: 'ç', ntilde: 'ñ', uuml: 'ü', ouml: 'ö', auml: 'ä', iuml: 'ï', ecirc: 'ê',
}

/**
 * Text as people wrote it: many sites put HTML tags and entities inside JSON-LD text, so tags
 * become spaces (line breaks for <br>, </p>, </li> when `keepLines`), entities are decoded and
 * space is collapsed.
 */
export function cleanSchemaText(value: string, keepLines = false): string {
  let s = value
  if (keepLines) s = s.replace(/<br\s*\/?>|<\/(?:p|li|div|h\d)>/gi, '\n')
  s = s.replace(/<\/?[a-z][^>]*>/gi, ' ')
  s = s.replace(/&(#x[0-9a-f]+|#\d+|[a-z]+\d*);/gi, (all, code: string) => {
    if (code[0] === '#') {
      const n = code[1]!.toLowerCase() === 'x' ? parseInt(code.slice(2), 16) : parseInt(code.slice(1), 10)
      return Number.isFinite(n) && n > 0 && n <= 0x10ffff ? String.fromCodePoint(n) : all
    }
    return ENTITIES[code.toLowerCase()] ?? all
  })
  return keepLines
    ? s.split(/\r?\n|\r/).map((l) => l.replace(/\s+/g, ' ').trim()).filter(Boolean).join('\n')
    : s.replace(/\s+/g, ' ').trim()
}

/** A schema.org Text value: a string, a number, or the first of an array; null otherwise. */
export function schemaText(value: unknown): string | null {
  if (Array.isArray(value)) return value.length ? schemaText(value[0]) : null
  if (typeof value === 'number' && Number.isFinite(value)) return String(value)
  if (typeof value !== 'string') return null
  const t = cleanSchemaText(value)
  return t || null
}
