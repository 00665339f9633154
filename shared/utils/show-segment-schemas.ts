// The request schemas of a show's run order (show-segments.ts has the types and words). Messages are
// instructions without the field's name: the refusal puts the label in front (field-labels.ts).
// Server and tests only: a page that built these would trip its content security policy (zod 4
// probes `new Function` when it builds an object schema).
import { z } from 'zod'
import { typed } from './input-words'
import { INGREDIENT_KEY } from './step-text'
import { SEGMENT_KINDS, type LiveField, type ScriptPiece } from './show-segments'

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
