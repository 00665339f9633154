// Ingredient lines: "1½ cups plain flour, sifted" → amount, unit, item and prep note.
//
// Read, in order: an optional approximation or size word (about, heaped, scant…), an amount
// (number, fraction, mixed number, word), an optional range ("5-6", "5–6", "5 to 6", "1 or 2"),
// an optional parenthesis ("1 (400 g) can" keeps "(400 g)" with the item), an optional unit
// (names, plurals, abbreviations: see shared/data/unit-names.ts), an optional second amount
// of the same kind ("2 1/2 cups plus 2 tablespoons", "1 lb 4 oz"), which is added in the first
// unit, a stated equivalent in another unit ("1/2 cup (100 g)", "1 cup / 240 ml", kept as
// `stated`: the author's own measure of the same amount), and "of". The rest is the item, and after its first top-level comma the prep note.
// "optional" anywhere sets the optional flag, "to taste" sets toTaste and leaves no amount.
// Nothing is dropped: words that were not understood stay in the item or prep text, and
// anything doubtful is listed in `warnings`.
import { UNIT_NAMES } from '../data/unit-names'
import { formatAmountExact, normaliseAmountText, readAmountAt } from './amount-text'
import { convertAmount, unitKind, unitLabel, type UnitId } from './units'

export interface QuantityPart {
  amount: number
  unit: UnitId
}

export interface ParsedQuantity {
  /** The line as given. */
  text: string
  min: number | null
  max: number | null
  unit: UnitId | null
  item: string
  prep: string | null
  optional: boolean
  toTaste: boolean
  /** A compound amount as written ("2½ cups plus 2 tbsp"); empty for a simple amount. */
  parts: QuantityPart[]
  /** The same amount as the line also states it in another unit: "½ cup (100 g)" → 100 g. */
  stated: StatedMeasure | null
  warnings: string[]
}

/** An ingredient's amount as the recipe states it beside the main one, in another unit. */
export interface StatedMeasure {
  min: number
  max: number
  unit: UnitId
}

export interface QuantityParseOptions {
  /** What a bare "cup" means: the US cup (default) or the 250 mL metric cup. */
  cups?: 'us' | 'metric'
  /** What bare "pint", "quart", "gallon", "fl oz" mean: US (default) or UK imperial. */
  fluid?: 'us' | 'imperial'
}

const QUALIFIERS = /(about|approx\.?|approximately|roughly|around|heaped|heaping|scant|level|rounded|generous|good)\s+/iy
const UNIT_QUALIFIERS = /(heaped|heaping|scant|level|rounded|generous|good)\s+/iy
const RANGE = /\s?(?:-|to|or)\s?/iy
const COMPOUND = /\s?(?:\+|plus|and)\s/iy
const UNIT_END = /(?=$|[\s.,;:()/])/y

function readUnit(text: string, pos: number, options: QuantityParseOptions): { unit: UnitId; end: number } | null {
  const lower = text.toLowerCase()
  for (const u of UNIT_NAMES) {
    const src = u.caseSensitive ? text : lower
    if (!src.startsWith(u.name, pos)) continue
    let end = pos + u.name.length
    UNIT_END.lastIndex = end
    if (!UNIT_END.test(text)) continue
    if (text[end] === '.') end += 1 // "tbsp." "oz."
    let unit = u.id
    if (u.generic === 'cup' && options.cups === 'metric') unit = 'metric-cup'
    if (u.generic === 'fluid' && options.fluid === 'imperial') unit = `imp-${u.id}` as UnitId
    return { unit, end }
  }
  return null
}

function skipSpace(text: string, pos: number): number {
  while (text[pos] === ' ') pos++
  return pos
}

function readRange(text: string, pos: number): { min: number; max: number | null; end: number } | null {
  const first = readAmountAt(text, pos)
  if (!first) return null
  RANGE.lastIndex = first.end
  if (RANGE.exec(text)) {
    const second = readAmountAt(text, RANGE.lastIndex)
    if (second) return { min: first.value, max: second.value, end: second.end }
  }
  return { min: first.value, max: null, end: first.end }
}

/**
 * "100 g", "about 240 ml", "100-120g", "1 lb 2 oz" (added in the first unit), "1 stick": a whole
 * piece of text read as one measure with a unit, or null.
 */
function readMeasure(piece: string, options: QuantityParseOptions): StatedMeasure | null {
  const t = piece.trim()
  QUALIFIERS.lastIndex = 0
  const q = QUALIFIERS.exec(t) ? QUALIFIERS.lastIndex : 0
  const r = readRange(t, q)
  if (!r) return null
  const u = readUnit(t, skipSpace(t, r.end), options)
  if (!u) return null
  const m = { min: r.min, max: r.max ?? r.min, unit: u.unit }
  if (u.end === t.length) return m
  const more = r.max === null && unitKind(u.unit) !== 'count' ? readAmountAt(t, skipSpace(t, u.end)) : null
  const u2 = more && readUnit(t, skipSpace(t, more.end), options)
  if (!u2 || u2.end !== t.length || u2.unit === u.unit || unitKind(u2.unit) !== unitKind(u.unit)) return null
  const sum = m.min + convertAmount(more!.value, u2.unit, u.unit)
  return { min: sum, max: sum, unit: u.unit }
}

/** A stated measure the recipe schema keeps: above zero, at most 1e6, lower end first. */
const statedInRange = (m: StatedMeasure) => Number.isFinite(m.min) && Number.isFinite(m.max) && m.min > 0 && m.max <= 1e6 && m.min <= m.max

/**
 * A stated equivalent after the unit: "(100 g)", "(100 g / 3.5 oz)" or "/ 240 ml". Only a
 * parenthesis that holds nothing but measures counts; the first one in a unit other than `unit`
 * is the equivalent, any others go to `rest` (kept in the prep note).
 */
function readStated(s: string, pos: number, unit: UnitId, options: QuantityParseOptions): { stated: StatedMeasure; rest: string[]; end: number } | null {
  const at = skipSpace(s, pos)
  if (s[at] === '/') {
    const after = skipSpace(s, at + 1)
    const r = readRange(s, after)
    if (!r) return null
    const u = readUnit(s, skipSpace(s, r.end), options)
    const m = u && { min: r.min, max: r.max ?? r.min, unit: u.unit }
    if (!m || m.unit === unit || unitKind(m.unit) === 'count' || !statedInRange(m)) return null
    return { stated: m, rest: [], end: u!.end }
  }
  if (s[at] !== '(') return null
  const close = s.indexOf(')', at)
  if (close < 0 || s.slice(at + 1, close).includes('(')) return null
  // "100 g / 3.5 oz", "100g/3.5oz", "100 g; 3.5 oz", "100 g or 3.5 oz"; never the slash of a fraction (1/8)
  const pieces = s.slice(at + 1, close).split(/ ?; ?| or |(?<!\d) ?\/ ?(?!\d)|(?<=\D) ?\/ ?|(?<=\d) \/ ?| ?\/ (?=\d)/)
  const measures = pieces.map((p) => readMeasure(p, options))
  if (!measures.every((m) => m !== null)) return null
  // "(113 g / 1 stick)": a counted measure is kept in the prep note, never the equivalent
  const i = measures.findIndex((m) => m!.unit !== unit && unitKind(m!.unit) !== 'count' && statedInRange(m!))
  if (i < 0) return null
  return { stated: measures[i]!, rest: pieces.filter((_, k) => k !== i).map((p) => p.trim()), end: close + 1 }
}

/** Split at the first comma outside parentheses. */
function splitPrep(rest: string): [string, string] {
  let depth = 0
  for (let i = 0; i < rest.length; i++) {
    const ch = rest[i]
    if (ch === '(') depth++
    else if (ch === ')') depth = Math.max(0, depth - 1)
    else if (ch === ',' && depth === 0) return [rest.slice(0, i), rest.slice(i + 1)]
  }
  return [rest, '']
}

/** The longest ingredient line read for an amount; a longer one is kept whole as the item. */
export const QUANTITY_LINE_MAX = 500

// Tidying the leftovers of a line. The old patterns (/\s*,\s*(,\s*)+/, /[\s,;:]+$/) retried from every
// position of a long run of spaces or commas, in time growing with the square of the run. Here
// space is collapsed first, so each pattern below looks at most one space ahead of where it
// starts and fails or succeeds there: every pass is linear, and the ends are trimmed by a loop.
const collapse = (s: string) => s.replace(/\s+/g, ' ')

/** `s` without the leading characters in `lead` and trailing ones in `trail` (white space always). */
function trimChars(s: string, lead: string, trail: string): string {
  const isSpace = (ch: string) => ch.trim() === ''
  let a = 0
  let b = s.length
  while (a < b && (isSpace(s[a]!) || lead.includes(s[a]!))) a++
  while (b > a && (isSpace(s[b - 1]!) || trail.includes(s[b - 1]!))) b--
  return s.slice(a, b)
}

/** Empty parentheses left by a removed word ("( )", "(, )") dropped, and a run of commas made one ", ". */
const squeeze = (s: string) => collapse(collapse(s).replace(/\( ?[,;]? ?\)/g, '')).replace(/ ?,[ ,]*, ?/g, ', ')

const tidy = (s: string) => trimChars(squeeze(s), ',;:.-', ',;:')

/** Read one ingredient line. Never throws on text; doubtful readings are listed in `warnings`. */
export function parseQuantity(text: string, options: QuantityParseOptions = {}): ParsedQuantity {
  const warnings: string[] = []
  const line = String(text ?? '')
  if (line.length > QUANTITY_LINE_MAX) {
    warnings.push(`An ingredient line of ${line.length} characters is longer than ${QUANTITY_LINE_MAX}; kept whole as the item, not read for an amount`)
    return { text: line, min: null, max: null, unit: null, item: line.trim(), prep: null, optional: false, toTaste: false, parts: [], stated: null, warnings }
  }
  let s = normaliseAmountText(line)
  let optional = false
  let toTaste = false
  if (/\boptional\b/i.test(s)) {
    optional = true
    s = s.replace(/\boptional\b:?/gi, '')
  }
  const taste = /\b((?:or |and )?(?:more |less )?to taste)\b/i.exec(s)
  if (taste) {
    toTaste = true
    s = s.replace(taste[0], '')
  }
  s = trimChars(squeeze(s), ',;:', ',;:')

  const qualifiers: string[] = []
  let pos = 0
  let min: number | null = null
  let max: number | null = null
  let unit: UnitId | null = null
  let paren = ''
  let stated: StatedMeasure | null = null
  const parts: QuantityPart[] = []

  QUALIFIERS.lastIndex = 0
  const q = QUALIFIERS.exec(s)
  const afterQualifier = q ? QUALIFIERS.lastIndex : 0
  const range = readRange(s, afterQualifier)
  if (range) {
    if (q) qualifiers.push(q[1]!)
    min = range.min
    max = range.max ?? range.min
    pos = skipSpace(s, range.end)
    // "1/2 a lemon": a fraction of one
    const one = /an? (?=\p{L})/iuy
    one.lastIndex = pos
    if (range.max === null && range.min < 1 && one.test(s)) pos = one.lastIndex
    const p = /\([^()]*\)\s?/y
    p.lastIndex = pos
    const pm = p.exec(s)
    if (pm) {
      paren = pm[0].trim()
      pos = p.lastIndex
    }
    // "2 x 400g tins": the size of each, kept with the item as "(400g)"
    const times = /[x×] /y
    times.lastIndex = pos
    if (!pm && times.test(s)) {
      const size = readRange(s, times.lastIndex)
      const su = size && readUnit(s, skipSpace(s, size.end), options)
      if (su && unitKind(su.unit) !== 'count') {
        paren = `(${s.slice(times.lastIndex, su.end).trim()})`
        pos = skipSpace(s, su.end)
      }
    }
    UNIT_QUALIFIERS.lastIndex = pos
    const uq = UNIT_QUALIFIERS.exec(s)
    const u = readUnit(s, uq ? UNIT_QUALIFIERS.lastIndex : pos, options)
    if (u) {
      if (uq) qualifiers.push(uq[1]!)
      unit = u.unit
      pos = u.end
      pos = readCompound(s, pos, unit, range.max !== null, parts, warnings, qualifiers, options, (extra) => {
        min! += extra
        max! += extra
      }, () => ({ min: min!, max: max! }))
      // "1 tsp each salt and pepper", "1 tbsp each of chives and parsley"
      const each = /\s?each(?: of)?(?= )/iy
      each.lastIndex = pos
      if (each.test(s)) {
        qualifiers.push('each')
        pos = each.lastIndex
      }
      // "½ cup (100 g) sugar", "1 cup / 240 ml milk": the author's own equivalent, kept as a second
      // measure; not after a counted unit, where "2 cans (400 g)" is the size of each can
      const st = unitKind(unit) === 'count' ? null : readStated(s, pos, unit, options)
      if (st) {
        stated = st.stated
        qualifiers.push(...st.rest.map((r) => `also ${r}`))
        pos = st.end
      }
      // "1 cup (room temperature) milk": any other parenthesis after the unit stays with the item
      p.lastIndex = skipSpace(s, pos)
      const pm2 = st ? null : p.exec(s)
      if (pm2) {
        paren = [paren, pm2[0].trim()].filter(Boolean).join(' ')
        pos = p.lastIndex
      }
    }
  } else {
    // "pinch of salt", "dash of vinegar": a counted unit with no number means one.
    const u = readUnit(s, 0, options)
    if (u && unitKind(u.unit) === 'count' && /^\s?of\b/i.test(s.slice(u.end))) {
      min = max = 1
      unit = u.unit
      pos = u.end
    }
  }
  if (/^\s?of\s/i.test(s.slice(pos))) pos = s.slice(pos).search(/of\s/i) + pos + 3

  const [itemRaw, prepRaw] = splitPrep(s.slice(pos))
  const item = tidy([itemRaw, paren].filter(Boolean).join(' '))
  // With an amount, "to taste" is advice ("1 tsp salt, or to taste"): it stays in the prep note.
  if (toTaste && min !== null) {
    toTaste = false
    qualifiers.push(taste![1]!)
  }
  const prep = tidy([prepRaw, ...qualifiers].filter(Boolean).join(', '))

  if (min !== null && max !== null) {
    if (!Number.isFinite(min) || !Number.isFinite(max)) {
      warnings.push(`The amount in "${text}" could not be read as a number`)
      min = max = null
      unit = null
    } else if (max < min) {
      warnings.push(`The range in "${text}" runs downwards; read it as ${formatAmountExact(max)} to ${formatAmountExact(min)}`)
      ;[min, max] = [max, min]
    } else if (max === 0) warnings.push(`The amount in "${text}" is zero`)
  }
  if (!item) warnings.push(`"${text}" names no ingredient`)
  if (min === null) stated = null
  return { text: String(text ?? ''), min, max, unit, item, prep: prep || null, optional, toTaste, parts, stated, warnings }
}

/** "plus 2 tablespoons", "1 lb 4 oz": a second amount of the same kind, added in the first unit. */
function readCompound(
  s: string, pos: number, unit: UnitId, isRange: boolean, parts: QuantityPart[], warnings: string[],
  qualifiers: string[], options: QuantityParseOptions, add: (extra: number) => void, current: () => { min: number; max: number },
): number {
  if (unitKind(unit) === 'count') return pos
  COMPOUND.lastIndex = pos
  const joined = COMPOUND.exec(s)
  const start = joined ? COMPOUND.lastIndex : skipSpace(s, pos)
  const amount = readAmountAt(s, start)
  if (!amount) return pos
  const u2 = readUnit(s, skipSpace(s, amount.end), options)
  if (!u2 || u2.unit === unit || unitKind(u2.unit) === 'count') return pos
  if (unitKind(u2.unit) !== unitKind(unit)) {
    if (!joined) return pos
    const piece = s.slice(pos, u2.end).trim()
    warnings.push(`"${piece}" adds ${unitKind(u2.unit)} to ${unitKind(unit)}; kept it in the prep note`)
    qualifiers.push(piece)
    return u2.end
  }
  const first = current()
  parts.push({ amount: isRange ? first.max : first.min, unit }, { amount: amount.value, unit: u2.unit })
  add(convertAmount(amount.value, u2.unit, unit))
  return u2.end
}

/** The amount and unit as written exactly: "1½ cups", "5–6", "2 tbsp", "" for no amount. */
export function formatQuantityText(min: number | null, max: number | null, unit: UnitId | null): string {
  if (min === null && max === null) return ''
  const lo = min ?? max!
  const hi = max ?? min!
  const amount = lo === hi ? formatAmountExact(lo) : `${formatAmountExact(lo)}–${formatAmountExact(hi)}`
  return unit ? `${amount} ${unitLabel(unit, hi)}` : amount
}

export interface IngredientLineParts {
  min: number | null
  max: number | null
  unit: UnitId | null
  item: string
  prep?: string | null
  optional?: boolean
  toTaste?: boolean
  stated?: StatedMeasure | null
}

/** One ingredient as a line that parseQuantity reads back the same: "½ cup (100 g) sugar", "2 onions, thinly sliced (optional)". */
export function formatIngredientLine(ing: IngredientLineParts): string {
  let amount = formatQuantityText(ing.min, ing.max, ing.unit)
  if (amount && ing.unit && unitKind(ing.unit) !== 'count' && ing.stated) amount += ` (${formatQuantityText(ing.stated.min, ing.stated.max, ing.stated.unit)})`
  let line = [amount, ing.item].filter(Boolean).join(' ')
  if (ing.prep) line += `, ${ing.prep}`
  if (ing.toTaste && ing.min === null) line += ', to taste'
  if (ing.optional) line += ' (optional)'
  return line
}
