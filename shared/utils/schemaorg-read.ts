// Finding schema.org Recipe nodes in what a user pastes or uploads: a JSON-LD object or string,
// or an HTML page that embeds <script type="application/ld+json"> blocks (W3C JSON-LD 1.1,
// "Embedding JSON-LD in HTML Documents"), with the recipe at the top, in an array, inside
// "@graph", or under another node (a WebPage's mainEntity). "@type" may be a string or an array,
// plain ("Recipe"), prefixed ("schema:Recipe") or a full IRI ("https://schema.org/Recipe").
//
// Everything here sees what a user pastes, so every step takes time in proportion to the input:
// the input is capped before it is read (IMPORT_MAX_CHARS, TEXT_MAX_CHARS), HTML and its character
// references are read in one pass by htmlparser2's tokenizer (html-read.ts), and no regular
// expression here can backtrack over the input.
import { readHtml } from './html-read'
import type { RecipeImportProblem } from '../types/recipe'

/** The most text an import reads (512 KB): a recipe's JSON-LD is a few KB, a whole page rarely more. */
export const IMPORT_MAX_CHARS = 512 * 1024
/** What an import over the cap is told. */
/** Where JSON.parse stopped, in words (" near character 120"), without its own programmer wording. */
function jsonWhere(error: unknown): string {
  const at = /position (\d+)/.exec(error instanceof Error ? error.message : '')?.[1]
  return at ? ` (it stops making sense near character ${Number(at) + 1})` : ''
}

export const IMPORT_TOO_LARGE = 'The import is larger than 512 KB. Paste only the recipe\'s JSON-LD (the text of the page\'s '
  + '<script type="application/ld+json"> block) instead of the whole page, or save the page without its images and styles.'
/** The most characters read from one text value (a name, a description, a step): above every field's own limit. */
export const TEXT_MAX_CHARS = 16 * 1024
/** The most JSON-LD blocks read from one page. */
export const MAX_JSONLD_BLOCKS = 100
/** The most ingredients and steps read (recipe-schemas.ts keeps at most 200 of each). */
export const MAX_RECIPE_ITEMS = 200
/** The most entries of any other list read (tags, yields, images, tips). */
export const MAX_LIST_READ = 50
/** The most problems listed for one import; the rest are counted. */
export const MAX_PROBLEMS = 50
/** How deep lists and nodes are followed. */
export const MAX_DEPTH = 12
/** The most characters of a value quoted in a problem. */
export const QUOTE_MAX = 80

/** A value as JSON, for a problem's text, cut to QUOTE_MAX characters. */
export function quoteValue(value: unknown): string {
  const json = JSON.stringify(value) ?? String(value)
  return json.length > QUOTE_MAX ? `${json.slice(0, QUOTE_MAX)}…` : json
}

/** At most MAX_PROBLEMS problems, and a last one that counts the rest. */
export function capProblems(problems: RecipeImportProblem[]): RecipeImportProblem[] {
  if (problems.length <= MAX_PROBLEMS) return problems
  return [...problems.slice(0, MAX_PROBLEMS), { field: '@graph', reason: `and ${problems.length - MAX_PROBLEMS} more problems like these` }]
}

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

/** A script block's text without the HTML comment or CDATA wrapper old pages put around it. */
function unwrapScriptText(raw: string): string {
  let s = raw.trim()
  if (s.startsWith('<!--')) s = s.slice(4)
  if (s.endsWith('-->')) s = s.slice(0, -3)
  s = s.trim()
  const open = s.startsWith('//') ? s.slice(2).trimStart() : s
  if (open.startsWith('<![CDATA[')) s = open.slice(9)
  if (s.endsWith(']]>')) {
    s = s.slice(0, -3).trimEnd()
    if (s.endsWith('//')) s = s.slice(0, -2)
  }
  return s.trim()
}

const SCRIPT_TAG: ReadonlySet<string> = new Set(['script'])
const isJsonLdType = (type: string | undefined) => (type ?? '').split(';')[0]!.trim().toLowerCase() === 'application/ld+json'

/**
 * The JSON-LD blocks of an HTML page, each parsed; a block that is not JSON is listed as a problem.
 * A script's text is raw text in HTML (no tags, no character references inside), and a script
 * left open runs to the end of the page, as a browser reads it.
 */
export function extractJsonLdFromHtml(html: string): { blocks: unknown[]; problems: RecipeImportProblem[] } {
  const blocks: unknown[] = []
  const problems: RecipeImportProblem[] = []
  let n = 0
  let body: string[] | null = null
  const close = () => {
    const text = body!.join('')
    body = null
    if (++n > MAX_JSONLD_BLOCKS) return
    try {
      blocks.push(JSON.parse(unwrapScriptText(text)))
    } catch (e) {
      problems.push({ field: `script[${n}]`, reason: `JSON-LD block ${n} is not valid JSON${jsonWhere(e)}` })
    }
  }
  readHtml(html, {
    attributesOf: SCRIPT_TAG,
    open: (name, attribs) => {
      if (name === 'script' && isJsonLdType(attribs.get('type'))) body = []
    },
    text: (text) => void body?.push(text),
    close: (name) => {
      if (name === 'script' && body) close()
    },
  })
  if (body) close()
  if (n > MAX_JSONLD_BLOCKS) problems.push({ field: `script[${MAX_JSONLD_BLOCKS + 1}]`, reason: `the page has ${n} JSON-LD blocks; read the first ${MAX_JSONLD_BLOCKS}` })
  return { blocks, problems }
}

/** Every Recipe node in parsed JSON-LD, in document order (not looking inside a found recipe). */
export function findRecipeNodes(data: unknown): JsonObject[] {
  const found: JsonObject[] = []
  const seen = new Set<unknown>()
  const walk = (v: unknown, depth: number) => {
    if (depth > MAX_DEPTH || v === null || typeof v !== 'object' || seen.has(v)) return
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
    if (input.length > IMPORT_MAX_CHARS) throw new RecipeImportError(IMPORT_TOO_LARGE)
    const text = (input.startsWith('\uFEFF') ? input.slice(1) : input).trim()
    if (!text) throw new RecipeImportError('Nothing to import: paste a schema.org Recipe as JSON-LD, or an HTML page that embeds one')
    if (text.startsWith('{') || text.startsWith('[')) {
      let data: unknown
      try {
        data = JSON.parse(text)
      } catch (e) {
        throw new RecipeImportError(`The text looks like JSON but is not valid JSON${jsonWhere(e)}; copy the whole JSON-LD again, from its first { to its last }`)
      }
      return readRecipeInput(data)
    }
    if (!/<[a-z!]/i.test(text)) throw new RecipeImportError('This is neither JSON-LD nor HTML: paste a schema.org Recipe as JSON-LD, or an HTML page that embeds one')
    // A page that never names the type has no block to find: no need to read its tags.
    const { blocks, problems } = text.toLowerCase().includes('application/ld+json') ? extractJsonLdFromHtml(text) : { blocks: [], problems: [] }
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

/** Tags that end a line of text when `keepLines` (at their end; <br> where it stands). */
const LINE_TAGS = new Set(['p', 'li', 'div', 'h1', 'h2', 'h3', 'h4', 'h5', 'h6'])

/** Runs of white space become one space; with `keepLines`, lines are kept (trimmed, empty ones dropped). */
const collapseSpace = (s: string, keepLines: boolean) => keepLines
  ? s.split(/\r?\n|\r/).map((l) => l.replace(/\s+/g, ' ').trim()).filter(Boolean).join('\n')
  : s.replace(/\s+/g, ' ').trim()

/**
 * Text as people wrote it: many sites put HTML tags and character references inside JSON-LD
 * text, so tags become spaces (line breaks for <br>, </p>, </li>, </div>, </hN> when `keepLines`),
 * references are decoded (HTML Living Standard, "Named character references") and space is
 * collapsed. Reads at most TEXT_MAX_CHARS characters of the value.
 */
export function cleanSchemaText(value: string, keepLines = false): string {
  const src = value.length > TEXT_MAX_CHARS ? value.slice(0, TEXT_MAX_CHARS) : value
  if (!src.includes('<') && !src.includes('&')) return collapseSpace(src, keepLines)
  const out: string[] = []
  readHtml(src, {
    text: (text) => void out.push(text),
    open: (name) => void out.push(keepLines && name === 'br' ? '\n' : ' '),
    close: (name) => void out.push(keepLines && LINE_TAGS.has(name) ? '\n' : ' '),
  })
  return collapseSpace(out.join(''), keepLines)
}

/** A schema.org Text value: a string, a number, or the first of an array; null otherwise. */
export function schemaText(value: unknown): string | null {
  if (Array.isArray(value)) return value.length ? schemaText(value[0]) : null
  if (typeof value === 'number' && Number.isFinite(value)) return String(value)
  if (typeof value !== 'string') return null
  const t = cleanSchemaText(value)
  return t || null
}
