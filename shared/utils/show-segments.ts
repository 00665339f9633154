// The episode as a show: a run order of segments (intro, recipe, sponsor read, outro, free), each
// with a script. A script is a list of pieces: plain words, or a live field that renders from the
// data at shoot time (live-fields.ts). Fields are stored as JSON and picked from a list in the
// editor, never typed as code, so a script has no braces grammar of its own (step-text.ts keeps
// `{{key}}` for step text only). The request schemas are in show-segment-schemas.ts, apart, so the
// pages that read these words never build a zod schema (zod 4 probes `new Function` when it builds
// one, which the pages' content security policy reports).

export const SEGMENT_KINDS = ['intro', 'recipe', 'sponsor', 'outro', 'free'] as const
export type SegmentKind = (typeof SEGMENT_KINDS)[number]

export type LiveField =
  | { kind: 'servings' }
  | { kind: 'amount'; recipeId: number; ingredientKey: string }
  | { kind: 'cost'; recipeId: number; withOptional: boolean }
  | { kind: 'budget' }
  | { kind: 'oven'; celsius: number }
  | { kind: 'total-time'; recipeId: number }

export type LiveFieldKind = LiveField['kind']
export type ScriptPiece = { text: string } | { field: LiveField }

export interface ShowSegment {
  id: string
  kind: SegmentKind
  title: string
  /** The recipe of a recipe segment; absent for every other kind. */
  recipeId?: number
  /** What the host says as the segment opens (a recipe segment: at its first step). */
  script: ScriptPiece[]
  /** A recipe segment's closing lines, said at its last step (the cost line); empty for the others. */
  closing?: ScriptPiece[]
  /** What the camera frames for a segment without steps ("Host to camera, mid shot"); empty for the kind's usual shot. */
  shot?: string
}

/** What the editor calls each kind, and the title a new segment of that kind starts with. */
export const SEGMENT_WORDS: Readonly<Record<SegmentKind, { label: string; defaultTitle: string; shot: string }>> = {
  intro: { label: 'Intro', defaultTitle: 'Welcome', shot: 'Host to camera, mid shot, the finished dishes in the background' },
  recipe: { label: 'Recipe', defaultTitle: 'Recipe', shot: 'The shot of each step' },
  sponsor: { label: 'Sponsor read', defaultTitle: 'A word from our sponsor', shot: 'Host to camera, mid shot; the sponsor\'s product in frame' },
  outro: { label: 'Outro', defaultTitle: 'Sign-off', shot: 'Wide on the host and every finished dish' },
  free: { label: 'Free segment', defaultTitle: 'Segment', shot: 'Host to camera, mid shot' },
}

/** What the camera frames for a segment: its own shot when written, else the kind's usual one. */
export function segmentShot(segment: { kind: SegmentKind; shot?: string | null }): string {
  return segment.shot?.trim() || SEGMENT_WORDS[segment.kind].shot
}

/** The title a new segment starts with: a recipe segment takes its recipe's title when there is one. */
export function defaultSegmentTitle(kind: SegmentKind, recipeTitle?: string | null): string {
  const t = recipeTitle?.trim()
  return kind === 'recipe' && t ? t : SEGMENT_WORDS[kind].defaultTitle
}

/** The run order with the segment `id` moved to position `to` (0-based, clamped); a new list, the old one untouched. */
export function moveSegment<T extends { id: string }>(segments: readonly T[], id: string, to: number): T[] {
  const from = segments.findIndex((s) => s.id === id)
  if (from < 0) throw new RangeError(`No segment has the id "${id}"`)
  const out = [...segments]
  const [moved] = out.splice(from, 1)
  const at = Math.max(0, Math.min(out.length, Math.trunc(Number.isFinite(to) ? to : out.length)))
  out.splice(at, 0, moved!)
  return out
}

/** The words of a script without its live fields, for counting and for checking claims in plain words. */
export function scriptPlainText(script: readonly ScriptPiece[]): string {
  return script.map((p) => ('text' in p ? p.text : '')).join('')
}

/** A segment id for a new segment: 8 letters and digits, unlikely to meet another in one episode. */
export function newSegmentId(random: () => number = Math.random): string {
  const alphabet = 'abcdefghijkmnpqrstuvwxyz23456789'
  return Array.from({ length: 8 }, () => alphabet[Math.floor(random() * alphabet.length)]).join('')
}
