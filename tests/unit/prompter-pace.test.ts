// Reading pace. A words-per-minute rate gives 60 000 / wpm ms per word (the definition of the rate);
// 150 wpm, a usual broadcast speaking rate, is 400 ms a word (common practice).
import { describe, expect, it } from 'vitest'
import { currentLineAt, readingMs, wordCount } from '../../shared/utils/prompter-pace'

describe('wordCount', () => {
  it('counts words, keeping contractions and hyphenated words whole', () => {
    expect(wordCount("Low and slow here — we want it sweet, not brown.")).toBe(10)
    expect(wordCount("It's a one-pot supper")).toBe(4)
    expect(wordCount('Add 240 mL')).toBe(3)
    expect(wordCount(' — ')).toBe(0)
  })
})

describe('readingMs', () => {
  it('is 60 000 / wpm ms a word: 150 words at 150 wpm is one minute', () => {
    const line = Array.from({ length: 150 }, () => 'word').join(' ')
    expect(readingMs([line], 150)).toEqual([60_000])
    expect(readingMs(['one two three'], 150)).toEqual([1200])
  })
  it('gives a line without words a short beat, and refuses a pace that is not positive', () => {
    expect(readingMs(['…'], 150)).toEqual([600])
    expect(() => readingMs(['x'], 0)).toThrow(/positive/)
  })
})

describe('currentLineAt', () => {
  const lines = ['one two three', 'four five', 'six']
  it('moves to the next line once a line has had its time', () => {
    // At 150 wpm: 1200 ms, 800 ms, then 600 ms (the beat floor for one word is 400 ms).
    expect(currentLineAt(lines, 150, 0)).toBe(0)
    expect(currentLineAt(lines, 150, 1199)).toBe(0)
    expect(currentLineAt(lines, 150, 1200)).toBe(1)
    expect(currentLineAt(lines, 150, 1999)).toBe(1)
    expect(currentLineAt(lines, 150, 2000)).toBe(2)
  })
  it('stays on the last line after the end, and on the first before the start', () => {
    expect(currentLineAt(lines, 150, 60_000)).toBe(2)
    expect(currentLineAt(lines, 150, -5)).toBe(0)
    expect(currentLineAt([], 150, 100)).toBe(0)
  })
})
