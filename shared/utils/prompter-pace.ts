// Reading pace on the prompter: which line of a step the host is on, from how long the step has
// been on screen and a pace in words per minute. Words are counted as runs of letters or digits
// (with inner apostrophes and hyphens), the way speaking rates are usually counted (common practice).

/** Words in a line. */
export function wordCount(line: string): number {
  return line.match(/[\p{L}\p{N}]+(?:['’-][\p{L}\p{N}]+)*/gu)?.length ?? 0
}

/** How long lines take to read at a pace, in ms; a line without words still takes a beat (600 ms). */
export function readingMs(lines: readonly string[], wpm: number): number[] {
  if (!(wpm > 0)) throw new RangeError(`a reading pace is a positive number of words per minute (got ${wpm})`)
  return lines.map((l) => Math.max(600, (wordCount(l) / wpm) * 60_000))
}

/** The line being read after `elapsedMs` at a pace: 0 at the start, the last line once all are read. */
export function currentLineAt(lines: readonly string[], wpm: number, elapsedMs: number): number {
  if (lines.length === 0) return 0
  const times = readingMs(lines, wpm)
  let t = Math.max(0, elapsedMs)
  for (let i = 0; i < times.length; i++) {
    if (t < times[i]!) return i
    t -= times[i]!
  }
  return lines.length - 1
}
