// Reading a step's time, kind, station and wait from its text, as recipe pages write them:
// "bake for 25 minutes", "simmer 20 to 30 minutes", "rest for about an hour", "cool for at least
// 3 hours", "1 hour 15 minutes", "an hour and a half", "10-12 minutes", "3 minutes per side",
// "overnight". A step that gives its time in parts ("bake 15 minutes, then … bake 10 minutes
// more") takes the sum of the parts; a part after "or" is an alternative, so it widens the range
// of the part before instead of adding to it ("at least 2 hours or up to 24 hours"). A time after
// "every" ("stirring every 5 minutes") or "the last"/"the final" (a part of a time already given) is
// not added. "per side", "each side", "on each side" count twice. "Overnight" is read as 8 to 12
// hours. "About", "at least" and "up to" keep the number as written (both ends of the range).
//
// The kind is the cooking word nearest before the time in the same sentence (or just after it,
// "20 minutes in the oven" has none); its station and whether it is a wait (hands-off) follow from
// the kind ("in the fridge" chills, "in the oven" bakes): bake and roast are waits in the oven, simmer and boil waits on a burner, fry and sear
// hands-on on a burner, rest, cool, chill, rise and marinate waits at no station; grill is hands-on
// at no station (an oven's grill or one outside: the text rarely says which). "Cook" and
// "braise" go in the oven when the step says "oven", else on a burner. A "dutch oven" is a pot on
// the burner, not the oven.
//
// The text is read once, token by token, and each token is looked at a bounded number of times:
// linear in the length of the text whatever it holds (tests/unit/import-limits.test.ts).
import type { RecipeStation } from '../types/recipe'
import { normaliseAmountText } from './amount-text'

export interface StepTimePart {
  /** Seconds. */
  min: number
  max: number
  /** The cooking word it belongs to, in its plain form ("bake", "simmer"), or null. */
  kind: string | null
  /** The words read, as written after normalising ("about 25 minutes"). */
  phrase: string
}

export interface StepTimeReading {
  /** Seconds, the sum of the parts; null when the text gives no time. */
  durationMin: number | null
  durationMax: number | null
  /** The kind of the longest part, or of the first cooking word when there is no time. */
  kind: string | null
  station: RecipeStation | null
  /** false: a wait (every timed part is hands-off); true: someone works through it; null: not known. */
  handsOn: boolean | null
  parts: StepTimePart[]
}

interface KindInfo {
  station: RecipeStation | 'heat' | null
  wait: boolean
}

// 'heat': the oven when the step says oven, else a burner.
const KINDS: Record<string, KindInfo> = {
  bake: { station: 'oven', wait: true }, roast: { station: 'oven', wait: true }, broil: { station: 'oven', wait: false },
  grill: { station: null, wait: false },
  simmer: { station: 'burner', wait: true }, boil: { station: 'burner', wait: true }, poach: { station: 'burner', wait: true },
  steam: { station: 'burner', wait: true }, blanch: { station: 'burner', wait: false }, reduce: { station: 'burner', wait: true },
  braise: { station: 'heat', wait: true }, stew: { station: 'heat', wait: true }, cook: { station: 'heat', wait: false },
  fry: { station: 'burner', wait: false }, saute: { station: 'burner', wait: false }, sear: { station: 'burner', wait: false },
  brown: { station: 'burner', wait: false }, toast: { station: 'burner', wait: false }, sweat: { station: 'burner', wait: false },
  caramelise: { station: 'burner', wait: false }, soften: { station: 'burner', wait: false }, heat: { station: 'burner', wait: false },
  warm: { station: 'burner', wait: false }, melt: { station: 'burner', wait: false },
  stir: { station: null, wait: false }, whisk: { station: null, wait: false }, beat: { station: null, wait: false },
  whip: { station: null, wait: false }, knead: { station: null, wait: false }, mix: { station: null, wait: false },
  blend: { station: null, wait: false }, process: { station: null, wait: false }, fold: { station: null, wait: false },
  rest: { station: null, wait: true }, stand: { station: null, wait: true }, sit: { station: null, wait: true },
  cool: { station: null, wait: true }, chill: { station: null, wait: true }, refrigerate: { station: null, wait: true },
  freeze: { station: null, wait: true }, marinate: { station: null, wait: true }, rise: { station: null, wait: true },
  prove: { station: null, wait: true }, proof: { station: null, wait: true }, soak: { station: null, wait: true },
  steep: { station: null, wait: true }, infuse: { station: null, wait: true }, set: { station: null, wait: true },
  drain: { station: null, wait: true }, cure: { station: null, wait: true },
}

// Written forms → plain form. Only forms that are not also common other words are listed.
const FORMS = new Map<string, string>()
for (const k of Object.keys(KINDS)) {
  const stem = k.replace(/e$/, '')
  for (const f of [k, `${k}s`, `${stem}ing`, `${stem}ed`, `${k}d`]) FORMS.set(f, k)
}
for (const [f, k] of Object.entries({
  fries: 'fry', frying: 'fry', fried: 'fry', sauté: 'saute', sautee: 'saute', sautés: 'saute', sautéing: 'saute', sauteing: 'saute',
  simmering: 'simmer', simmered: 'simmer', stirring: 'stir', stirred: 'stir', sitting: 'sit', setting: 'set', whipping: 'whip',
  proving: 'prove', proofing: 'proof', caramelize: 'caramelise', caramelizing: 'caramelise', caramelising: 'caramelise',
  chilled: 'chill', chilling: 'chill', rising: 'rise', risen: 'rise', frozen: 'freeze', beaten: 'beat', beating: 'beat',
  resting: 'rest', rested: 'rest', boiling: 'boil', cooling: 'cool', standing: 'stand', broiling: 'broil', steeping: 'steep',
})) FORMS.set(f, k)
// Forms used as adjectives or nouns more than as the step's action ("a heated pan", "warmed plates", "sets")
for (const f of ['sets', 'heated', 'warmed']) FORMS.delete(f)

const UNITS: Record<string, number> = {
  second: 1, seconds: 1, sec: 1, secs: 1, s: 1,
  minute: 60, minutes: 60, min: 60, mins: 60, m: 60,
  hour: 3600, hours: 3600, hr: 3600, hrs: 3600, h: 3600,
  day: 86400, days: 86400,
}
const NUMBER_WORDS: Record<string, number> = {
  a: 1, an: 1, one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12,
  fifteen: 15, twenty: 20, thirty: 30, forty: 40, fifty: 50, sixty: 60, ninety: 90, 'forty-five': 45, couple: 2,
}
const LEAD = new Set(['at', 'a', 'for'])
const QUALIFIERS = new Set(['about', 'around', 'approximately', 'approx', 'roughly', 'nearly', 'almost', 'another', 'further', 'extra', 'least', 'most', 'up'])

// Words, numbers (1, 1.5, 1/2) and single punctuation marks: one global pass, linear.
const TOKEN = /\p{L}+(?:-\p{L}+)*|\d+(?:[.,]\d+)?(?:\/\d+)?|[-.;,!?:()]/gu

interface Token { t: string; at: number; end: number }

function tokenize(text: string): Token[] {
  const out: Token[] = []
  for (const m of text.matchAll(TOKEN)) out.push({ t: m[0].toLowerCase(), at: m.index, end: m.index + m[0].length })
  return out
}

const isNumber = (t: string | undefined) => t !== undefined && /^\d/.test(t)
const numberOf = (t: string) => {
  const [a, b] = t.split('/')
  return b ? Number(a) / Number(b) : Number(a!.replace(',', '.'))
}

/** An amount at tokens[i]: 25, 1.5, 1 1/2, 1/2, "a", "an", "twenty", "half an", "a couple of". */
function readNumber(tk: Token[], i: number): { value: number; next: number } | null {
  const t = tk[i]?.t
  if (t === undefined) return null
  if (isNumber(t)) {
    const frac = tk[i + 1]?.t
    if (!t.includes('/') && frac?.includes('/') && isNumber(frac)) return { value: numberOf(t) + numberOf(frac), next: i + 2 }
    return { value: numberOf(t), next: i + 1 }
  }
  if (t === 'half' && (tk[i + 1]?.t === 'an' || tk[i + 1]?.t === 'a')) return { value: 0.5, next: i + 2 }
  if ((t === 'a' || t === 'an') && tk[i + 1]?.t === 'half' && (tk[i + 2]?.t === 'an' || tk[i + 2]?.t === 'a')) return { value: 0.5, next: i + 3 }
  if (t === 'a' && tk[i + 1]?.t === 'couple') return { value: 2, next: tk[i + 2]?.t === 'of' ? i + 3 : i + 2 }
  if (t in NUMBER_WORDS && t !== 'couple') {
    // "one and a half hours"
    if (tk[i + 1]?.t === 'and' && tk[i + 2]?.t === 'a' && tk[i + 3]?.t === 'half') return { value: NUMBER_WORDS[t]! + 0.5, next: i + 4 }
    return { value: NUMBER_WORDS[t]!, next: i + 1 }
  }
  return null
}

/** "25 minutes", "1 hour 15 minutes", "an hour and a half", "1 hour and 10 minutes": seconds, or null. */
function readSpan(tk: Token[], i: number): { seconds: number; next: number } | null {
  const n = readNumber(tk, i)
  if (!n) return null
  const unit = UNITS[tk[n.next]?.t ?? '']
  if (unit === undefined) return null
  // "h", "m", "s" only straight after a number ("1h", "1 h 30 m"), never after a word
  if (tk[n.next]!.t.length === 1 && !isNumber(tk[i]!.t)) return null
  let seconds = n.value * unit
  let next = n.next + 1
  if (tk[next]?.t === 'and' && tk[next + 1]?.t === 'a' && tk[next + 2]?.t === 'half') return { seconds: seconds + unit / 2, next: next + 3 }
  const j = tk[next]?.t === 'and' ? next + 1 : next
  const more = isNumber(tk[j]?.t) ? readNumber(tk, j) : null
  const u2 = more ? UNITS[tk[more.next]?.t ?? ''] : undefined
  if (more && u2 !== undefined && u2 < unit) {
    seconds += more.value * u2
    next = more.next + 1
  }
  return { seconds, next }
}

/** A time at tokens[i]: a span, or a range "20 to 30 minutes", "20-30 minutes", "30 minutes to 1 hour". */
function readTime(tk: Token[], i: number): { min: number; max: number; next: number } | null {
  if (tk[i]?.t === 'overnight') return { min: 8 * 3600, max: 12 * 3600, next: i + 1 }
  const span = readSpan(tk, i)
  const sep = (k: number) => tk[k]?.t === '-' || tk[k]?.t === 'to' || tk[k]?.t === 'or'
  if (span) {
    if (sep(span.next)) {
      const second = readSpan(tk, span.next + 1)
      if (second && second.seconds >= span.seconds) return { min: span.seconds, max: second.seconds, next: second.next }
    }
    return { min: span.seconds, max: span.seconds, next: span.next }
  }
  // "20 to 30 minutes": the first number borrows the unit of the second
  const first = readNumber(tk, i)
  if (!first || !sep(first.next)) return null
  const second = readSpan(tk, first.next + 1)
  if (!second) return null
  const unitSeconds = second.seconds / (readNumber(tk, first.next + 1)!.value || 1)
  const min = first.value * unitSeconds
  return min <= second.seconds ? { min, max: second.seconds, next: second.next } : null
}

const SENTENCE_END = new Set(['.', ';', '!', '?'])
const LOOK = 12

const ARTICLES = new Set(['a', 'an', 'the', 'low', 'medium', 'high', 'medium-high', 'medium-low', 'gentle', 'moderate', 'very'])
// "boiling water", "roasting tin", "baking powder", "frying pan", "mixing bowl": a cooking word before one of these names a thing
const NOT_A_KIND_BEFORE = new Set([
  'sugar', 'rice', 'butter', 'bread', 'mixer', 'mix', 'of', 'water', 'salted', 'milk', 'stock', 'oil', 'tin', 'dish', 'tray', 'pan', 'bowl', 'sheet',
  'paper', 'powder', 'soda', 'rack', 'liquid',
])
// Places that say the kind by themselves: "in the fridge for 2 hours" chills, "in the oven for 20 minutes" bakes
const PLACE_KINDS: Record<string, string> = { fridge: 'chill', refrigerator: 'chill', freezer: 'freeze', oven: 'bake' }

/** The kind named at token k, or null: a word used as a noun or adjective ("the heat", "a warm place", "brown sugar", "stand mixer") is not. */
function kindAt(tk: Token[], k: number, after: boolean, places = true): string | null {
  const place = places ? PLACE_KINDS[tk[k]!.t] : undefined
  if (place) return tk[k - 1]?.t === 'dutch' || tk[k - 1]?.t === 'microwave' ? null : place
  const f = FORMS.get(tk[k]!.t)
  if (!f) return null
  if (ARTICLES.has(tk[k - 1]?.t ?? '') || NOT_A_KIND_BEFORE.has(tk[k + 1]?.t ?? '')) return null
  // "simmer, stirring now and then, for 20 minutes": the stirring goes along with the cooking word
  if (!after && (f === 'stir' || f === 'whisk' || f === 'fold') && tk[k]!.t.endsWith('ing')) return null
  return f
}

/** The cooking word nearest before the time in its sentence (else just after the time), as its plain form. */
function kindNear(tk: Token[], start: number, end: number): string | null {
  for (let k = start - 1; k >= 0 && k >= start - LOOK; k--) {
    if (SENTENCE_END.has(tk[k]!.t)) break
    const f = kindAt(tk, k, false)
    if (f) return f
  }
  for (let k = end; k < tk.length && k < end + 4; k++) {
    if (SENTENCE_END.has(tk[k]!.t)) break
    const f = kindAt(tk, k, true)
    if (f) return f
  }
  return null
}

/** What the text says about heat: the oven (not a dutch oven), a burner (pan, pot, heat, dutch oven). */
function heatCues(tk: Token[]): { oven: boolean; burner: boolean } {
  let oven = false
  let burner = false
  tk.forEach((x, k) => {
    if (x.t === 'oven' || x.t === 'ovens') {
      if (tk[k - 1]?.t === 'dutch' || tk[k - 1]?.t === 'microwave') burner ||= tk[k - 1]?.t === 'dutch'
      else oven = true
    }
    if (['pan', 'saucepan', 'skillet', 'pot', 'wok', 'stockpot', 'hob', 'stove', 'stovetop', 'burner', 'casserole'].includes(x.t)) burner = true
    if (x.t === 'heat' && tk[k - 2]?.t === 'over') burner = true // "over medium heat"
  })
  return { oven, burner }
}

function stationOf(kind: string | null, cues: { oven: boolean; burner: boolean }): RecipeStation | null {
  const s = kind ? KINDS[kind]!.station : null
  if (s === 'heat') return cues.oven ? 'oven' : 'burner'
  return s
}

/** Read a step's time, kind, station and wait from its text. Never throws. */
export function readStepTime(text: string): StepTimeReading {
  const s = normaliseAmountText(String(text ?? ''))
  const tk = tokenize(s)
  const cues = heatCues(tk)
  const parts: StepTimePart[] = []
  let firstKind: string | null = null
  for (let i = 0; i < tk.length;) {
    firstKind ??= kindAt(tk, i, true, false)
    let alternative = false
    let skip = false
    // "every 10 minutes", "the last 10 minutes": not a time of its own
    const before = tk[i - 1]?.t
    if (before === 'every' || ((before === 'last' || before === 'final') && tk[i - 2]?.t === 'the')) skip = true
    const time = readTime(tk, i)
    if (!time) {
      i++
      continue
    }
    // look back over "about", "at least", "up to", "another", "a further", "for": after "or" it is an alternative
    let k = i - 1
    while (k >= 0 && k >= i - 3 && (QUALIFIERS.has(tk[k]!.t) || LEAD.has(tk[k]!.t) || (tk[k]!.t === 'to' && tk[k - 1]?.t === 'up'))) k--
    if (k >= 0 && tk[k]!.t === 'or' && parts.length) alternative = true
    if (k >= 0 && tk[k]!.t === 'every') skip = true
    const start = k + 1
    let next = time.next
    let factor = 1
    // "per side", "each side", "on each side", "a side"
    const j = tk[next]?.t === 'on' ? next + 1 : next
    if (['per', 'each', 'a'].includes(tk[j]?.t ?? '') && tk[j + 1]?.t === 'side') {
      factor = 2
      next = j + 2
    }
    if (!skip) {
      const part = {
        min: Math.round(time.min * factor), max: Math.round(time.max * factor), kind: kindNear(tk, start, next),
        phrase: s.slice(tk[start]!.at, tk[next - 1]!.end),
      }
      if (alternative) {
        const last = parts[parts.length - 1]!
        last.min = Math.min(last.min, part.min)
        last.max = Math.max(last.max, part.max)
        last.phrase = `${last.phrase} or ${part.phrase}`
      } else parts.push(part)
    }
    i = next
  }
  if (!parts.length) {
    const station = stationOf(firstKind, cues) ?? (cues.oven ? 'oven' : cues.burner ? 'burner' : null)
    return { durationMin: null, durationMax: null, kind: firstKind, station, handsOn: null, parts }
  }
  const longest = parts.reduce((a, b) => (b.max > a.max ? b : a))
  const withStation = [...parts].sort((a, b) => b.max - a.max).map((p) => stationOf(p.kind, cues)).find((x) => x !== null)
  const station = withStation ?? (cues.oven && !cues.burner ? 'oven' : cues.burner && !cues.oven ? 'burner' : null)
  const known = parts.filter((p) => p.kind !== null)
  const handsOn = known.length === 0 ? null : !known.every((p) => KINDS[p.kind!]!.wait)
  return {
    durationMin: parts.reduce((a, p) => a + p.min, 0),
    durationMax: parts.reduce((a, p) => a + p.max, 0),
    kind: longest.kind ?? known[0]?.kind ?? firstKind,
    station,
    handsOn,
    parts,
  }
}
