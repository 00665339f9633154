// schema.org recipeInstructions → Hobline steps. schema.org allows Text, a list of Text, HowToStep,
// HowToSection (a named group of steps; its name becomes the step group) and, inside a step,
// HowToDirection and HowToTip. HowToDirection carries performTime, prepTime and totalTime
// (ISO 8601), which become the step's duration; HowToStep itself has no times, but one that
// carries them anyway is read too. ListItem and ItemList wrappers are unwrapped.
// Hobline's own step fields travel in "hobline:"-prefixed properties (see schemaorg-export.ts).
// A HowToStep's `name` becomes the step's short name unless it only repeats the text (step-name.ts).
// A step from elsewhere whose text opens with "While …", "Meanwhile", "In the meantime" or "At the
// same time" starts together with the step before it (step-links.ts); a Hobline export says its
// links itself, so there the text is not read for them.
// A step with no time in its markup gets its time, wait (handsOn) and station read from its text
// (step-time-read.ts), each listed in readFromText until a person confirms or changes it; what a
// Hobline export states (hobline:handsOn, hobline:station, hobline:readFromText) is taken as stated.
import type { RecipeImportProblem, RecipeStepDraft, StepLinkDraft, StepReadField } from '../types/recipe'
import { isCautionId, suggestStepCautions } from './cautions'
import { parseIsoDuration } from './duration'
import { MAX_DEPTH, MAX_LIST_READ, MAX_RECIPE_ITEMS, cleanSchemaText, hasSchemaType, isJsonObject, schemaText, type JsonObject } from './schemaorg-read'
import { readsAsAlongside, startTogetherLink } from './step-links'
import { importedStepName } from './step-name'
import { readStepTime } from './step-time-read'

/** Hobline's JSON-LD vocabulary for what schema.org has no property for. */
export const HOBLINE_LD_PREFIX = 'hobline'
export const HOBLINE_LD_NAMESPACE = 'https://hobline.invalid/ns#'

/** A Hobline extension property of a node, by compact ("hobline:x") or full IRI. */
export function hoblineProperty(node: JsonObject, name: string): unknown {
  return node[`${HOBLINE_LD_PREFIX}:${name}`] ?? node[`${HOBLINE_LD_NAMESPACE}${name}`]
}

interface StepContext {
  steps: RecipeStepDraft[]
  problems: RecipeImportProblem[]
  tips: string[]
  /** Set once the steps reach MAX_RECIPE_ITEMS: the rest is not read. */
  full?: boolean
}

const asList = (v: unknown): unknown[] => (v === undefined || v === null ? [] : Array.isArray(v) ? v : [v])
const unwrap = (v: unknown): unknown => (isJsonObject(v) && hasSchemaType(v, 'ListItem') && v.item !== undefined ? v.item : v)

/** Seconds of a HowToDirection (or a step that carries times): totalTime, else performTime + prepTime. */
function timeOf(node: JsonObject, field: string, problems: RecipeImportProblem[]): number | null {
  const read = (key: string) => {
    const v = node[key]
    if (v === undefined || v === null || v === '') return null
    try {
      return parseIsoDuration(String(v))
    } catch (e) {
      problems.push({ field: `${field}.${key}`, reason: (e as Error).message })
      return null
    }
  }
  const total = read('totalTime')
  const perform = read('performTime')
  const prep = read('prepTime')
  if (total !== null) return total
  return perform === null && prep === null ? null : (perform ?? 0) + (prep ?? 0)
}

const isStepLink = (l: unknown): l is StepLinkDraft => isJsonObject(l) && Number.isInteger(l.step) && (l.step as number) > 0
  && (l.kind === 'start-start' || l.kind === 'finish-together') && Number.isInteger(l.lag) && (l.lag as number) >= 0

type StepExtensions = Partial<RecipeStepDraft> & { durationMaxOverride?: number | null }

function extensions(node: JsonObject, field: string, problems: RecipeImportProblem[], text: string): StepExtensions {
  const out: StepExtensions = {}
  const bad = (name: string, want: string) => problems.push({ field: `${field}.${HOBLINE_LD_PREFIX}:${name}`, reason: `should be ${want}; ignored` })
  const script = hoblineProperty(node, 'script')
  if (script !== undefined) {
    if (Array.isArray(script) && script.every((l) => typeof l === 'string')) out.script = script as string[]
    else bad('script', 'a list of lines')
  }
  const handsOn = hoblineProperty(node, 'handsOn')
  if (handsOn !== undefined) {
    if (typeof handsOn === 'boolean') out.handsOn = handsOn
    else bad('handsOn', 'true or false')
  }
  const station = hoblineProperty(node, 'station')
  if (station !== undefined) {
    if (station === null || station === 'burner' || station === 'oven' || station === 'counter') out.station = station
    else bad('station', '"burner", "oven", "counter" or null')
  }
  const after = hoblineProperty(node, 'after')
  if (after !== undefined) {
    if (Array.isArray(after) && after.every((n) => Number.isInteger(n) && n > 0)) out.after = after as number[]
    else bad('after', 'a list of earlier step positions')
  }
  const links = hoblineProperty(node, 'links')
  if (links !== undefined) {
    if (Array.isArray(links) && links.every(isStepLink)) out.links = links.map(({ step, kind, lag }) => ({ step, kind, lag }))
    else bad('links', 'a list of links to earlier steps ({ step, kind: "start-start" or "finish-together", lag })')
  }
  for (const name of ['cameraShot', 'cameraNote'] as const) {
    const v = hoblineProperty(node, name)
    if (v === undefined) continue
    if (v === null || typeof v === 'string') out[name] = v
    else bad(name, 'text')
  }
  const cautions = hoblineProperty(node, 'cautions')
  if (cautions === undefined) out.cautions = [...new Set(suggestStepCautions(text).map((c) => c.id))]
  else if (Array.isArray(cautions) && cautions.every(isCautionId)) out.cautions = cautions
  else bad('cautions', 'a list of caution ids')
  const read = hoblineProperty(node, 'readFromText')
  if (read !== undefined) {
    if (Array.isArray(read) && read.every((f) => f === 'duration' || f === 'handsOn' || f === 'station')) out.readFromText = [...new Set(read as StepReadField[])]
    else bad('readFromText', 'a list of "duration", "handsOn", "station"')
  }
  const max = hoblineProperty(node, 'durationMax')
  if (max !== undefined) {
    try {
      out.durationMaxOverride = parseIsoDuration(String(max))
    } catch (e) {
      problems.push({ field: `${field}.${HOBLINE_LD_PREFIX}:durationMax`, reason: (e as Error).message })
    }
  }
  return out
}

function addStep(ctx: StepContext, node: JsonObject | null, text: string, group: string | null, field: string, seconds: number | null): void {
  const ext = node ? extensions(node, field, ctx.problems, text) : { cautions: [...new Set(suggestStepCautions(text).map((c) => c.id))] }
  const { durationMaxOverride, ...fields } = ext as typeof ext & { durationMaxOverride?: number | null }
  const position = ctx.steps.length + 1
  // Only for steps from elsewhere: a Hobline export names what each step waits for.
  const fromElsewhere = !node || hoblineProperty(node, 'after') === undefined
  const alongside = fromElsewhere && position > 1 && !fields.links && readsAsAlongside(text)
  ctx.steps.push({
    position, name: node ? importedStepName(schemaText(node.name), text) : null, text, script: [], handsOn: true,
    durationMin: seconds, durationMax: durationMaxOverride ?? seconds,
    station: null, after: [], cameraShot: null, cameraNote: null, cautions: [], group, readFromText: [],
    ...fromText(text, seconds, fields), ...fields,
    ...(alongside ? { links: [startTogetherLink(position - 1)] } : {}),
  })
}

/** The longest step duration a recipe keeps (recipe-schemas.ts: at most a week). */
const MAX_STEP_SECONDS = 7 * 24 * 3600

/** What the step text says of the fields its markup leaves out: time, wait and station, each marked as read. */
function fromText(text: string, seconds: number | null, stated: StepExtensions): Partial<RecipeStepDraft> {
  if (stated.readFromText) return {}
  const r = readStepTime(text)
  const out: Partial<RecipeStepDraft> = {}
  const read: StepReadField[] = []
  // a time the recipe schema would refuse (over a week) is left for a person to give
  if (seconds === null && r.durationMin !== null && r.durationMax! <= MAX_STEP_SECONDS) {
    out.durationMin = r.durationMin
    out.durationMax = r.durationMax
    read.push('duration')
  }
  if (stated.handsOn === undefined && r.handsOn === false && (seconds !== null || r.durationMin !== null)) {
    out.handsOn = false
    read.push('handsOn')
  }
  if (stated.station === undefined && r.station !== null) {
    out.station = r.station
    read.push('station')
  }
  out.readFromText = read
  return out
}

function stepFromNode(node: JsonObject, group: string | null, field: string, ctx: StepContext): void {
  const parts = asList(node.itemListElement).slice(0, MAX_LIST_READ).map(unwrap)
  const directions = parts.filter((p): p is JsonObject => hasSchemaType(p, 'HowToDirection'))
  for (const tip of parts.filter((p) => hasSchemaType(p, 'HowToTip'))) {
    const t = schemaText((tip as JsonObject).text)
    if (t && ctx.tips.length < MAX_LIST_READ) ctx.tips.push(t)
  }
  const text = schemaText(node.text) ?? (directions.map((d) => schemaText(d.text)).filter(Boolean).join(' ') || schemaText(node.name))
  if (!text) return void ctx.problems.push({ field, reason: 'the step has no text; skipped' })
  const times = [node, ...directions].map((n, i) => timeOf(n, i ? `${field}.itemListElement[${i - 1}]` : field, ctx.problems)).filter((t): t is number => t !== null)
  addStep(ctx, node, text, group, field, times.length ? times.reduce((a, b) => a + b, 0) : null)
}

function walk(v: unknown, group: string | null, field: string, ctx: StepContext, depth = 0): void {
  if (ctx.full) return
  if (ctx.steps.length >= MAX_RECIPE_ITEMS) {
    ctx.full = true
    return void ctx.problems.push({ field, reason: `Hobline keeps at most ${MAX_RECIPE_ITEMS} steps; this and the instructions after it were not read` })
  }
  if (depth > MAX_DEPTH) return void ctx.problems.push({ field, reason: `nested more than ${MAX_DEPTH} levels deep; skipped` })
  v = unwrap(v)
  if (typeof v === 'string') {
    // "Step 2." and "3)" numbering is dropped; the pattern is anchored, so it reads each line once.
    const lines = cleanSchemaText(v, true).split('\n').map((l) => l.replace(/^(?:step\s*)?\d+\s*[.):]\s+/i, '').trim()).filter(Boolean)
    lines.slice(0, MAX_RECIPE_ITEMS - ctx.steps.length).forEach((line) => addStep(ctx, null, line, group, field, null))
    return
  }
  if (Array.isArray(v)) return v.forEach((x, i) => walk(x, group, `${field}[${i}]`, ctx, depth + 1))
  if (!isJsonObject(v)) return void ctx.problems.push({ field, reason: 'not text or a HowToStep; skipped' })
  if (hasSchemaType(v, 'HowToSection')) {
    const name = schemaText(v.name)
    return walk(v.itemListElement ?? [], name ?? group, `${field}.itemListElement`, ctx, depth + 1)
  }
  if (hasSchemaType(v, 'HowToTip')) {
    const t = schemaText(v.text)
    if (t && ctx.tips.length < MAX_LIST_READ) ctx.tips.push(t)
    return
  }
  if (hasSchemaType(v, 'ItemList')) return walk(v.itemListElement ?? [], group, `${field}.itemListElement`, ctx, depth + 1)
  if (hasSchemaType(v, 'HowToStep') || hasSchemaType(v, 'HowToDirection') || typeof v.text === 'string') return stepFromNode(v, group, field, ctx)
  ctx.problems.push({ field, reason: `a ${String(v['@type'] ?? 'node without @type')} is not a step; skipped` })
}

/** Steps from a recipe's recipeInstructions, with problems listed and tips returned for the notes. */
export function readSchemaOrgInstructions(value: unknown): { steps: RecipeStepDraft[]; problems: RecipeImportProblem[]; tips: string[] } {
  const ctx: StepContext = { steps: [], problems: [], tips: [] }
  if (value === undefined || value === null) ctx.problems.push({ field: 'recipeInstructions', reason: 'missing; the recipe has no steps yet' })
  else walk(value, null, 'recipeInstructions', ctx)
  return ctx
}
