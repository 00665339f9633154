// Claims in plain words checked against the data (shared/utils/script-claims.ts). Money per
// serving is compared in ISO 4217 minor units (money.ts: GBP has 2 minor digits), a figure said
// without decimals to the whole pound; times in seconds (1 h = 3600 s); servings against the
// servings the episode is shot for. "About" is within 10 % (our rule, no standard). The data is
// invented and each verdict worked by hand.
import { describe, expect, it } from 'vitest'
import { checkClaims, checkScriptClaims, CHECKABLE_CLAIMS, claimScope, readDuration, readNumber } from '../../shared/utils/script-claims'
import type { ShowData } from '../../shared/utils/live-fields'

const episode = (): ShowData => ({
  servings: 4,
  display: { system: 'metric' },
  locale: 'en-GB',
  currency: 'GBP',
  budgetPerServingMinor: 200,
  recipes: [
    { id: 1, title: 'Lentil soup', servings: 4, totalSeconds: 2400, ingredients: [],
      cost: { perServingMinor: 160, perServingWithOptionalMinor: 175, complete: true, gaps: [] } },
    { id: 2, title: 'Herb rice', servings: 4, totalSeconds: 1500, ingredients: [],
      cost: { perServingMinor: 190, perServingWithOptionalMinor: 210, complete: true, gaps: [] } },
    { id: 3, title: 'Pan bread', servings: 4, totalSeconds: 1200, ingredients: [],
      cost: { perServingMinor: 45, perServingWithOptionalMinor: 45, complete: true, gaps: [] } },
  ],
})
const ALL = [1, 2, 3]
const one = (text: string, ids: number[] = ALL, data = episode()) => {
  const claims = checkClaims(text, data, ids)
  expect(claims).toHaveLength(1)
  return claims[0]!
}

describe('cost per serving', () => {
  it('the issue\'s intro: "each under £2 a serving" is false when one recipe costs £2.10 with its garnish', () => {
    const [c, servings] = checkClaims('Three dinners, each under £2 a serving, each for four.', episode(), ALL)
    expect(servings).toMatchObject({ kind: 'servings', verdict: 'true', text: 'for four' })
    expect(c).toMatchObject({ kind: 'cost', verdict: 'false', text: 'under £2 a serving' })
    expect(c!.detail).toBe('Herb rice: it costs £2.10 a serving with the optional ingredients, not under £2.00 a serving.')
  })
  it('holds for one recipe segment when its figures do, with and without the optional ingredients', () => {
    const c = one('All this for under £2 a serving.', [1])
    expect(c.verdict).toBe('true')
    expect(c.detail).toBe('Lentil soup: £1.60 a serving, £1.75 with the optional ingredients.')
  })
  it('reads other wordings: less than, per portion, a head, pence, words', () => {
    expect(one('less than £1 per portion', [3]).verdict).toBe('true') // 45p < 100p
    expect(one('less than £1 per portion', [1]).verdict).toBe('false')
    expect(one('£1.60 a head', [1]).verdict).toBe('true') // bare: equals the figure without optional
    expect(one('£1.75 a head', [1]).verdict).toBe('true') // or with them
    expect(one('£1.70 a head', [1]).verdict).toBe('false')
    expect(one('£2 a head', [1]).verdict).toBe('true') // said to the pound: £1.60 and £1.75 round to £2
    expect(one('45p a portion', [3]).verdict).toBe('true')
    expect(one('two pounds a serving', [2]).verdict).toBe('true') // £1.90 → £2
    expect(one('at least £2 a serving', [2]).verdict).toBe('false') // £1.90 without the optional
    expect(one('about £2 a serving', [2]).verdict).toBe('true') // 190 and 210 within 10 % of 200
  })
  it('is unknown when a price is missing, the recipe is gone, or the currency differs', () => {
    const d = episode()
    d.recipes[0]!.cost = { perServingMinor: 160, perServingWithOptionalMinor: 160, complete: false, gaps: [{ item: 'Parsley', optional: true, status: 'no-price' }] }
    const c = one('under £2 a serving', [1], d)
    expect(c).toMatchObject({ verdict: 'unknown', detail: 'Cannot check: Lentil soup: Parsley has no price.' })
    expect(one('under £2 a serving', [9]).detail).toBe('Cannot check: a recipe is no longer in the studio.')
    expect(one('under $3 a serving', [1])).toMatchObject({ verdict: 'unknown', detail: 'It is said in dollars, but the episode is costed in GBP.' })
    expect(one('under £2 a serving', [])).toMatchObject({ verdict: 'unknown' })
  })
  it('"under" is strictly below, "no more than" allows the figure itself', () => {
    const d = episode()
    d.recipes[2]!.cost = { perServingMinor: 200, perServingWithOptionalMinor: 200, complete: true, gaps: [] }
    expect(one('under £2 a serving', [3], d).verdict).toBe('false') // 200 is not < 200
    expect(one('no more than £2 a serving', [3], d).verdict).toBe('true') // 200 ≤ 200
    expect(one('over £1.99 a serving', [3], d).verdict).toBe('true') // 200 > 199
  })
  it('false beats unknown: one recipe over budget is enough', () => {
    const d = episode()
    d.recipes[0]!.cost = null
    expect(one('each under £2 a serving', ALL, d).verdict).toBe('false')
  })
  it('reads money in the episode\'s currency: less than $3 per portion for a USD episode', () => {
    const d = { ...episode(), currency: 'USD', locale: 'en-US' }
    expect(one('less than $3 per portion', ALL, d)).toMatchObject({ verdict: 'true', text: 'less than $3 per portion' })
    expect(one('50 cents a serving', [3], d).verdict).toBe('false') // 45 ≠ 50
  })
  it('does not read an amount without "a serving" as a claim', () => {
    expect(checkClaims('The lentils cost £1.20 a bag.', episode(), ALL)).toEqual([])
  })
})

describe('servings', () => {
  it.each([
    ['four servings', 'true'], ['4 portions', 'true'], ['serves 4', 'true'], ['serves four people', 'true'], ['for four.', 'true'],
    ['for 4 people', 'true'], ['serves 4 to 6', 'true'], ['feeds six', 'false'], ['a dozen servings', 'false'], ['for two, or four.', 'false'],
  ])('"%s" for an episode shot for 4 is %s', (text, verdict) => {
    expect(checkClaims(text, episode(), ALL)[0]).toMatchObject({ kind: 'servings', verdict })
  })
  it('names the figure when false, and does not take "for four minutes" as servings', () => {
    expect(one('serves six').detail).toBe('The episode is shot for 4 servings, not 6.')
    expect(checkClaims('Bake for four minutes more', episode(), ALL)).toEqual([])
  })
})

describe('how long a recipe takes', () => {
  it('reads times in words', () => {
    expect(readDuration('half an hour')).toBe(1800)
    expect(readDuration('an hour and a half')).toBe(5400)
    expect(readDuration('two and a half hours')).toBe(9000)
    expect(readDuration('1 hr 10 mins')).toBe(4200)
    expect(readDuration('an hour')).toBe(3600)
    expect(readDuration('forty-five minutes')).toBe(2700)
    expect(readDuration('a quarter of an hour')).toBe(900)
  })
  it('checks every recipe of the episode in an intro, one recipe in its segment', () => {
    expect(one('all ready in under half an hour').verdict).toBe('false') // soup: 2400 s ≥ 1800 s
    expect(one('all ready in under half an hour').detail).toBe('Lentil soup: it takes 40 min in total, not under 30 min.')
    expect(one('ready in under half an hour', [2, 3]).verdict).toBe('true') // 1500 s and 1200 s < 1800 s
    expect(one('in 20 minutes', [3]).verdict).toBe('true') // at most 1200 s
    expect(one('takes an hour', [1]).verdict).toBe('false') // 2400 s is not within 10 % of 3600 s
    expect(one('a 40-minute dinner', [1]).verdict).toBe('true')
    expect(one('forty minutes start to finish', [1]).verdict).toBe('true')
    expect(one('in less than an hour and a half', ALL).verdict).toBe('true')
  })
  it('leaves a step\'s own time alone, and is unknown without a total time', () => {
    expect(checkClaims('Simmer for 20 minutes, then stir.', episode(), [1])).toEqual([])
    expect(checkClaims('Simmer for about 20 minutes.', episode(), [1])).toEqual([])
    const d = episode()
    d.recipes[0]!.totalSeconds = null
    expect(one('in under an hour', [1], d)).toMatchObject({ verdict: 'unknown', detail: 'Cannot check: Lentil soup: it has no total time.' })
  })
})

describe('a whole line, scope and the list of checkable claims', () => {
  it('finds each claim once, in order', () => {
    const claims = checkClaims('Three dinners for four, each under £2 a serving, on the table in under an hour.', episode(), ALL)
    expect(claims.map((c) => [c.kind, c.text, c.verdict])).toEqual([
      ['servings', 'for four', 'true'], ['cost', 'under £2 a serving', 'false'], ['time', 'in under an hour', 'true'],
    ])
  })
  it('checks only the words of a script: a live field is always true', () => {
    const claims = checkScriptClaims([{ text: 'Just ' }, { field: { kind: 'cost', recipeId: 2, withOptional: true } }, { text: ' a serving, serves 4' }], episode(), [2])
    expect(claims).toEqual([expect.objectContaining({ kind: 'servings', verdict: 'true', piece: 2, text: 'serves 4' })])
  })
  it('a recipe segment is about its recipe, the others about every recipe', () => {
    expect(claimScope({ kind: 'recipe', recipeId: 2 }, episode())).toEqual([2])
    expect(claimScope({ kind: 'intro' }, episode())).toEqual([1, 2, 3])
    expect(claimScope({ kind: 'outro' }, episode())).toEqual([1, 2, 3])
  })
  it('number words one to twelve, a dozen and tens', () => {
    expect(['one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve'].map(readNumber)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12])
    expect(readNumber('a dozen')).toBe(12)
    expect(readNumber('twenty-five')).toBe(25)
    expect(readNumber('lots')).toBeNull()
  })
  it('says in words which claims it checks, each with examples it really reads', () => {
    expect(CHECKABLE_CLAIMS.map((c) => c.kind)).toEqual(['cost', 'servings', 'time'])
    const d = { ...episode(), currency: 'GBP' }
    for (const c of CHECKABLE_CLAIMS) {
      for (const example of c.examples) {
        if (example.includes('$')) continue // said in another currency: found, and unknown for a GBP episode
        const found = checkClaims(example, d, ALL)
        expect(found.map((f) => f.kind), example).toEqual([c.kind])
      }
    }
  })
})
