// The recipe editor's form: what the inputs hold (text, so nothing typed is lost or reformatted
// while editing), and the conversions between it, a loaded recipe and the request body.
import type { CautionId } from '~~/shared/utils/cautions'
import { allergenCertaintyText, allergenStateOf, type AllergenState, type EuAllergenId, type UsAllergenId } from '../shared/utils/allergens'
import { fieldLabel } from '../shared/utils/field-labels'
import type { RecipeStation, StatedMeasure, StepReadField } from '~~/shared/types/recipe'
import type { UnitId } from '~~/shared/utils/units'
import type { FluidMeasure } from '~~/shared/utils/fluid-measure'
import type { LoadedRecipe } from '~/types/api'

/** A link to an earlier step beyond "waits for" (start with it, or finish together), by position. */
export interface StepLink { step: number; kind: 'start-start' | 'finish-together'; lag: number }

export interface IngredientRow {
  uid: string
  id?: number
  key: string
  /** The key follows the item until the row is saved or a step names it. */
  keyAuto: boolean
  min: string
  max: string
  unit: UnitId | ''
  item: string
  prep: string
  optional: boolean
  toTaste: boolean
  group: string
  allergens: { eu: EuAllergenId[]; us: UsAllergenId[] }
  /** "suggested": filled from the item's name and not yet confirmed by the user. */
  /** Suggested from the name, checked by a person (stamped by the server on save), or none declared. */
  allergenState: AllergenState
  /** "checked by Ada Cook on 2 December 2026", as loaded; empty for a row not yet saved as checked. */
  allergenCheckedText: string
  priceId: number | null
  /**
   * The equivalent the recipe states beside the amount ("½ cup (100 g)"), and the amount it was
   * stated for (min|max|unit as typed): changing the amount drops it.
   */
  stated: StatedMeasure | null
  statedFor: string
}

export interface StepRow {
  uid: string
  id?: number
  /** Short name for timers and cues ("Pasta water"); empty for none. */
  name: string
  text: string
  /** One script line per line of text. */
  script: string
  handsOn: boolean
  /** Minutes, as typed. */
  durationMin: string
  durationMax: string
  station: RecipeStation | ''
  /** The steps this one waits for, by uid, so a reorder keeps the links. */
  after: string[]
  /** Other links to earlier steps, kept through edits and reorders (by uid). */
  links: Array<{ stepUid: string; kind: StepLink['kind']; lag: number }>
  cameraShot: string
  cameraNote: string
  cautions: CautionId[]
  group: string
  /** Fields an import read from the text and no one has confirmed; one that is changed here counts as confirmed. */
  readFromText: StepReadField[]
  /** Their values as read, to tell a change. */
  readValues: Pick<StepRow, 'durationMin' | 'durationMax' | 'handsOn' | 'station'>
}

export interface RecipeForm {
  title: string
  summary: string
  servings: string
  yieldText: string
  tags: string
  notes: string
  prepMinutes: string
  cookMinutes: string
  totalMinutes: string
  ingredients: IngredientRow[]
  steps: StepRow[]
}

let counter = 0
/** A row id for Vue's keys and for links between steps; never sent to the server. */
export const rowUid = (prefix: string) => `${prefix}-${Date.now().toString(36)}-${(counter++).toString(36)}`

const minutesText = (seconds: number | null) => (seconds === null ? '' : String(Number((seconds / 60).toFixed(2))))
const amountText = (v: number | null) => (v === null ? '' : formatAmountExact(v))

export function emptyRecipeForm(): RecipeForm {
  return { title: '', summary: '', servings: '4', yieldText: '', tags: '', notes: '', prepMinutes: '', cookMinutes: '', totalMinutes: '', ingredients: [], steps: [] }
}

export function formFromRecipe(r: LoadedRecipe): RecipeForm {
  // Loaded rows take their uid from their id, so the server's render and the browser's agree.
  const stepUids = r.steps.map((s) => `step-${s.id}`)
  return {
    title: r.title,
    summary: r.summary ?? '',
    servings: String(r.servings),
    yieldText: r.yieldText ?? '',
    tags: r.tags.join(', '),
    notes: r.notes ?? '',
    prepMinutes: minutesText(r.times.prep),
    cookMinutes: minutesText(r.times.cook),
    totalMinutes: minutesText(r.times.total),
    ingredients: r.ingredients.map((i) => ({
      uid: `ing-${i.id}`, id: i.id, key: i.key, keyAuto: false, min: amountText(i.min), max: i.max === i.min ? '' : amountText(i.max),
      unit: (i.unit ?? '') as UnitId | '', item: i.item, prep: i.prep ?? '', optional: i.optional, toTaste: i.toTaste, group: i.group ?? '',
      allergens: { eu: [...i.allergens.eu] as EuAllergenId[], us: [...i.allergens.us] as UsAllergenId[] }, allergenState: allergenStateOf(i as never),
      allergenCheckedText: allergenStateOf(i as never) === 'checked' ? allergenCertaintyText(i as never) : '', priceId: i.priceId,
      stated: (i.stated ?? null) as StatedMeasure | null, statedFor: '',
    })).map((row) => ({ ...row, statedFor: amountKey(row) })),
    steps: r.steps.map((s, index) => ({
      uid: stepUids[index]!, id: s.id, name: s.name ?? '', text: s.text, script: s.script.join('\n'), handsOn: s.handsOn,
      durationMin: minutesText(s.durationMin), durationMax: s.durationMax === s.durationMin ? '' : minutesText(s.durationMax),
      station: (s.station ?? '') as StepRow['station'], after: s.after.map((p) => stepUids[p - 1]).filter((u): u is string => !!u),
      links: (s.links ?? []).map((l) => ({ stepUid: stepUids[l.step - 1]!, kind: l.kind, lag: l.lag })).filter((l) => !!l.stepUid),
      cameraShot: s.cameraShot ?? '', cameraNote: s.cameraNote ?? '', cautions: [...s.cautions] as CautionId[], group: s.group ?? '',
      readFromText: [...(s.readFromText ?? [])] as StepReadField[], readValues: { durationMin: '', durationMax: '', handsOn: true, station: '' },
    })).map((row) => ({ ...row, readValues: { durationMin: row.durationMin, durationMax: row.durationMax, handsOn: row.handsOn, station: row.station } })),
  }
}

/** A new ingredient row, its allergens suggested from the item's name. */
export function ingredientRow(parts: Partial<Pick<IngredientRow, 'min' | 'max' | 'unit' | 'item' | 'prep' | 'optional' | 'toTaste'>>, takenKeys: string[]): IngredientRow {
  const item = parts.item ?? ''
  const s = suggestAllergens(item)
  return {
    uid: rowUid('ing'), key: item ? makeIngredientKey(item, takenKeys) : '', keyAuto: true, min: parts.min ?? '', max: parts.max ?? '', unit: parts.unit ?? '',
    item, prep: parts.prep ?? '', optional: parts.optional ?? false, toTaste: parts.toTaste ?? false, group: '',
    allergens: { eu: s.eu, us: s.us }, allergenState: s.eu.length || s.us.length ? 'suggested' : 'none-declared', allergenCheckedText: '', priceId: null, stated: null, statedFor: '',
  }
}

/** The amount of a row as typed, to tell whether a stated equivalent still belongs to it. */
const amountKey = (r: Pick<IngredientRow, 'min' | 'max' | 'unit'>) => `${r.min.trim()}|${r.max.trim()}|${r.unit}`

/** The stated equivalent of a row while its amount is still the one it was stated for, else null. */
export const statedStillHolds = (r: IngredientRow) => (r.stated && r.statedFor === amountKey(r) ? r.stated : null)

/** The fields of a step row still as an import read them (not confirmed, not changed). */
export function stepStillRead(s: StepRow): StepReadField[] {
  const v = s.readValues
  const same = {
    duration: s.durationMin === v.durationMin && s.durationMax === v.durationMax, handsOn: s.handsOn === v.handsOn, station: s.station === v.station,
  }
  return s.readFromText.filter((f) => same[f])
}

/** "2 1/2 cups plain flour, sifted" as a row, and what the reader was unsure of. */
export function ingredientFromLine(
  line: string, takenKeys: string[], cups: 'us' | 'metric' = 'us', fluid: FluidMeasure = 'us',
): { row: IngredientRow; warnings: string[] } {
  const q = parseQuantity(line, { cups, fluid })
  const row = ingredientRow({
    min: amountText(q.min), max: q.max === q.min ? '' : amountText(q.max), unit: q.unit ?? '', item: q.item, prep: q.prep ?? '', optional: q.optional, toTaste: q.toTaste,
  }, takenKeys)
  row.stated = q.stated
  row.statedFor = amountKey(row)
  return { row, warnings: q.warnings }
}

export function blankStep(): StepRow {
  return {
    uid: rowUid('step'), name: '', text: '', script: '', handsOn: true, durationMin: '', durationMax: '', station: '', after: [], links: [], cameraShot: '', cameraNote: '',
    cautions: [], group: '', readFromText: [], readValues: { durationMin: '', durationMax: '', handsOn: true, station: '' },
  }
}

/** An amount as typed ("2", "1.5", "1/2", "1 1/2", "1½"): the number, null for blank, NaN when unreadable. */
export function readAmountInput(text: string): number | null {
  const s = normaliseAmountText(text)
  if (!s) return null
  const r = readAmountAt(s, 0)
  return r && r.end === s.length ? r.value : Number.NaN
}

/** Minutes as typed, in whole seconds: null for blank, NaN when unreadable. */
export function readMinutesInput(text: string): number | null {
  const s = text.trim().replace(',', '.')
  if (!s) return null
  const n = Number(s)
  return Number.isFinite(n) && n >= 0 ? Math.round(n * 60) : Number.NaN
}

/** Move one entry of a list by `by` places; returns the new index, or null when it cannot move. */
export function moveInList<T>(list: T[], index: number, by: -1 | 1): number | null {
  const to = index + by
  if (to < 0 || to >= list.length) return null
  const [row] = list.splice(index, 1)
  list.splice(to, 0, row!)
  return to
}

/** After a reorder a step may only wait for steps above it: drop the others and say which. */
export function pruneStepLinks(steps: StepRow[]): string[] {
  const notes: string[] = []
  steps.forEach((step, i) => {
    const earlier = new Set(steps.slice(0, i).map((s) => s.uid))
    const dropped = [...new Set([...step.after, ...step.links.map((l) => l.stepUid)].filter((u) => !earlier.has(u)))]
    if (dropped.length) {
      step.after = step.after.filter((u) => earlier.has(u))
      step.links = step.links.filter((l) => earlier.has(l.stepUid))
      notes.push(`Step ${i + 1} no longer waits for ${dropped.map((u) => `step ${steps.findIndex((s) => s.uid === u) + 1}`).join(', ')}, which now comes after it.`)
    }
  })
  return notes
}

export interface FormProblem {
  /** The request path it concerns, as the server names fields: "ingredients.2.min". */
  field: string
  message: string
}

const isBlankIngredient = (r: IngredientRow) => !r.item.trim() && !r.min.trim() && !r.max.trim() && !r.prep.trim()
const isBlankStep = (s: StepRow) => !s.name.trim() && !s.text.trim() && !s.script.trim() && !s.cameraShot.trim() && !s.cameraNote.trim()

/** Rows with nothing typed in them are left out of a save (and then out of the form). */
export function dropBlankRows(form: RecipeForm): void {
  form.ingredients = form.ingredients.filter((r) => !isBlankIngredient(r))
  const kept = form.steps.filter((s) => !isBlankStep(s))
  const keptUids = new Set(kept.map((s) => s.uid))
  for (const s of kept) {
    s.after = s.after.filter((u) => keptUids.has(u))
    s.links = s.links.filter((l) => keptUids.has(l.stepUid))
  }
  form.steps = kept
}

/** The request body for POST or PATCH, or the first things to fix before sending it. */
export function bodyFromForm(form: RecipeForm): { body: Record<string, unknown>; problems: FormProblem[] } {
  const problems: FormProblem[] = []
  const num = (field: string, value: number | null, what: string) => {
    if (Number.isNaN(value)) problems.push({ field, message: `${fieldLabel(field)}: ${what}` })
    return Number.isNaN(value) ? null : value
  }
  const servings = Number(form.servings.trim().replace(',', '.'))
  if (!form.servings.trim() || !Number.isFinite(servings)) problems.push({ field: 'servings', message: 'Servings: write the number of servings, such as 4.' })
  const minutes = (field: string, text: string) => num(field, readMinutesInput(text), 'write minutes as a number, such as 15 or 2.5.')
  const ingredients = form.ingredients.map((r, i) => {
    const amountWhat = 'write the amount as 2, 1.5, 1/2 or 1½ (or leave it empty).'
    const min = num(`ingredients.${i}.min`, readAmountInput(r.min), amountWhat)
    const max = num(`ingredients.${i}.max`, readAmountInput(r.max), amountWhat)
    return {
      ...(r.id ? { id: r.id } : {}), key: r.key || makeIngredientKey(r.item || 'ingredient', form.ingredients.map((x) => x.key)),
      min: min ?? max, max: max ?? min, unit: r.unit || null, item: r.item.trim(), prep: r.prep.trim() || null, optional: r.optional, toTaste: r.toTaste,
      group: r.group.trim() || null, allergens: { eu: r.allergens.eu, us: r.allergens.us }, allergenState: r.allergenState, priceId: r.priceId,
      stated: statedStillHolds(r),
    }
  })
  const steps = form.steps.map((s, i) => {
    const dMin = minutes(`steps.${i}.durationMin`, s.durationMin)
    const dMax = minutes(`steps.${i}.durationMax`, s.durationMax)
    const nameProblem = stepNameProblem(s.name, i + 1)
    if (nameProblem) problems.push({ field: `steps.${i}.name`, message: nameProblem })
    return {
      ...(s.id ? { id: s.id } : {}), name: cleanStepName(s.name), text: s.text.trim(), script: s.script.split('\n').map((l) => l.trim()).filter(Boolean), handsOn: s.handsOn,
      durationMin: dMin ?? dMax, durationMax: dMax ?? dMin, station: s.station || null,
      after: s.after.map((u) => form.steps.findIndex((x) => x.uid === u) + 1).filter((p) => p > 0 && p < i + 1).sort((a, b) => a - b),
      links: s.links
        .map((l) => ({ step: form.steps.findIndex((x) => x.uid === l.stepUid) + 1, kind: l.kind, lag: l.lag }))
        .filter((l) => l.step > 0 && l.step < i + 1),
      cameraShot: s.cameraShot.trim() || null, cameraNote: s.cameraNote.trim() || null, cautions: s.cautions, group: s.group.trim() || null,
      readFromText: stepStillRead(s),
    }
  })
  const body = {
    title: form.title.trim(), summary: form.summary.trim() || null, servings, yieldText: form.yieldText.trim() || null,
    tags: [...new Set(form.tags.split(',').map((t) => t.trim()).filter(Boolean))], notes: form.notes.trim() || null,
    times: { prep: minutes('times.prep', form.prepMinutes), cook: minutes('times.cook', form.cookMinutes), total: minutes('times.total', form.totalMinutes) },
    ingredients, steps,
  }
  return { body, problems }
}
