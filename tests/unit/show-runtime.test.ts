// Planned runtime (shared/utils/show-runtime.ts). The pace is words a minute, so a word takes
// 60 000 ÷ wpm ms (the definition of the rate). The default, 150 wpm, is the National Center for
// Voice and Speech's figure for the average rate of conversational English (about 150 wpm; cited
// from memory). The small episode below is worked by hand.
import { describe, expect, it } from 'vitest'
import { readMsFor, showRuntime, SHOW_WPM_DEFAULT, cookShares } from '../../shared/utils/show-runtime'

const words = (n: number) => Array.from({ length: n }, () => 'word').join(' ')

describe('read time at the named speaking rate', () => {
  it('defaults to 150 wpm (NCVS, conversational English): 150 words a minute, 400 ms a word', () => {
    expect(SHOW_WPM_DEFAULT).toBe(150)
    expect(readMsFor(150)).toBe(60_000)
    expect(readMsFor(1)).toBe(400)
    expect(readMsFor(0)).toBe(0)
  })
  it('follows the host\'s pace and refuses a pace that is not above zero', () => {
    expect(readMsFor(130, 130)).toBe(60_000)
    expect(readMsFor(100, 120)).toBe(50_000) // 100 × 60 000 ÷ 120
    expect(readMsFor(7, 170)).toBe(2471) // 7 × 60 000 ÷ 170 = 2470.6
    expect(() => readMsFor(10, 0)).toThrow(RangeError)
  })
})

describe('showRuntime: a small episode worked by hand', () => {
  // Intro: "Three dinners, each under £2.00 a serving." → Three, dinners, each, under, 2, 00, a, serving = 8 words.
  // Recipe: 45 words read and 12 min on camera.  Outro: 30 words.  Target 15 min.
  const episode = [
    { id: 'intro', text: 'Three dinners, each under £2.00 a serving.' },
    { id: 'soup', text: words(45), cookMs: 12 * 60_000 },
    { id: 'outro', text: words(30) },
  ]
  it('reads each segment at 150 wpm and adds the cook time', () => {
    const r = showRuntime(episode, { targetMs: 15 * 60_000 })
    // 8 × 400 = 3 200 ms; 45 × 400 = 18 000 ms + 720 000 ms = 738 000 ms; 30 × 400 = 12 000 ms.
    expect(r.segments).toEqual([
      { id: 'intro', words: 8, readMs: 3_200, cookMs: 0, totalMs: 3_200 },
      { id: 'soup', words: 45, readMs: 18_000, cookMs: 720_000, totalMs: 738_000 },
      { id: 'outro', words: 30, readMs: 12_000, cookMs: 0, totalMs: 12_000 },
    ])
    // 3 200 + 738 000 + 12 000 = 753 200 ms (12 min 33.2 s); 900 000 − 753 200 = 146 800 ms under.
    expect(r.totalMs).toBe(753_200)
    expect(r.targetMs).toBe(900_000)
    expect(r.overMs).toBe(-146_800)
  })
  it('runs over a shorter target, and has no over/under without one', () => {
    expect(showRuntime(episode, { targetMs: 12 * 60_000 }).overMs).toBe(33_200)
    expect(showRuntime(episode).overMs).toBeNull()
    // At 120 wpm a word is 500 ms: 83 words = 41 500 ms, + 720 000.
    expect(showRuntime(episode, { wpm: 120 }).totalMs).toBe(761_500)
  })
})

describe('cookShares: each recipe segment\'s part of the cook plan (our own proportional rule)', () => {
  it('gives recipes cooked one after another their own lengths (worked by hand)', () => {
    // Stew 0–30 min, bread 30–50 min: spans 30 and 20 of a 50-minute plan.
    const shares = cookShares([
      { id: 'stew', steps: [{ startMs: 0, endMs: 600_000 }, { startMs: 600_000, endMs: 1_800_000 }] },
      { id: 'bread', steps: [{ startMs: 1_800_000, endMs: 3_000_000 }] },
    ], 3_000_000)
    expect(shares.get('stew')).toBe(1_800_000)
    expect(shares.get('bread')).toBe(1_200_000)
  })

  it('splits an overlap in proportion to the spans and adds up to the makespan exactly', () => {
    // Side by side in a 60-minute plan: spans 60, 30 and 10 minutes → 36, 18 and 6 minutes.
    const shares = cookShares([
      { id: 'a', steps: [{ startMs: 0, endMs: 3_600_000 }] },
      { id: 'b', steps: [{ startMs: 600_000, endMs: 2_400_000 }] },
      { id: 'c', steps: [{ startMs: 3_000_000, endMs: 3_600_000 }] },
    ], 3_600_000)
    expect([...shares.values()]).toEqual([2_160_000, 1_080_000, 360_000])
    const odd = cookShares([{ id: 'x', steps: [{ startMs: 0, endMs: 1 }] }, { id: 'y', steps: [{ startMs: 0, endMs: 2 }] }], 1000)
    expect([...odd.values()].reduce((a, b) => a + b, 0)).toBe(1000)
  })

  it('gives a recipe without steps no cook time', () => {
    const shares = cookShares([{ id: 'empty', steps: [] }, { id: 'soup', steps: [{ startMs: 0, endMs: 60_000 }] }], 60_000)
    expect(shares.get('empty')).toBe(0)
    expect(shares.get('soup')).toBe(60_000)
    expect(cookShares([{ id: 'none', steps: [] }], 0).get('none')).toBe(0)
  })
})
