// Request bodies for recipes and prices. The server validates with these; the editor can check the
// same rules before saving. Field names follow shared/types/recipe.ts.
import { z } from 'zod'
import { ALLERGEN_STATES, EU_ALLERGENS, US_ALLERGENS } from './allergens'
import { CAUTION_IDS } from './cautions'
import { INGREDIENT_KEY } from './step-text'
import { STEP_NAME_MAX } from './step-name'
import { isTimeZone } from './time-zone'
import { UNIT_IDS, type UnitId } from './units'

const text = (field: string, max: number) => z.string({ error: `${field} must be text.` }).trim().max(max, `Use at most ${max} characters for ${field}.`)
const optionalText = (field: string, max: number) => text(field, max).nullable().optional().transform((v) => (v ? v : null))
const amount = (field: string) => z.number({ error: `${field} must be a number or null.` }).min(0, `${field} cannot be negative.`).max(1e6, `${field} is too large.`).nullable()
const seconds = (field: string) => z.number({ error: `${field} must be a number of seconds or null.` }).int(`${field} must be whole seconds.`).min(0).max(7 * 24 * 3600, `${field} is longer than a week.`).nullable()
const unitId = z.enum(UNIT_IDS as [UnitId, ...UnitId[]], { error: `unit must be one of: ${UNIT_IDS.join(', ')}.` })

export const recipeIngredientSchema = z.object({
  id: z.number().int().positive().optional(),
  key: z.string({ error: 'key must be text.' }).regex(INGREDIENT_KEY, 'key uses letters, digits, "-" and "_" (at most 40).'),
  min: amount('min'),
  max: amount('max'),
  unit: unitId.nullable(),
  item: text('item', 200).min(1, 'Name the ingredient (item).'),
  prep: optionalText('prep', 200),
  optional: z.boolean({ error: 'optional must be true or false.' }).default(false),
  toTaste: z.boolean({ error: 'toTaste must be true or false.' }).default(false),
  group: optionalText('group', 120),
  allergens: z.object({
    eu: z.array(z.enum(EU_ALLERGENS.map((a) => a.id) as [string, ...string[]], { error: 'Unknown EU allergen group.' })).max(14),
    us: z.array(z.enum(US_ALLERGENS.map((a) => a.id) as [string, ...string[]], { error: 'Unknown US allergen.' })).max(9),
  }).default({ eu: [], us: [] }),
  allergenState: z.enum(ALLERGEN_STATES, { error: 'allergenState must be suggested, checked or none-declared.' }).optional(),
  priceId: z.number().int().positive().nullable().optional(),
  /** The equivalent stated beside the unit ("½ cup (100 g)"), the author's own measure of the same amount. */
  stated: z.object({
    min: z.number({ error: 'stated.min must be a number.' }).positive('stated.min must be above zero.').max(1e6),
    max: z.number({ error: 'stated.max must be a number.' }).positive('stated.max must be above zero.').max(1e6),
    unit: unitId,
  }).refine((m) => m.min <= m.max, { message: 'The stated lower amount must not be above the upper one.', path: ['min'] }).nullable().default(null),
}).refine((i) => i.min === null || i.max === null || i.min <= i.max, { message: 'The lower amount (min) must not be above the upper one (max).', path: ['min'] })

/** A step's short name, for its timer and cues: trimmed, at most STEP_NAME_MAX characters, empty is none. */
const stepName = z.string({ error: 'The short name must be text (or null for none).' }).trim()
  .max(STEP_NAME_MAX, `Keep the short name to ${STEP_NAME_MAX} characters, such as "Pasta water".`)
  .nullable().optional().transform((v) => (v ? v : null))

export const recipeStepSchema = z.object({
  id: z.number().int().positive().optional(),
  name: stepName,
  text: text('text', 4000).min(1, 'Say what to do in this step (text).'),
  script: z.array(text('script line', 1000)).max(50, 'At most 50 script lines per step.').default([]),
  handsOn: z.boolean({ error: 'handsOn must be true or false.' }).default(true),
  durationMin: seconds('durationMin').default(null),
  durationMax: seconds('durationMax').default(null),
  station: z.enum(['burner', 'oven', 'counter'], { error: 'station must be burner, oven, counter or null.' }).nullable().default(null),
  after: z.array(z.number().int().positive()).max(50).default([]),
  /** Links to an earlier step beyond "after": start with it (after a lag), or finish together with it (going in a lead before it ends). */
  links: z.array(z.object({
    step: z.number({ error: 'links.step must be the position of an earlier step.' }).int().positive(),
    kind: z.enum(['start-start', 'finish-together'], { error: 'links.kind must be start-start or finish-together.' }),
    lag: z.number({ error: 'links.lag must be seconds.' }).int().min(0).max(24 * 3600),
  })).max(10).default([]),
  cameraShot: optionalText('cameraShot', 200),
  cameraNote: optionalText('cameraNote', 500),
  cautions: z.array(z.enum(CAUTION_IDS, { error: `caution must be one of: ${CAUTION_IDS.join(', ')}.` })).max(CAUTION_IDS.length).default([]),
  group: optionalText('group', 120),
  /** Fields an import read from the step's text and no person has confirmed yet. */
  readFromText: z.array(z.enum(['duration', 'handsOn', 'station'], { error: 'readFromText lists duration, handsOn or station.' })).max(3).default([]),
}).refine((s) => s.durationMin === null || s.durationMax === null || s.durationMin <= s.durationMax, { message: 'The shorter duration (durationMin) must not be above the longer one (durationMax).', path: ['durationMin'] })

const recipeFields = {
  title: text('title', 160).min(1, 'Give the recipe a title.'),
  summary: optionalText('summary', 2000),
  servings: z.number({ error: 'servings must be a number.' }).positive('servings must be above zero.').max(1000, 'servings is at most 1000.'),
  yieldText: optionalText('yieldText', 120),
  tags: z.array(text('tag', 40).min(1)).max(30, 'At most 30 tags.').default([]),
  notes: optionalText('notes', 8000),
  times: z.object({ prep: seconds('times.prep'), cook: seconds('times.cook'), total: seconds('times.total') }).default({ prep: null, cook: null, total: null }),
  ingredients: z.array(recipeIngredientSchema).max(200, 'At most 200 ingredients.').default([]),
  steps: z.array(recipeStepSchema).max(200, 'At most 200 steps.').default([]),
}

export const recipeCreateSchema = z.object(recipeFields).superRefine(checkReferences)

/** A save names the version it started from, so a newer save by someone else is never overwritten. */
export const recipeUpdateSchema = z.object({ version: z.number({ error: 'version must be the number the recipe had when you opened it.' }).int().positive(), ...recipeFields }).superRefine(checkReferences)

function checkReferences(r: { ingredients: { key: string }[]; steps: { after: number[]; links: { step: number }[] }[] }, ctx: z.RefinementCtx) {
  const seen = new Set<string>()
  r.ingredients.forEach((ing, i) => {
    if (seen.has(ing.key)) ctx.addIssue({ code: 'custom', path: ['ingredients', i, 'key'], message: `Two ingredients use the key "${ing.key}"; each needs its own.` })
    seen.add(ing.key)
  })
  r.steps.forEach((step, i) => {
    for (const p of step.after) {
      if (p >= i + 1) ctx.addIssue({ code: 'custom', path: ['steps', i, 'after'], message: `Step ${i + 1} can only wait for earlier steps, not step ${p}.` })
    }
    for (const link of step.links) {
      if (link.step >= i + 1) ctx.addIssue({ code: 'custom', path: ['steps', i, 'links'], message: `Step ${i + 1} can only be linked to an earlier step, not step ${link.step}.` })
    }
  })
}

export const priceBodySchema = z.object({
  item: text('item', 120).min(1, 'Name the item.'),
  packageSize: z.number({ error: 'packageSize must be a number.' }).positive('packageSize must be above zero.').max(1e6),
  packageUnit: z.union([unitId, z.literal('each')], { error: `packageUnit must be "each" or one of: ${UNIT_IDS.join(', ')}.` }),
  priceMinor: z.number({ error: 'priceMinor must be a whole number of minor units (pence, cents).' }).int('priceMinor must be a whole number of minor units (pence, cents).').min(0).max(1e9),
  currency: z.string({ error: 'currency must be a three-letter code such as GBP.' }).regex(/^[A-Z]{3}$/, 'currency must be a three-letter code such as GBP.'),
  shop: optionalText('shop', 120),
  boughtOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'boughtOn must be a date as YYYY-MM-DD.').nullable().optional().transform((v) => v ?? null),
})

export const studioSettingsSchema = z.object({
  name: text('name', 120).min(1, 'Give the studio a name.').optional(),
  locale: z.string().regex(/^[a-z]{2,3}(-[A-Z][a-z]{3})?(-[A-Z]{2}|-\d{3})?$/, 'locale must be a language tag such as en-GB.').optional(),
  currency: z.string().regex(/^[A-Z]{3}$/, 'currency must be a three-letter code such as GBP.').optional(),
  timeZone: z.string().refine(isTimeZone, 'Time zone: choose the studio\'s time zone from the list, such as Europe/London.').optional(),
  budgetPerServingMinor: z.number().int('budgetPerServingMinor must be whole minor units.').min(0).max(1e8).nullable().optional(),
  cupUnit: z.enum(['cup', 'metric-cup'], { error: 'cupUnit must be cup (US, 236.6 mL) or metric-cup (250 mL).' }).optional(),
  unitSystem: z.enum(['metric', 'us'], { error: 'unitSystem must be metric or us.' }).optional(),
  fluidMeasure: z.enum(['us', 'imperial'], { error: 'fluidMeasure must be us (1 pint = 473 mL), imperial (568 mL) or null to follow the locale.' }).nullable().optional(),
  kitchen: z.object({
    hands: z.number({ error: 'kitchen.hands must be a number.' }).int().min(1, 'A kitchen needs at least one cook (kitchen.hands).').max(12),
    burners: z.number({ error: 'kitchen.burners must be a number.' }).int().min(0).max(16),
    ovens: z.number({ error: 'kitchen.ovens must be a number.' }).int().min(0).max(6),
    racksPerOven: z.number({ error: 'kitchen.racksPerOven must be a number.' }).int().min(1).max(6),
    parallelRecipes: z.boolean({ error: 'kitchen.parallelRecipes must be true or false.' }),
  }).optional(),
})

export const episodeCreateSchema = z.object({
  title: text('title', 160).min(1, 'Give the episode a title.'),
  recipeIds: z.array(z.number({ error: 'recipeIds must be recipe ids.' }).int().positive()).max(30, 'At most 30 recipes in an episode.').default([]),
})

export const episodeUpdateSchema = z.object({
  version: z.number({ error: 'version must be the number the episode had when you opened it.' }).int().positive(),
  title: text('title', 160).min(1, 'Give the episode a title.').optional(),
  recipeIds: z.array(z.number({ error: 'recipeIds must be recipe ids.' }).int().positive()).max(30, 'At most 30 recipes in an episode.').optional(),
})

export type RecipeCreateBody = z.output<typeof recipeCreateSchema>
export type RecipeUpdateBody = z.output<typeof recipeUpdateSchema>
