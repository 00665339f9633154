// Planned runtime of a show: each segment's read time from its script's word count at the host's
// pace, plus a recipe segment's on-camera cook time from the plan, per segment and in total, against
// the episode's target length. Words are counted as the prompter counts them (wordCount,
// prompter-pace.ts). The default pace is 150 words a minute: the National Center for Voice and Speech
// gives about 150 words a minute as the average rate of conversational English (cited from memory);
// presenters read at roughly 130–170 (device-settings.ts).
import { wordCount } from './prompter-pace'

export const SHOW_WPM_DEFAULT = 150

export interface RuntimeSegmentInput {
  id: string
  /** The script as the host reads it (renderScript's text). */
  text: string
  /** On-camera cook time of a recipe segment, from the plan; 0 or absent for the others. */
  cookMs?: number
}

export interface ShowRuntime {
  segments: { id: string; words: number; readMs: number; cookMs: number; totalMs: number }[]
  totalMs: number
  targetMs: number | null
  /** totalMs − targetMs: above zero the show runs over, below it under; null without a target. */
  overMs: number | null
}

/** Milliseconds to read `words` at `wpm`, to the nearest millisecond: 60 000 × words ÷ wpm. */
export function readMsFor(words: number, wpm: number = SHOW_WPM_DEFAULT): number {
  if (!(wpm > 0) || !Number.isFinite(wpm)) throw new RangeError(`A reading pace is a number of words a minute above zero, not ${wpm}`)
  return Math.round((words * 60_000) / wpm)
}

/** The show's planned runtime, segment by segment and in total, against a target (null for none). */
export function showRuntime(
  segments: readonly RuntimeSegmentInput[], options: { wpm?: number; targetMs?: number | null } = {},
): ShowRuntime {
  const wpm = options.wpm ?? SHOW_WPM_DEFAULT
  const rows = segments.map((s) => {
    const words = wordCount(s.text)
    const readMs = readMsFor(words, wpm)
    const cookMs = Math.max(0, Math.round(s.cookMs ?? 0))
    return { id: s.id, words, readMs, cookMs, totalMs: readMs + cookMs }
  })
  const totalMs = rows.reduce((sum, r) => sum + r.totalMs, 0)
  const targetMs = options.targetMs ?? null
  return { segments: rows, totalMs, targetMs, overMs: targetMs === null ? null : totalMs - targetMs }
}

/**
 * Each recipe segment's share of the cook plan's length (the makespan), in proportion to its own span
 * on the plan (its first step's start to its last step's end). Recipes cooked one after another get
 * about their own length; recipes side by side share the overlap. The shares add up to the makespan
 * exactly (the rounding remainder goes to the last segment with a span). Our own rule: no standard
 * says how to split shared kitchen time between dishes.
 */
export function cookShares(segments: readonly { id: string; steps: readonly { startMs: number; endMs: number }[] }[], makespanMs: number): Map<string, number> {
  const spans = segments.map((s) => (s.steps.length ? Math.max(...s.steps.map((p) => p.endMs)) - Math.min(...s.steps.map((p) => p.startMs)) : 0))
  const sum = spans.reduce((a, b) => a + b, 0)
  const out = new Map<string, number>()
  if (sum <= 0) {
    for (const s of segments) out.set(s.id, 0)
    return out
  }
  const shares = spans.map((span) => Math.round((makespanMs * span) / sum))
  const last = spans.findLastIndex((span) => span > 0)
  shares[last] = shares[last]! + makespanMs - shares.reduce((a, b) => a + b, 0)
  segments.forEach((s, i) => out.set(s.id, shares[i]!))
  return out
}
