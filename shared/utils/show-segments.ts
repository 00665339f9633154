// The episode as a show: a run order of segments (intro, recipe, sponsor read, outro, free), each
// with a script. A script is a list of pieces: plain words, or a live field that renders from the
// data at shoot time (live-fields.ts). Fields are stored as JSON and picked from a list in the
// editor, never typed as code, so a script has no braces grammar of its own (step-text.ts keeps
// `{{key}}` for step text only). Messages are instructions without the field's name: the refusal
// puts the label in front (field-labels.ts).
import { z } from 'zod'
import { typed } from './input-words'
import { INGREDIENT_KEY } from './step-text'

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

export const SEGMENT_MAX = 60
export const SCRIPT_PIECES_MAX = 400
export const SCRIPT_TEXT_MAX = 2000
export const SEGMENT_TITLE_MAX = 120
export const SHOT_MAX = 200

const RECIPE = 'choose a recipe from the list (a whole number such as 12).'
const recipeId = z.number({ error: typed(RECIPE) }).int(RECIPE).positive(RECIPE)

export const liveFieldSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('servings') }).strict(),
  z.object({
    kind: z.literal('amount'),
    recipeId,
    ingredientKey: z.string({ error: typed('choose an ingredient from the list.') })
      .regex(INGREDIENT_KEY, 'choose an ingredient from the list.'),
  }).strict(),
  z.object({ kind: z.literal('cost'), recipeId, withOptional: z.boolean({ error: 'choose with or without the optional ingredients.' }) }).strict(),
  z.object({ kind: z.literal('budget') }).strict(),
  z.object({
    kind: z.literal('oven'),
    celsius: z.number({ error: typed('write the oven temperature in °C, such as 200.') })
      .int('write a whole number of °C, such as 200.').min(50, 'write at least 50 °C.').max(300, 'write at most 300 °C.'),
  }).strict(),
  z.object({ kind: z.literal('total-time'), recipeId }).strict(),
], { error: 'choose a live field from the list: servings, amount, cost, budget, oven or total-time.' })

/** Words or a live field: exactly one of the two, so a problem inside a field is named where it is. */
export const scriptPieceSchema = z.object({
  text: z.string({ error: typed('write it as text.') }).max(SCRIPT_TEXT_MAX, `write at most ${SCRIPT_TEXT_MAX} characters.`).optional(),
  field: liveFieldSchema.optional(),
}, { error: 'send words or a live field chosen from the list.' }).strict().superRefine((p, ctx) => {
  if ((p.text === undefined) === (p.field === undefined)) ctx.addIssue({ code: 'custom', message: 'send either words or one live field chosen from the list.' })
}).transform((p): ScriptPiece => (p.field ? { field: p.field as LiveField } : { text: p.text! }))

const scriptSchema = z.array(scriptPieceSchema, { error: 'send the script as a list of words and live fields.' })
  .max(SCRIPT_PIECES_MAX, `keep it to at most ${SCRIPT_PIECES_MAX} pieces of words and fields.`)

const SEGMENT_ID = 'send the id Hobline gave the segment: letters, digits, "-" and "_", at most 40.'

export const showSegmentSchema = z.object({
  id: z.string({ error: typed(SEGMENT_ID) }).regex(/^[A-Za-z0-9_-]{1,40}$/, SEGMENT_ID),
  kind: z.enum(SEGMENT_KINDS, { error: `choose one of: ${SEGMENT_KINDS.join(', ')}.` }),
  title: z.string({ error: typed('write it as text.') }).trim().min(1, 'give the segment a title.')
    .max(SEGMENT_TITLE_MAX, `write at most ${SEGMENT_TITLE_MAX} characters.`),
  recipeId: recipeId.optional(),
  script: scriptSchema,
  closing: scriptSchema.optional(),
  shot: z.string({ error: typed('write it as text.') }).trim().max(SHOT_MAX, `write at most ${SHOT_MAX} characters.`).optional(),
}).strict().superRefine((s, ctx) => {
  if (s.kind === 'recipe' && s.recipeId === undefined) ctx.addIssue({ code: 'custom', path: ['recipeId'], message: 'choose the recipe this segment cooks.' })
  if (s.kind !== 'recipe' && s.recipeId !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['recipeId'], message: 'leave it out: only a recipe segment cooks a recipe.' })
  }
  if (s.kind !== 'recipe' && s.closing?.length) {
    ctx.addIssue({ code: 'custom', path: ['closing'], message: 'leave it out: only a recipe segment has closing lines; write them in the script.' })
  }
})

export const showSegmentsSchema = z.array(showSegmentSchema, { error: 'send the run order as a list of segments.' })
  .max(SEGMENT_MAX, `keep it to at most ${SEGMENT_MAX} segments.`)
  .superRefine((list, ctx) => {
    const seen = new Set<string>()
    list.forEach((s, i) => {
      if (seen.has(s.id)) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: 'give each segment its own id; this one is used twice.' })
      seen.add(s.id)
    })
  })

/** A segment id for a new segment: 8 letters and digits, unlikely to meet another in one episode. */
export function newSegmentId(random: () => number = Math.random): string {
  const alphabet = 'abcdefghijkmnpqrstuvwxyz23456789'
  return Array.from({ length: 8 }, () => alphabet[Math.floor(random() * alphabet.length)]).join('')
}
