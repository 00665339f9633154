// Request bodies for recipes and prices. The server validates with these; the editor can check the
// same rules before saving. Field names follow shared/types/recipe.ts. Messages are instructions
// without the field's name: the refusal puts the form's label in front (shared/utils/field-labels.ts),
// as in "Package size: write a number above 0, such as 500.".
import { z } from 'zod'
import { ALLERGEN_STATES, EU_ALLERGENS, US_ALLERGENS } from './allergens'
import { CAUTION_IDS } from './cautions'
import { INGREDIENT_KEY } from './step-text'
import { STEP_NAME_MAX } from './step-name'
import { isTimeZone } from './time-zone'
import { UNIT_IDS, type UnitId } from './units'
import { typed } from './input-words'
import { showSegmentsSchema } from './show-segment-schemas'

const text = (max: number) => z.string({ error: typed('write it as text.') }).trim().max(max, `write at most ${max} characters.`)
const optionalText = (max: number) => text(max).nullable().optional().transform((v) => (v ? v : null))
const amount = z.number({ error: 'write a number, such as 2 or 0.5, or leave it empty.' })
  .min(0, 'write 0 or more.').max(1e6, 'write at most 1000000.').nullable()
const SECONDS = 'write a whole number of seconds, such as 900 for 15 minutes, or leave it empty.'
const seconds = z.number({ error: SECONDS }).int(SECONDS).min(0, SECONDS).max(7 * 24 * 3600, 'write at most a week (604800 seconds).').nullable()
const unitId = z.enum(UNIT_IDS as [UnitId, ...UnitId[]], { error: `choose one of: ${UNIT_IDS.join(', ')}.` })
const yesNo = z.boolean({ error: typed('choose yes or no (true or false).') })
const ID = 'write the number Hobline gave it, a whole number such as 12.'
const id = z.number({ error: typed(ID) }).int(ID).positive(ID)
const PRICE = 'write the price in whole pence or cents, such as 249 for 2.49.'
const CURRENCY = 'write a three-letter code such as GBP, EUR or USD.'
const DATE = 'write a date such as 2026-03-14.'
const version = (what: string) => {
  const words = `send the version number the ${what} had when you opened it; reload the page if unsure.`
  return z.number({ error: typed(words) }).int(words).positive(words)
}


export const recipeIngredientSchema = z.object({
  id: id.optional(),
  key: z.string({ error: typed('write it as text.') }).regex(INGREDIENT_KEY, 'use letters, digits, "-" and "_" only, at most 40.'),
  min: amount,
  max: amount,
  unit: unitId.nullable(),
  item: text(200).min(1, 'name the ingredient, such as "plain flour".'),
  prep: optionalText(200),
  optional: yesNo.default(false),
  toTaste: yesNo.default(false),
  group: optionalText(120),
  allergens: z.object({
    eu: z.array(z.enum(EU_ALLERGENS.map((a) => a.id) as [string, ...string[]], { error: `choose from the 14 EU groups: ${EU_ALLERGENS.map((a) => a.id).join(', ')}.` })).max(14),
    us: z.array(z.enum(US_ALLERGENS.map((a) => a.id) as [string, ...string[]], { error: `choose from the 9 US allergens: ${US_ALLERGENS.map((a) => a.id).join(', ')}.` })).max(9),
  }).default({ eu: [], us: [] }),
  allergenState: z.enum(ALLERGEN_STATES, { error: 'choose suggested, checked or none-declared.' }).optional(),
  priceId: id.nullable().optional(),
  /** The equivalent stated beside the unit ("½ cup (100 g)"), the author's own measure of the same amount. */
  stated: z.object({
    min: z.number({ error: 'write a number above 0.' }).positive('write a number above 0.').max(1e6, 'write at most 1000000.'),
    max: z.number({ error: 'write a number above 0.' }).positive('write a number above 0.').max(1e6, 'write at most 1000000.'),
    unit: unitId,
  }).refine((m) => m.min <= m.max, { message: 'make the lower amount no more than the upper one.', path: ['min'] }).nullable().default(null),
}).refine((i) => i.min === null || i.max === null || i.min <= i.max, { message: 'make the amount no more than the amount it goes up to.', path: ['min'] })

/** A step's short name, for its timer and cues: trimmed, at most STEP_NAME_MAX characters, empty is none. */
const stepName = z.string({ error: 'write it as text, or leave it empty.' }).trim()
  .max(STEP_NAME_MAX, `keep it to ${STEP_NAME_MAX} characters, such as "Pasta water".`)
  .nullable().optional().transform((v) => (v ? v : null))

export const recipeStepSchema = z.object({
  id: id.optional(),
  name: stepName,
  text: text(4000).min(1, 'say what to do in this step.'),
  script: z.array(text(1000)).max(50, 'keep it to at most 50 lines.').default([]),
  handsOn: yesNo.default(true),
  durationMin: seconds.default(null),
  durationMax: seconds.default(null),
  station: z.enum(['burner', 'oven', 'counter'], { error: 'choose burner, oven or counter, or leave it empty.' }).nullable().default(null),
  after: z.array(z.number({ error: 'write the number of an earlier step, such as 1.' }).int().positive()).max(50, 'wait for at most 50 steps.').default([]),
  /** Links to an earlier step beyond "after": start with it (after a lag), or finish together with it (going in a lead before it ends). */
  links: z.array(z.object({
    step: z.number({ error: 'write the number of an earlier step, such as 1.' }).int('write the number of an earlier step, such as 1.').positive('write the number of an earlier step, such as 1.'),
    kind: z.enum(['start-start', 'finish-together'], { error: 'choose start-start or finish-together.' }),
    lag: z.number({ error: 'write a whole number of seconds, such as 60.' }).int('write a whole number of seconds, such as 60.')
      .min(0, 'write 0 or more seconds.').max(24 * 3600, 'write at most a day (86400 seconds).'),
  })).max(10, 'keep it to at most 10 links.').default([]),
  cameraShot: optionalText(200),
  cameraNote: optionalText(500),
  cautions: z.array(z.enum(CAUTION_IDS, { error: `choose from: ${CAUTION_IDS.join(', ')}.` })).max(CAUTION_IDS.length).default([]),
  group: optionalText(120),
  /** Fields an import read from the step's text and no person has confirmed yet. */
  readFromText: z.array(z.enum(['duration', 'handsOn', 'station'], { error: 'list only the time, the kind and the station.' })).max(3).default([]),
}).refine((s) => s.durationMin === null || s.durationMax === null || s.durationMin <= s.durationMax, { message: 'make it no longer than the longest time.', path: ['durationMin'] })

const recipeFields = {
  title: text(160).min(1, 'give the recipe a title.'),
  summary: optionalText(2000),
  servings: z.number({ error: typed('write the number of servings, such as 4.') }).positive('write a number above 0, such as 4.').max(1000, 'write at most 1000.'),
  yieldText: optionalText(120),
  tags: z.array(text(40).min(1, 'write the tag, or remove it.')).max(30, 'keep it to at most 30 tags.').default([]),
  notes: optionalText(8000),
  times: z.object({ prep: seconds, cook: seconds, total: seconds }).default({ prep: null, cook: null, total: null }),
  ingredients: z.array(recipeIngredientSchema).max(200, 'keep it to at most 200 ingredients.').default([]),
  steps: z.array(recipeStepSchema).max(200, 'keep it to at most 200 steps.').default([]),
}

export const recipeCreateSchema = z.object(recipeFields).superRefine(checkReferences)

/** A save names the version it started from, so a newer save by someone else is never overwritten. */
export const recipeUpdateSchema = z.object({ version: version('recipe'), ...recipeFields }).superRefine(checkReferences)

function checkReferences(r: { ingredients: { key: string }[]; steps: { after: number[]; links: { step: number }[] }[] }, ctx: z.RefinementCtx) {
  const seen = new Set<string>()
  r.ingredients.forEach((ing, i) => {
    if (seen.has(ing.key)) ctx.addIssue({ code: 'custom', path: ['ingredients', i, 'key'], message: `another ingredient is also called "${ing.key}" in the steps; give each its own name.` })
    seen.add(ing.key)
  })
  r.steps.forEach((step, i) => {
    for (const p of step.after) {
      if (p >= i + 1) ctx.addIssue({ code: 'custom', path: ['steps', i, 'after'], message: `choose only steps before step ${i + 1}, not step ${p}.` })
    }
    for (const link of step.links) {
      if (link.step >= i + 1) ctx.addIssue({ code: 'custom', path: ['steps', i, 'links'], message: `link it only to a step before step ${i + 1}, not step ${link.step}.` })
    }
  })
}

export const priceBodySchema = z.object({
  item: text(120).min(1, 'name the item, such as "Plain flour".'),
  packageSize: z.number({ error: typed('write a number, such as 500.') }).positive('write a number above 0, such as 500.').max(1e6, 'write at most 1000000.'),
  packageUnit: z.union([unitId, z.literal('each')], { error: typed(`choose "each" or one of: ${UNIT_IDS.join(', ')}.`) }),
  priceMinor: z.number({ error: typed(PRICE) }).int(PRICE).min(0, PRICE).max(1e9, 'write at most 1000000000 pence or cents.'),
  currency: z.string({ error: typed(CURRENCY) }).regex(/^[A-Z]{3}$/, CURRENCY),
  shop: optionalText(120),
  boughtOn: z.string({ error: DATE }).regex(/^\d{4}-\d{2}-\d{2}$/, DATE).nullable().optional().transform((v) => v ?? null),
})

const LOCALE = 'choose the language and country from the list (written like en-GB or de-DE).'
const TIME_ZONE = 'choose the studio\'s time zone from the list, such as Europe/London.'
const BUDGET = 'write it in whole pence or cents, such as 350 for 3.50, or leave it empty.'
const kitchenCount = (min: number, max: number) => {
  const words = `write a whole number from ${min} to ${max}.`
  return z.number({ error: typed(words) }).int(words).min(min, words).max(max, words)
}

/** The studio settings form words 'name' as "Studio name". */
export const STUDIO_SETTINGS_LABELS = { name: 'Studio name', locale: 'Language and country' }

export const studioSettingsSchema = z.object({
  name: text(120).min(1, 'give the studio a name.').optional(),
  locale: z.string({ error: LOCALE }).regex(/^[a-z]{2,3}(-[A-Z][a-z]{3})?(-[A-Z]{2}|-\d{3})?$/, LOCALE).optional(),
  currency: z.string({ error: CURRENCY }).regex(/^[A-Z]{3}$/, CURRENCY).optional(),
  timeZone: z.string({ error: TIME_ZONE }).refine(isTimeZone, TIME_ZONE).optional(),
  budgetPerServingMinor: z.number({ error: BUDGET }).int(BUDGET).min(0, BUDGET).max(1e8, 'write at most 100000000 pence or cents.').nullable().optional(),
  cupUnit: z.enum(['cup', 'metric-cup'], { error: 'choose cup (US, 236.6 mL) or metric-cup (250 mL).' }).optional(),
  unitSystem: z.enum(['metric', 'us'], { error: 'choose metric or us.' }).optional(),
  fluidMeasure: z.enum(['us', 'imperial'], { error: 'choose us (1 pint = 473 mL) or imperial (568 mL), or leave it empty to follow the locale.' }).nullable().optional(),
  kitchen: z.object({
    hands: kitchenCount(1, 12),
    burners: kitchenCount(0, 16),
    ovens: kitchenCount(0, 6),
    racksPerOven: kitchenCount(1, 6),
    parallelRecipes: yesNo,
  }).optional(),
})

/** The episode forms' words for their fields. */
export const EPISODE_LABELS = {
  title: 'Episode title', shootDate: 'Shoot date', servings: 'Servings on set', unitSystem: 'Units on set',
  budgetPerServingMinor: 'Budget per serving', targetSeconds: 'Target length', hostId: 'Presenter',
}
const SHOOT_DATE = 'choose a day from the calendar (written like 2026-12-09), or leave it empty.'
const EPISODE_SERVINGS = 'write a whole number of servings from 1 to 200, or leave it empty to cook each recipe as written.'
const TARGET = 'write the target length in whole seconds from 30 to 14400 (4 hours), or leave it empty.'
const HOST = 'choose the presenter from the crew list, or leave it empty.'

const RECIPE_ID = 'choose a recipe from the list (a whole number such as 12).'
const recipeIds = z.array(z.number({ error: RECIPE_ID }).int(RECIPE_ID).positive(RECIPE_ID), { error: 'send a list of recipes, such as [12, 15].' })
  .max(30, 'keep it to at most 30 recipes in an episode.')

export const episodeCreateSchema = z.object({
  title: text(160).min(1, 'give the episode a title.'),
  recipeIds: recipeIds.default([]),
})

export const episodeUpdateSchema = z.object({
  version: version('episode'),
  title: text(160).min(1, 'give the episode a title.').optional(),
  recipeIds: recipeIds.optional(),
  segments: showSegmentsSchema.optional(),
  shootDate: z.string({ error: typed(SHOOT_DATE) }).regex(/^\d{4}-\d{2}-\d{2}$/, SHOOT_DATE)
    .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), SHOOT_DATE).nullable().optional(),
  servings: z.number({ error: typed(EPISODE_SERVINGS) }).int(EPISODE_SERVINGS).min(1, EPISODE_SERVINGS).max(200, EPISODE_SERVINGS).nullable().optional(),
  unitSystem: z.enum(['metric', 'us'], { error: 'choose metric or us, or leave it empty to use the studio\'s units.' }).nullable().optional(),
  budgetPerServingMinor: z.number({ error: typed(BUDGET) }).int(BUDGET).min(0, BUDGET).max(1e8, 'write at most 100000000 pence or cents.').nullable().optional(),
  targetSeconds: z.number({ error: typed(TARGET) }).int(TARGET).min(30, TARGET).max(14_400, TARGET).nullable().optional(),
  hostId: z.number({ error: typed(HOST) }).int(HOST).positive(HOST).nullable().optional(),
}).refine((b) => !(b.recipeIds && b.segments), { message: 'send the run order once: segments, or recipeIds for recipes only, not both.', path: ['segments'] })

export type RecipeCreateBody = z.output<typeof recipeCreateSchema>
export type RecipeUpdateBody = z.output<typeof recipeUpdateSchema>
