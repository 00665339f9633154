// The publish kit's words and numbers, from the take log: one chapter line per segment of the video
// description ("m:ss Title", where the segment first comes on screen in the recording), the `Clip`
// parts of a recipe's schema.org VideoObject (one per step chapter of its segment), and the video
// description in plain text, ready to copy. Pure: the server gathers the data (server/utils/publish.ts).
import type { TakeChapter } from './take-log'
import { clockTextMs } from './clock-text'

export interface ChapterLine {
  segmentId: string
  title: string
  recordingMs: number
  /** "m:ss Title" ("h:mm:ss Title" from an hour), the time rounded down to the second it starts in. */
  line: string
}

/**
 * One line per part of the show (a talk segment, or a recipe: a cook-plan segment interleaves
 * recipes), at its first chapter in recording order; a part the recording never reached has no
 * line. Video sites read such lines as chapters when the first says 0:00 (common practice of video
 * sites; not a standard): `startsAtZero` says whether it does.
 */
export function segmentChapterLines(chapters: readonly TakeChapter[]): { lines: ChapterLine[]; startsAtZero: boolean } {
  const seen = new Set<string>()
  const lines: ChapterLine[] = []
  for (const c of [...chapters].sort((a, b) => a.recordingMs - b.recordingMs)) {
    if (seen.has(c.partId)) continue
    seen.add(c.partId)
    lines.push({ segmentId: c.segmentId, title: c.partTitle, recordingMs: c.recordingMs, line: `${clockTextMs(c.recordingMs, 'down')} ${c.partTitle}` })
  }
  return { lines, startsAtZero: lines.length > 0 && lines[0]!.recordingMs < 1000 }
}

export interface StepChapter {
  stepId: string | null
  name: string
  recordingMs: number
}

/** Seconds as schema.org's startOffset/endOffset take them (a Number of seconds), kept to the millisecond. */
export const offsetSeconds = (ms: number) => Math.round(ms) / 1000

/**
 * The `Clip` parts of a recipe's video: one per chapter of its steps (the first visit of each step),
 * each ending where the next chapter of the recording starts (or where the recording ends).
 * `url` is the video's address at that second (`t=` seconds, as video sites read it: common practice).
 */
export function recipeClips(
  stepIds: ReadonlySet<string>, chapters: readonly (TakeChapter & { name: string })[], recordingEndMs: number, videoUrl: string | null,
): Record<string, unknown>[] {
  const all = [...chapters].sort((a, b) => a.recordingMs - b.recordingMs)
  const firstOfStep = new Set<string>()
  const clips: Record<string, unknown>[] = []
  all.forEach((c, i) => {
    if (c.stepId === null || !stepIds.has(c.stepId) || firstOfStep.has(c.stepId)) return
    firstOfStep.add(c.stepId)
    const end = all[i + 1]?.recordingMs ?? recordingEndMs
    const clip: Record<string, unknown> = {
      '@type': 'Clip', name: c.name, startOffset: offsetSeconds(c.recordingMs), endOffset: offsetSeconds(Math.max(end, c.recordingMs)),
    }
    if (videoUrl) clip.url = videoAt(videoUrl, c.recordingMs)
    clips.push(clip)
  })
  return clips
}

/** The video's address at a second of it (`t=` whole seconds). */
export function videoAt(videoUrl: string, ms: number): string {
  const url = new URL(videoUrl)
  url.searchParams.set('t', String(Math.floor(ms / 1000)))
  return url.toString()
}

export interface DescriptionRecipe {
  title: string
  /** "£1.62 a serving (£1.85 with the optional parsley)", or words saying what the figure lacks. */
  costLine: string
  ingredients: string[]
  pageUrl: string | null
}

/** The video description: the premise, the chapters, then each recipe's cost and ingredients. */
export function videoDescription(input: {
  title: string; premise: string; chapters: ChapterLine[]; recipes: DescriptionRecipe[]; pricesLine: string
}): string {
  const out: string[] = [input.title, '']
  if (input.premise.trim()) out.push(input.premise.trim(), '')
  if (input.chapters.length) out.push('Chapters', ...input.chapters.map((c) => c.line), '')
  for (const r of input.recipes) {
    out.push(r.title, r.costLine)
    if (r.pageUrl) out.push(`Recipe: ${r.pageUrl}`)
    out.push(...r.ingredients.map((i) => `- ${i}`), '')
  }
  if (input.pricesLine) out.push(input.pricesLine)
  return `${out.join('\n').trim()}\n`
}
