// A Hobline recipe → schema.org Recipe JSON-LD that re-imports to the same recipe.
// Standard properties carry what schema.org has words for (name, description, recipeYield,
// keywords, prepTime / cookTime / totalTime, recipeIngredient lines, recipeInstructions as
// HowToStep inside HowToSection for step groups, the step duration as a HowToDirection's
// performTime). Hobline's own fields, which schema.org has no property for, travel under the
// "hobline:" prefix of HOBLINE_LD_NAMESPACE, declared in the @context so JSON-LD processors read
// them as full IRIs and other consumers can ignore them:
//   recipe:     hobline:notes, hobline:ingredients (key, group, allergens, aligned with recipeIngredient)
//   HowToStep:  name (the step's short name, when it has one), hobline:script, hobline:handsOn,
//               hobline:station, hobline:after, hobline:links (when there are any), hobline:cameraShot,
//               hobline:cameraNote, hobline:cautions, hobline:durationMax (the top of a duration range)
// Studio price links are not exported: prices belong to the studio, not to the recipe.
import type { RecipeDraft, RecipeStepDraft } from '../types/recipe'
import { toIsoDuration } from './duration'
import { formatIngredientLine } from './quantity'
import { HOBLINE_LD_NAMESPACE, HOBLINE_LD_PREFIX } from './schemaorg-steps'

type Json = Record<string, unknown>
const h = (name: string) => `${HOBLINE_LD_PREFIX}:${name}`

function stepNode(step: RecipeStepDraft): Json {
  const lo = step.durationMin ?? step.durationMax
  const hi = step.durationMax ?? step.durationMin
  const node: Json = { '@type': 'HowToStep', position: step.position, text: step.text }
  if (step.name) node.name = step.name
  if (lo !== null) {
    node.itemListElement = [{ '@type': 'HowToDirection', text: step.text, performTime: toIsoDuration(lo) }]
    if (hi !== null && hi !== lo) node[h('durationMax')] = toIsoDuration(hi)
  }
  node[h('script')] = step.script
  node[h('handsOn')] = step.handsOn
  node[h('station')] = step.station
  node[h('after')] = step.after
  if (step.links?.length) node[h('links')] = step.links.map(({ step: at, kind, lag }) => ({ step: at, kind, lag }))
  node[h('cameraShot')] = step.cameraShot
  node[h('cameraNote')] = step.cameraNote
  node[h('cautions')] = step.cautions
  node[h('readFromText')] = step.readFromText ?? []
  return node
}

/** schema.org Recipe JSON-LD for a recipe (serve it as application/ld+json). */
export function exportSchemaOrgRecipe(recipe: RecipeDraft): Json {
  const steps = [...recipe.steps].sort((a, b) => a.position - b.position)
  const instructions: Json[] = []
  for (const step of steps) {
    const node = stepNode(step)
    const last = instructions[instructions.length - 1]
    if (step.group === null) instructions.push(node)
    else if (last && last['@type'] === 'HowToSection' && last.name === step.group) (last.itemListElement as Json[]).push(node)
    else instructions.push({ '@type': 'HowToSection', name: step.group, itemListElement: [node] })
  }
  const ingredients = [...recipe.ingredients].sort((a, b) => a.position - b.position)
  const out: Json = {
    '@context': ['https://schema.org', { [HOBLINE_LD_PREFIX]: HOBLINE_LD_NAMESPACE }],
    '@type': 'Recipe',
    name: recipe.title,
  }
  if (recipe.summary) out.description = recipe.summary
  out.recipeYield = [String(recipe.servings), recipe.yieldText ?? `${recipe.servings} ${recipe.servings === 1 ? 'serving' : 'servings'}`]
  if (recipe.tags.length) out.keywords = recipe.tags.some((t) => t.includes(',')) ? [...recipe.tags] : recipe.tags.join(', ')
  if (recipe.times.prep !== null) out.prepTime = toIsoDuration(recipe.times.prep)
  if (recipe.times.cook !== null) out.cookTime = toIsoDuration(recipe.times.cook)
  if (recipe.times.total !== null) out.totalTime = toIsoDuration(recipe.times.total)
  out.recipeIngredient = ingredients.map(formatIngredientLine)
  out.recipeInstructions = instructions
  if (recipe.notes) out[h('notes')] = recipe.notes
  out[h('ingredients')] = ingredients.map((i) => ({ key: i.key, group: i.group, allergens: { eu: [...i.allergens.eu], us: [...i.allergens.us] } }))
  return out
}
