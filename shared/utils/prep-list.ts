// The prep list (mise en place) of an episode: every prep note of every ingredient ("finely
// chopped", "drained", "juiced"), per recipe, ordered by when the cook plan first needs it (the
// planned start of the first step that uses the ingredient), with the bowl or tray it ends up in
// (one per step that uses it), whether it can be done the day before, and its cautions.
//
// A step uses an ingredient when its text holds the ingredient's token ({{onion|item}}) or names
// the item or the last word of its name ("slice the garlic", "add the beans"). The day-before rules and the cautions are common kitchen practice
// (Hobline's own table below, each with its reason); food-safety advice defers to local rules.
import { EU_ALLERGENS, US_ALLERGENS } from './allergens'
import { shopSection } from './shop-sections'
import { itemKey } from './shopping-list'
import { findStepTokens, plainStepText } from './step-text'

export interface PrepIngredient {
  key: string
  item: string
  prep: string | null
  allergens: { eu: readonly string[]; us: readonly string[] }
}

export interface PrepStep {
  id: number
  position: number
  text: string
}

export interface PrepRecipe {
  recipeId: number
  title: string
  ingredients: readonly PrepIngredient[]
  steps: readonly PrepStep[]
}

export type PrepWhen = 'day-before' | 'on-the-day' | 'either'

export interface PrepTask {
  recipeId: number
  recipeTitle: string
  key: string
  item: string
  prep: string
  /** Planned start (seconds from the start of the cook) of the first step using it; null when no step names it or there is no plan. */
  neededAt: number | null
  firstStep: { id: number; position: number; label: string } | null
  /** "bowl for step 2: Warm the olive oil in a wide…", one per step that uses it. */
  containers: string[]
  when: PrepWhen
  /** Why it can, must or should not be done the day before. */
  whenWhy: string
  cautions: string[]
}

/** Common practice, first rule that matches the prep words (and item) wins. */
const WHEN_RULES: { test: RegExp; item?: RegExp; when: PrepWhen; why: string }[] = [
  { test: /\b(thaw|thawed|defrost|defrosted)\b/, when: 'day-before', why: 'must be the day before: thaw in the fridge overnight, never on the counter (common practice; follow local food-safety rules)' },
  { test: /\b(soak|soaked)\b/, when: 'day-before', why: 'soak the night before: dried beans and pulses need 8 hours or more in cold water (common practice)' },
  { test: /\b(chop|chopped|slice|sliced|dice|diced|mince|minced|crush|crushed|grate|grated)\b/, item: /\b(onion|garlic|shallot|leek|spring onion)\b/,
    when: 'on-the-day', why: 'best on the day: cut onion and garlic turn sharp and scent the fridge overnight (common practice)' },
  { test: /\b(picked|chop|chopped|torn|shredded)\b/, item: /\b(parsley|mint|basil|coriander|cilantro|dill|chive|herb)\b/,
    when: 'on-the-day', why: 'on the day: cut herbs wilt and darken within hours (common practice)' },
  { test: /\b(juice|juiced|zest|zested)\b/, when: 'on-the-day', why: 'on the day: zest dries and juice loses its freshness (common practice); a few hours ahead is fine' },
  { test: /\b(drain|drained|rinse|rinsed)\b/, when: 'on-the-day', why: 'on the day, just before cooking: it takes a moment (common practice)' },
  { test: /./, item: /\b(avocado|apple|potato|banana|pear)\b/, when: 'on-the-day', why: 'on the day: cut flesh browns (common practice)' },
  { test: /\b(peel|peeled|chunk|chunks|cut|dice|diced|slice|sliced|grate|grated)\b/,
    when: 'either', why: 'can be done the day before: keep it covered in the fridge (common practice)' },
]

const CUT_WORDS = /\b(chop|chopped|slice|sliced|dice|diced|mince|minced|cut|peel|peeled|shred|shredded|julienne|carve|carved|halve|halved|quarter|quartered|chunks?)\b/

function whenOf(prep: string, item: string): { when: PrepWhen; why: string } {
  const p = prep.toLowerCase()
  const i = itemKey(item)
  for (const r of WHEN_RULES) if (r.test.test(p) && (!r.item || r.item.test(i))) return { when: r.when, why: r.why }
  return { when: 'either', why: 'no rule says otherwise: do it when the list reaches it (common practice)' }
}

const allergenLabel = (id: string) => EU_ALLERGENS.find((a) => a.id === id)?.label.replace(/ \(.*$/, '') ?? US_ALLERGENS.find((a) => a.id === id)?.label ?? id

function cautionsOf(ing: PrepIngredient): string[] {
  const out: string[] = []
  const prep = (ing.prep ?? '').toLowerCase()
  if (CUT_WORDS.test(prep)) out.push('Knife: a sharp knife, a damp cloth under the board, fingers tucked (common practice).')
  if (shopSection(itemKey(ing.item)) === 'meat-fish') {
    out.push('Raw meat or fish: its own board and knife, kept chilled, hands washed after; follow local food-safety rules.')
  }
  const ids = [...new Set([...ing.allergens.eu, ...ing.allergens.us])]
  if (ids.length) out.push(`Allergens: ${ids.map(allergenLabel).join(', ')}. Keep it apart and label the bowl.`)
  return out
}

/** Whether a step uses the ingredient: its token, or the item's name (folded for plurals) in the text. */
function stepUses(step: PrepStep, ing: PrepIngredient): boolean {
  if (findStepTokens(step.text).some((t) => t.key === ing.key)) return true
  const words = ` ${itemKey(plainStepText(step.text))} `
  const name = itemKey(ing.item)
  // the whole name, else its last word ("the beans" for butter beans), when that word is not a short one
  const head = name.split(' ').at(-1) ?? ''
  return (name.length > 0 && words.includes(` ${name} `)) || (head.length >= 4 && words.includes(` ${head} `))
}

const short = (text: string, n = 40) => (text.length > n ? `${text.slice(0, n - 1).trimEnd()}…` : text)

/** The container a prepared ingredient waits in for a step: a tray for the oven, else a bowl. */
function containerFor(step: PrepStep): string {
  const label = plainStepText(step.text)
  const kind = /\b(roast|oven|bake|tray|grill)\b/i.test(label) ? 'tray' : 'bowl'
  return `${kind} for step ${step.position}: ${short(label)}`
}

/**
 * The prep list for recipes in run order, with each step's planned start (seconds, by step id;
 * missing or empty: no plan, recipe order kept).
 */
export function buildPrepList(recipes: readonly PrepRecipe[], starts: ReadonlyMap<number, number> = new Map()): PrepTask[] {
  const tasks: (PrepTask & { order: number })[] = []
  let order = 0
  for (const r of recipes) {
    const steps = [...r.steps].sort((a, b) => a.position - b.position)
    for (const ing of r.ingredients) {
      order++
      const prep = ing.prep?.trim()
      if (!prep) continue
      const using = steps.filter((s) => stepUses(s, ing))
      const timed = using.map((s) => ({ s, at: starts.get(s.id) ?? null }))
      const first = [...timed].sort((a, b) => (a.at ?? Infinity) - (b.at ?? Infinity) || a.s.position - b.s.position)[0] ?? null
      tasks.push({
        recipeId: r.recipeId, recipeTitle: r.title, key: ing.key, item: ing.item, prep,
        neededAt: first?.at ?? null,
        firstStep: first ? { id: first.s.id, position: first.s.position, label: short(plainStepText(first.s.text), 60) } : null,
        containers: using.map(containerFor),
        when: whenOf(prep, ing.item).when,
        whenWhy: whenOf(prep, ing.item).why,
        cautions: cautionsOf(ing),
        order,
      })
    }
  }
  tasks.sort((a, b) => (a.neededAt ?? Infinity) - (b.neededAt ?? Infinity) || a.order - b.order)
  return tasks.map(({ order: _order, ...t }) => t)
}
