// Planned runtime (shared/utils/show-runtime.ts). The pace is words a minute, so a word takes
// 60 000 ÷ wpm ms (the definition of the rate). The default, 150 wpm, is the National Center for
// Voice and Speech's figure for the average rate of conversational English (about 150 wpm; cited
// from memory). The small episode below is worked by hand.
import { describe, expect, it } from 'vitest'
import { readMsFor, showRuntime, SHOW_WPM_DEFAULT } from '../../shared/utils/show-runtime'

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
