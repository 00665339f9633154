// Amounts in step text that follow the scale: the grammar of the tokens and of the ingredient keys
// they name. The renderer is step-render.ts; this file imports no scaling code, so the shoot
// screens read tokens (timer labels) without it.
//
// Token syntax (in a step's text, linked to an ingredient by its key):
//   {{key}}            the ingredient's amount, scaled and kitchen-rounded: "Whisk in {{milk}}" → "Whisk in 240 mL"
//   {{key|item}}       amount, unit and item:   "Add {{flour|item}}" → "Add 1½ cups plain flour"
//   {{key*1/2}}        a share of the amount:    "Add {{butter*1/2}} of the butter" → "Add 50 g of the butter"
//   {{key*0.25|item}}  both (the share is a decimal or a fraction n/d, above zero)
// Spaces inside the braces are allowed ({{ milk | item }}). A key is letters, digits, "-" and "_"
// (INGREDIENT_KEY; makeIngredientKey makes lower-case ones with "-", imports and the API may use "_").
// This file is the one reader of the grammar: the editor, the renderer, the timer labels and the
// cook plan's labels all go through findStepTokens. Text with "{{" that is not a token is left alone.

export interface StepToken {
  raw: string
  key: string
  /** Share of the ingredient's amount (1 for all of it). */
  factor: number
  withItem: boolean
  start: number
  end: number
}

/** The characters of an ingredient key. */
const KEY_CHARS = 'A-Za-z0-9_-'
/** A whole ingredient key, as the recipe API accepts it: 1 to 40 of letters, digits, "-" and "_". */
export const INGREDIENT_KEY = new RegExp(`^[${KEY_CHARS}]{1,40}$`)
const SHARE = String.raw`\d+(?:\.\d+)?(?:\s*\/\s*\d+(?:\.\d+)?)?`
const TOKEN = new RegExp(String.raw`\{\{\s*([${KEY_CHARS}]+)\s*(?:\*\s*(${SHARE})\s*)?(?:\|\s*(item)\s*)?\}\}`, 'g')

/** Every well-formed token in a step's text, in order. */
export function findStepTokens(text: string): StepToken[] {
  const out: StepToken[] = []
  for (const m of text.matchAll(TOKEN)) {
    let factor = 1
    if (m[2]) {
      const [n, d] = m[2].split('/').map((x) => Number(x.trim()))
      factor = d === undefined ? n! : n! / d
    }
    out.push({ raw: m[0], key: m[1]!, factor, withItem: m[3] === 'item', start: m.index!, end: m.index! + m[0].length })
  }
  return out
}

/** An ingredient key as words in plain text: "red-onion" → "red onion", "sea_salt" → "sea salt". */
export function ingredientKeyWords(key: string): string {
  return key.replace(/[-_]+/g, ' ').trim()
}

/**
 * A step's text for a short label, a plan or reading aloud: each token read as its ingredient key's
 * words ({{red-onion|item}} → "red onion"), spaces collapsed. Text that is not a token stays as written.
 */
export function plainStepText(text: string): string {
  let out = ''
  let at = 0
  for (const t of findStepTokens(text)) {
    out += text.slice(at, t.start) + ingredientKeyWords(t.key)
    at = t.end
  }
  return (out + text.slice(at)).replace(/\s+/g, ' ').trim()
}

export interface StepTokenProblem {
  token: string
  reason: string
  /** The key the token names, and what is wrong: no ingredient has it, or the share is not above zero. */
  key: string
  kind: 'missing' | 'share'
}

/** Tokens that name no ingredient or ask for an impossible share, with what to fix. */
export function stepTokenProblems(text: string, ingredientKeys: readonly string[]): StepTokenProblem[] {
  return findStepTokens(text).flatMap((t): StepTokenProblem[] => {
    if (!ingredientKeys.includes(t.key)) {
      return [{ token: t.raw, key: t.key, kind: 'missing', reason: `No ingredient has the key "${t.key}"; use one of: ${ingredientKeys.join(', ') || '(none yet)'}` }]
    }
    if (!Number.isFinite(t.factor) || t.factor <= 0) return [{ token: t.raw, key: t.key, kind: 'share', reason: `The share in ${t.raw} must be above zero` }]
    return []
  })
}

/**
 * A token as the grammar above writes it: `{{key}}`, `{{key|item}}`, `{{key*1/2}}` or `{{key*1/2|item}}`.
 * `share` is a fraction "n/d" or a decimal above zero; "1" (all of it) writes none.
 */
export function writeStepToken(key: string, { withItem = false, share = '1' }: { withItem?: boolean; share?: string } = {}): string {
  if (!INGREDIENT_KEY.test(key)) throw new RangeError(`An ingredient key is 1 to 40 letters, digits, "-" or "_", not "${key}"`)
  const token = `{{${key}${share === '1' ? '' : `*${share}`}${withItem ? '|item' : ''}}}`
  const [read] = findStepTokens(token)
  if (!read || read.raw !== token || !(read.factor > 0) || !Number.isFinite(read.factor)) throw new RangeError(`"${share}" is no share above zero`)
  return token
}

export interface StepTextSegment {
  text: string
  /** Set on a rendered amount: the ingredient it came from and its exact value for the hover. */
  ingredientKey?: string
  exactText?: string
}

/** A key for a new ingredient, from its item and unique among `taken`: "plain flour" → "plain-flour". */
export function makeIngredientKey(item: string, taken: Iterable<string> = []): string {
  const used = new Set(taken)
  const base = item.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase()
    .replace(/\([^)]*\)/g, ' ').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 24).replace(/-+$/, '') || 'ingredient'
  if (!used.has(base)) return base
  for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`
}
