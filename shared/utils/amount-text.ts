// Reading and writing the numbers in ingredient lines: 2, 1.5, 1,5, 1/2, ½, 1 1/2, 1½, 1-1/2,
// one, a, half, a quarter, two thirds, one and a half, 1 and 1/2, half a dozen. Written back exactly: whole numbers and
// halves, thirds, quarters and eighths as vulgar fractions (1½, ⅔, 2⅜), anything else as a decimal.

const VULGAR: Record<string, [number, number]> = {
  '½': [1, 2], '⅓': [1, 3], '⅔': [2, 3], '¼': [1, 4], '¾': [3, 4], '⅕': [1, 5], '⅖': [2, 5], '⅗': [3, 5],
  '⅘': [4, 5], '⅙': [1, 6], '⅚': [5, 6], '⅐': [1, 7], '⅛': [1, 8], '⅜': [3, 8], '⅝': [5, 8], '⅞': [7, 8],
  '⅑': [1, 9], '⅒': [1, 10], '↉': [0, 3],
}
const VULGAR_OUT: Record<string, string> = Object.fromEntries(Object.entries(VULGAR).map(([ch, [n, d]]) => [`${n}/${d}`, ch]))

/**
 * Normalise an ingredient line for reading: vulgar fractions become " n/d" (so "1½" reads as
 * "1 1/2"), compatibility forms fold (NFKC: superscript digits, the fraction slash), dashes and
 * the minus sign become "-", and runs of space collapse.
 */
export function normaliseAmountText(text: string): string {
  let s = ''
  for (const ch of text) {
    const v = VULGAR[ch]
    s += v ? ` ${v[0]}/${v[1]} ` : ch
  }
  return s
    .normalize('NFKC')
    .replace(/\u2044/g, '/')
    .replace(/[\u2010-\u2015\u2212]/g, '-')
    .replace(/\s+/g, ' ')
    .replace(/(\d) ?\/ ?(\d)/g, '$1/$2')
    .trim()
}

const WORDS: Record<string, number> = {
  one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12,
}
const PARTS: Record<string, number> = { half: 1 / 2, quarter: 1 / 4, third: 1 / 3, 'three quarters': 3 / 4, 'three-quarters': 3 / 4 }
const WORD = `(?:${Object.keys(WORDS).join('|')})`

interface Reader {
  re: RegExp
  value: (m: RegExpExecArray) => number
}

const num = (t: string) => (t in WORDS ? WORDS[t]! : Number(t))

// Order matters: the longest readings first. All are sticky and case-insensitive; each must end
// at a word boundary so "a" in "almonds" or "one" in "onions" is never read as a number.
const END = '(?![\\p{L}\\d/]|[.,]\\d)'
const READERS: Reader[] = [
  // "half a dozen" before the half reader, which would read it as ½ of "dozen eggs"
  { re: new RegExp(`half a dozen${END}`, 'iuy'), value: () => 6 },
  { re: new RegExp(`(\\d+|${WORD}) and (?:a |one )?(half|quarter|third|three[ -]quarters)${END}`, 'iuy'), value: (m) => num(m[1]!.toLowerCase()) + PARTS[m[2]!.toLowerCase()]! },
  // "1 and 1/2", "one and 3/4": a mixed number written with a word
  { re: new RegExp(`(\\d+|${WORD}) and (\\d+)/(\\d+)${END}`, 'iuy'), value: (m) => num(m[1]!.toLowerCase()) + Number(m[2]) / Number(m[3]) },
  { re: new RegExp(`(\\d+)(?: |-)(\\d+)/(\\d+)${END}`, 'uy'), value: (m) => Number(m[1]) + Number(m[2]) / Number(m[3]) },
  { re: new RegExp(`(\\d+)/(\\d+)${END}`, 'uy'), value: (m) => Number(m[1]) / Number(m[2]) },
  { re: new RegExp(`(?:a |one )?(half|quarter|third)(?: of)?(?: an?)?${END}`, 'iuy'), value: (m) => PARTS[m[1]!.toLowerCase()]! },
  { re: new RegExp(`two thirds(?: of)?(?: an?)?${END}`, 'iuy'), value: () => 2 / 3 },
  { re: new RegExp(`three[ -]quarters(?: of)?(?: an?)?${END}`, 'iuy'), value: () => 3 / 4 },
  { re: new RegExp(`(?:a )?dozen${END}`, 'iuy'), value: () => 12 },
  // 1,000 and 12,500 read as thousands; 0,250 and 1,5 as decimals with a comma.
  { re: new RegExp(`([1-9]\\d{0,2}(?:,\\d{3})+(?:\\.\\d+)?)(?![\\d.,])`, 'uy'), value: (m) => Number(m[1]!.replace(/,/g, '')) },
  { re: new RegExp(`(\\d*[.,]\\d+|\\d+)${END}`, 'uy'), value: (m) => Number(m[1]!.replace(',', '.')) },
  { re: new RegExp(`(\\d*[.,]\\d+|\\d+)(?=\\p{L})`, 'uy'), value: (m) => Number(m[1]!.replace(',', '.')) }, // 400g, 1.5kg
  { re: new RegExp(`(${WORD})${END}`, 'iuy'), value: (m) => WORDS[m[1]!.toLowerCase()]! },
  // "a pinch", "an onion" are one; "a few", "a little", "a splash" are no number at all
  { re: new RegExp(`an?(?= (?!(?:few|little|couple|bit|splash|drizzle|dollop|knob|glug|squeeze|sprinkle|sprinkling|touch|generous)\\b))`, 'iuy'), value: () => 1 },
]

export interface AmountReading {
  value: number
  /** Index just after the reading. */
  end: number
}

/** Read one amount at `pos` of a normalised line, or null when none starts there. */
export function readAmountAt(text: string, pos: number): AmountReading | null {
  for (const r of READERS) {
    r.re.lastIndex = pos
    const m = r.re.exec(text)
    if (m) return { value: r.value(m), end: r.re.lastIndex }
  }
  return null
}

/**
 * An amount written exactly, as a cook reads it: 2, 1½, ⅔, 2⅜, 0.15. Values within 1e-9 of a
 * half, third, quarter or eighth use the vulgar fraction; others a decimal of up to 12 significant
 * digits (which reads back to the same number to within rounding).
 */
export function formatAmountExact(value: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`An amount must be a finite number, not ${value}`)
  if (value < 0) return `-${formatAmountExact(-value)}`
  const whole = Math.floor(value + 1e-9)
  const frac = value - whole
  if (Math.abs(frac) < 1e-9) return String(whole)
  for (const d of [2, 3, 4, 8]) {
    const n = Math.round(frac * d)
    if (n > 0 && n < d && Math.abs(frac - n / d) < 1e-9) {
      // the smallest denominator matches first, so n/d is already in lowest terms
      const ch = VULGAR_OUT[`${n}/${d}`]!
      return whole ? `${whole}${ch}` : ch
    }
  }
  return String(Number(value.toPrecision(12)))
}

/** The vulgar fraction character for n/d, when Unicode has one. */
export function vulgarFraction(n: number, d: number): string | undefined {
  return VULGAR_OUT[`${n}/${d}`]
}
