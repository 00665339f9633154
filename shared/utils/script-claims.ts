// Figures a script states in plain words, checked against the data: money per serving, servings and
// how long a recipe takes. A figure said through a live field is always true; these are the ones a
// person typed. In a recipe segment a claim is about that recipe; in any other segment about every
// recipe of the episode ("each under £2 a serving" must hold for all). A cost claim holds with and
// without the optional ingredients; a bare figure ("£1.50 a head") holds when it is either one,
// at the precision said (£2 is checked to the pound, £1.50 to the penny). How close "about" is
// (10 %, at least a minute for times) is our own rule; no standard covers it.
import { formatMoney, currencyMinorDigits, parseMoneyToMinor, MoneyError } from './money'
import { costGapsFor, gapWords, totalTimeSpoken, type ShowData, type ShowRecipeData } from './live-fields'
import type { ScriptPiece, ShowSegment } from './show-segments'

export type ClaimKind = 'cost' | 'servings' | 'time'
export type ClaimVerdict = 'true' | 'false' | 'unknown'

export interface Claim {
  /** The words matched, as written. */
  text: string
  kind: ClaimKind
  verdict: ClaimVerdict
  /** Why, in plain words, naming the recipe and the figure. */
  detail: string
  start: number
  end: number
}

/** Which claims the checker reads, in words for the docs and the editor's help. */
export const CHECKABLE_CLAIMS: readonly { kind: ClaimKind; says: string; examples: readonly string[] }[] = [
  {
    kind: 'cost',
    says: 'Money per serving: an amount in the episode\'s currency followed by "a serving", "per portion", "a head", "a person", "a plate" or "a bowl", '
      + 'with or without "under", "less than", "no more than", "up to", "over", "more than", "at least", "about" or "nearly" before it. '
      + 'It must hold for each recipe it is about, with and without the optional ingredients.',
    examples: ['under £2 a serving', 'less than $3 per portion', '£1.50 a head', '80p a portion', 'two pounds a serving'],
  },
  {
    kind: 'servings',
    says: 'Servings: "four servings", "6 portions", "serves 4", "feeds six", "for four" or "for 4 people" (a range such as "serves 4 to 6" too), '
      + 'against the servings the episode is shot for.',
    examples: ['four servings', 'serves 4', 'for four', 'serves 4 to 6'],
  },
  {
    kind: 'time',
    says: 'How long a recipe takes, from start to finish: a time with "in", "under", "within", "takes", "about", "at least" or "over" before it, '
      + '"start to finish" or "in total" after it, or "a 30-minute dinner". A time after "for" ("simmer for 20 minutes") is a step\'s and is not checked.',
    examples: ['in 20 minutes', 'in under half an hour', 'takes an hour', 'an hour and a half start to finish', 'a 30-minute dinner'],
  },
]

const UNITS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve',
  'thirteen', 'fourteen', 'fifteen', 'sixteen', 'seventeen', 'eighteen', 'nineteen']
const TENS = ['twenty', 'thirty', 'forty', 'fifty', 'sixty', 'seventy', 'eighty', 'ninety']
const WORD = `(?:half a dozen|a dozen|(?:${TENS.join('|')})(?:[- ](?:${UNITS.slice(1, 10).join('|')}))?|${[...UNITS].reverse().join('|')})`
const NUM = `(?:\\d+(?:[.,]\\d+)?|${WORD})`

/** "four" → 4, "forty-five" → 45, "a dozen" → 12, "1.5" → 1.5; null for anything else. */
export function readNumber(words: string): number | null {
  const w = words.trim().toLowerCase()
  if (/^\d+(?:[.,]\d+)?$/.test(w)) return Number(w.replace(',', '.'))
  if (w === 'a dozen') return 12
  if (w === 'half a dozen') return 6
  if (UNITS.includes(w)) return UNITS.indexOf(w)
  const m = /^([a-z]+)(?:[- ]([a-z]+))?$/.exec(w)
  if (!m || !TENS.includes(m[1]!)) return null
  const unit = m[2] ? UNITS.indexOf(m[2]) : 0
  return unit < 0 || unit > 9 ? null : (TENS.indexOf(m[1]!) + 2) * 10 + unit
}

type Mode = 'lt' | 'le' | 'gt' | 'ge' | 'about' | 'nearly' | 'just-over' | 'eq'
const MODES: Record<string, Mode> = {
  'under': 'lt', 'less than': 'lt', 'below': 'lt', 'cheaper than': 'lt',
  'no more than': 'le', 'not more than': 'le', 'at most': 'le', 'up to': 'le', 'within': 'le', 'inside': 'le',
  'over': 'gt', 'more than': 'gt', 'above': 'gt', 'longer than': 'gt',
  'at least': 'ge',
  'about': 'about', 'around': 'about', 'roughly': 'about', 'approximately': 'about',
  'nearly': 'nearly', 'almost': 'nearly', 'just under': 'nearly',
  'just over': 'just-over',
  'only': 'eq', 'just': 'eq', 'exactly': 'eq',
}
const CMP = Object.keys(MODES).sort((a, b) => b.length - a.length).join('|')
const MODE_WORDS: Record<Mode, string> = {
  'lt': 'under', 'le': 'at most', 'gt': 'over', 'ge': 'at least', 'about': 'about', 'nearly': 'nearly', 'just-over': 'just over', 'eq': '',
}

/** Whether `actual` meets the claim `stated` under a mode; `eq` by the caller's own test. */
function holds(mode: Mode, actual: number, stated: number, eq: (a: number, s: number) => boolean): boolean {
  switch (mode) {
    case 'lt': return actual < stated
    case 'le': return actual <= stated
    case 'gt': return actual > stated
    case 'ge': return actual >= stated
    case 'about': return Math.abs(actual - stated) <= stated * 0.1
    case 'nearly': return actual <= stated && actual >= stated * 0.9
    case 'just-over': return actual > stated && actual <= stated * 1.1
    case 'eq': return eq(actual, stated)
  }
}

/** The recipes a segment's claims are about: a recipe segment's own, every recipe of the episode for the others. */
export function claimScope(segment: Pick<ShowSegment, 'kind' | 'recipeId'>, data: ShowData): number[] {
  if (segment.kind === 'recipe' && segment.recipeId !== undefined) return [segment.recipeId]
  return data.recipes.map((r) => r.id)
}

interface Found { start: number; end: number; text: string; kind: ClaimKind; check: () => { verdict: ClaimVerdict; detail: string } }

type Outcome =
  | { recipe: ShowRecipeData; ok: boolean; figure: string }
  | { recipe: ShowRecipeData | null; unknown: string }

/** One verdict from each recipe's outcome: false beats unknown beats true. */
function verdictOf(outcomes: Outcome[], said: string): { verdict: ClaimVerdict; detail: string } {
  if (!outcomes.length) return { verdict: 'unknown', detail: 'The episode has no recipes to check it against.' }
  const failed = outcomes.find((o) => 'ok' in o && !o.ok)
  if (failed && 'ok' in failed) return { verdict: 'false', detail: `${failed.recipe.title}: ${failed.figure}, not ${said}.` }
  const unknown = outcomes.filter((o): o is Extract<Outcome, { unknown: string }> => 'unknown' in o)
  if (unknown.length) return { verdict: 'unknown', detail: `Cannot check: ${unknown.map((o) => (o.recipe ? `${o.recipe.title}: ${o.unknown}` : o.unknown)).join('; ')}.` }
  return { verdict: 'true', detail: outcomes.map((o) => ('figure' in o ? `${o.recipe.title}: ${o.figure}` : '')).join('; ') + '.' }
}

function recipesIn(data: ShowData, ids: readonly number[]): (ShowRecipeData | null)[] {
  return ids.map((id) => data.recipes.find((r) => r.id === id) ?? null)
}

// ——— money per serving ———

const DOLLARS = ['USD', 'CAD', 'AUD', 'NZD', 'SGD', 'HKD']
const CURRENCY_OF: Record<string, string[]> = {
  '£': ['GBP'], 'pound': ['GBP'], 'pounds': ['GBP'], 'quid': ['GBP'], 'p': ['GBP'], 'pence': ['GBP'],
  '$': DOLLARS, 'dollar': DOLLARS, 'dollars': DOLLARS, 'bucks': DOLLARS, 'us$': ['USD'], 'a$': ['AUD'], 'c$': ['CAD'], 'nz$': ['NZD'],
  'cent': [...DOLLARS, 'EUR'], 'cents': [...DOLLARS, 'EUR'], 'c': [...DOLLARS, 'EUR'],
  '€': ['EUR'], 'euro': ['EUR'], 'euros': ['EUR'], '¥': ['JPY', 'CNY'], 'yen': ['JPY'],
}
const MINOR_WORDS = new Set(['p', 'pence', 'cent', 'cents', 'c'])
const MONEY = `(?:(US\\$|A\\$|C\\$|NZ\\$|£|\\$|€|¥)\\s?(\\d+(?:[.,]\\d+)*)|(${NUM})\\s+(pounds?|quid|dollars?|bucks|euros?|yen)|(\\d+|${WORD})\\s?(p|pence|cents?|c))`
const PER = '\\s+(?:a|an|per)\\s+(?:serving|portion|head|person|plate|bowl|serve)\\b'
const COST_RE = new RegExp(`(?<![\\w£$€¥])(?:(${CMP})\\s+)?${MONEY}${PER}`, 'gi')

function costClaims(text: string, data: ShowData, ids: readonly number[]): Found[] {
  const out: Found[] = []
  for (const m of text.matchAll(COST_RE)) {
    const mode = m[1] ? MODES[m[1].toLowerCase()]! : 'eq'
    const unitWord = (m[2] ?? m[5] ?? m[7]!).toLowerCase()
    const amountText = m[3] ?? m[4] ?? m[6]!
    out.push({
      start: m.index!, end: m.index! + m[0].length, text: m[0], kind: 'cost',
      check: () => {
        if (!CURRENCY_OF[unitWord]!.includes(data.currency)) {
          return { verdict: 'unknown', detail: `It is said in ${unitWord === '$' ? 'dollars' : unitWord}, but the episode is costed in ${data.currency}.` }
        }
        const digits = currencyMinorDigits(data.currency)
        const minorSaid = MINOR_WORDS.has(unitWord)
        if (minorSaid && digits !== 2) return { verdict: 'unknown', detail: `${data.currency} has no pence or cents.` }
        const n = readNumber(amountText)
        let stated: number
        let step = 1
        try {
          if (minorSaid) stated = n!
          else if (/^\d/.test(amountText)) {
            stated = parseMoneyToMinor(amountText, data.currency)
            if (!/[.,]\d{1,3}$/.test(amountText) || /[.,]\d{3}$/.test(amountText)) step = 10 ** digits
          } else {
            stated = n! * 10 ** digits
            step = 10 ** digits
          }
        } catch (e) {
          if (e instanceof MoneyError) return { verdict: 'unknown', detail: `"${amountText}" is not an amount it can read.` }
          throw e
        }
        const money = (minor: number) => formatMoney(minor, data.currency, data.locale)
        const said = `${MODE_WORDS[mode] ? `${MODE_WORDS[mode]} ` : ''}${money(stated)} a serving`
        const eq = (a: number, s: number) => Math.round(a / step) * step === s
        const outcomes = recipesIn(data, ids).map((recipe): Outcome => {
          if (!recipe) return { recipe: null, unknown: 'a recipe is no longer in the studio' }
          if (!recipe.cost) return { recipe, unknown: 'it has not been costed' }
          const figures = [false, true].map((withOptional) => {
            const gaps = costGapsFor(recipe.cost!, withOptional)
            const minor = withOptional ? recipe.cost!.perServingWithOptionalMinor : recipe.cost!.perServingMinor
            return { withOptional, minor, gaps, ok: gaps.length ? null : holds(mode, minor, stated, eq) }
          })
          const same = figures[0]!.minor === figures[1]!.minor && !figures[1]!.gaps.length
          const words = (f: (typeof figures)[number]) => `${money(f.minor)} a serving${f.withOptional && !same ? ' with the optional ingredients' : ''}`
          const figure = same ? words(figures[0]!) : `${words(figures[0]!)}, ${money(figures[1]!.minor)} with the optional ingredients`
          if (mode === 'eq') {
            // a bare figure is true when it is either one
            if (figures.some((f) => f.ok === true)) return { recipe, ok: true, figure }
            const gap = figures.find((f) => f.ok === null)
            if (gap) return { recipe, unknown: gapWords(gap.gaps) }
            return { recipe, ok: false, figure }
          }
          const bad = figures.find((f) => f.ok === false)
          if (bad) return { recipe, ok: false, figure: `it costs ${words(bad)}` }
          const gap = figures.find((f) => f.ok === null)
          if (gap) return { recipe, unknown: gapWords(gap.gaps) }
          return { recipe, ok: true, figure }
        })
        return verdictOf(outcomes, said)
      },
    })
  }
  return out
}

// ——— servings ———

const RANGE = `(?:\\s*(?:-|–|to)\\s*(${NUM}))?`
const PEOPLE = '(?:people|persons|guests|adults|diners)'
const SERVINGS_RES = [
  new RegExp(`\\b(${NUM})${RANGE}\\s+(?:servings?|portions?)\\b`, 'gi'),
  new RegExp(`\\b(?:serves|feeds)\\s+(${NUM})${RANGE}(?:\\s+${PEOPLE})?\\b`, 'gi'),
  new RegExp(`\\bfor\\s+(${NUM})${RANGE}(?:\\s+(?:${PEOPLE}|of you|of us)\\b|(?=\\s*(?:[.,;:!?)—–]|$)))`, 'gi'),
]

function servingsClaims(text: string, data: ShowData): Found[] {
  return SERVINGS_RES.flatMap((re) => [...text.matchAll(re)].flatMap((m): Found[] => {
    const lo = readNumber(m[1]!)
    const hi = m[2] ? readNumber(m[2]) : lo
    if (lo === null || hi === null) return []
    return [{
      start: m.index!, end: m.index! + m[0].length, text: m[0], kind: 'servings',
      check: () => {
        const ok = data.servings >= Math.min(lo, hi) && data.servings <= Math.max(lo, hi)
        const said = lo === hi ? `${lo}` : `${lo} to ${hi}`
        return ok
          ? { verdict: 'true', detail: `The episode is shot for ${data.servings} servings.` }
          : { verdict: 'false', detail: `The episode is shot for ${data.servings} servings, not ${said}.` }
      },
    }]
  }))
}

// ——— how long a recipe takes ———

const HOURS = '(?:hours?|hrs?)'
const MINUTES = '(?:minutes?|mins?)'
const DURATION = `(?:an? hour and a half|${NUM} and a half ${HOURS}|half an hour|a half hour|(?:a )?quarter of an hour|(?:${NUM}|an?) ${HOURS}(?:,? (?:and )?${NUM} ${MINUTES})?|${NUM} ${MINUTES})`
const LEAD = `(?:(takes?|taking)\\s+)?(?:(in)\\s+)?(?:(${CMP})\\s+)?`
const TAIL = '(?:,?\\s+(?:from )?start to finish|\\s+in total|\\s+all in|\\s+all told|\\s+tops)'
const TIME_RE = new RegExp(`\\b${LEAD}(${DURATION})(${TAIL})?\\b`, 'gi')
const MEALS = '(?:meals?|dinners?|lunch(?:es)?|suppers?|breakfasts?|recipes?|dish(?:es)?)'
const ADJ_RE = new RegExp(`\\b(${NUM})-(minute|hour)\\s+${MEALS}\\b`, 'gi')

/** Seconds in a time said in words: "an hour and a half" → 5400, "1 hr 10 mins" → 4200, "half an hour" → 1800. */
export function readDuration(words: string): number | null {
  const w = words.toLowerCase().replace(/\s+/g, ' ').trim()
  if (/^an? hour and a half$/.test(w)) return 5400
  if (/^(half an hour|a half hour)$/.test(w)) return 1800
  if (/^(a )?quarter of an hour$/.test(w)) return 900
  let m = new RegExp(`^(${NUM}) and a half ${HOURS}$`).exec(w)
  if (m) return (readNumber(m[1]!) ?? NaN) * 3600 + 1800
  m = new RegExp(`^(${NUM}|an?) ${HOURS}(?:,? (?:and )?(${NUM}) ${MINUTES})?$`).exec(w)
  if (m) {
    const h = /^an?$/.test(m[1]!) ? 1 : readNumber(m[1]!)
    const min = m[2] ? readNumber(m[2]) : 0
    return h === null || min === null ? null : h * 3600 + min * 60
  }
  m = new RegExp(`^(${NUM}) ${MINUTES}$`).exec(w)
  if (m) {
    const n = readNumber(m[1]!)
    return n === null ? null : n * 60
  }
  return null
}

function timeFound(start: number, text: string, stated: number, mode: Mode, data: ShowData, ids: readonly number[]): Found {
  return {
    start, end: start + text.length, text, kind: 'time',
    check: () => {
      const said = `${MODE_WORDS[mode] ? `${MODE_WORDS[mode]} ` : ''}${totalTimeSpoken(stated)}`
      const eq = (a: number, s: number) => Math.abs(a - s) <= Math.max(60, s * 0.1)
      const outcomes = recipesIn(data, ids).map((recipe): Outcome => {
        if (!recipe) return { recipe: null, unknown: 'a recipe is no longer in the studio' }
        if (recipe.totalSeconds == null) return { recipe, unknown: 'it has no total time' }
        const figure = `it takes ${totalTimeSpoken(recipe.totalSeconds)} in total`
        return { recipe, ok: holds(mode, recipe.totalSeconds, stated, eq), figure }
      })
      return verdictOf(outcomes, said)
    },
  }
}

function timeClaims(text: string, data: ShowData, ids: readonly number[]): Found[] {
  const out: Found[] = []
  for (const m of text.matchAll(TIME_RE)) {
    const [, takes, inWord, cmp, duration, tail] = m
    if (!takes && !inWord && !cmp && !tail) continue
    if (/\bfor\s*$/i.test(text.slice(0, m.index!))) continue // "simmer for 20 minutes": a step's time
    const stated = readDuration(duration!)
    if (stated === null) continue
    let mode: Mode = cmp ? MODES[cmp.toLowerCase()]! : inWord ? 'le' : 'eq'
    if (inWord && mode === 'eq') mode = 'le' // "in just 20 minutes" is a promise of at most
    out.push(timeFound(m.index!, m[0], stated, mode, data, ids))
  }
  for (const m of text.matchAll(ADJ_RE)) {
    const n = readNumber(m[1]!)
    if (n !== null) out.push(timeFound(m.index!, m[0], n * (m[2]!.toLowerCase() === 'hour' ? 3600 : 60), 'eq', data, ids))
  }
  return out
}

/** The figures a line states in plain words, each checked against the data of the recipes `recipeIds` (see claimScope). */
export function checkClaims(text: string, data: ShowData, recipeIds: readonly number[]): Claim[] {
  const found = [...costClaims(text, data, recipeIds), ...timeClaims(text, data, recipeIds), ...servingsClaims(text, data)]
    .sort((a, b) => a.start - b.start || b.end - a.end)
  const kept: Found[] = []
  for (const f of found) if (!kept.some((k) => f.start < k.end && k.start < f.end)) kept.push(f)
  return kept.map((f) => ({ text: f.text, kind: f.kind, ...f.check(), start: f.start, end: f.end }))
}

/**
 * The claims in a script's words, each run of words between live fields on its own (a field is always
 * true); `piece` is the index of the words in the script, `start` and `end` count within them.
 */
export function checkScriptClaims(script: readonly ScriptPiece[], data: ShowData, recipeIds: readonly number[]): (Claim & { piece: number })[] {
  return script.flatMap((p, piece) => ('text' in p ? checkClaims(p.text, data, recipeIds).map((c) => ({ ...c, piece })) : []))
}
