// A step's text with its amount tokens (step-text.ts) replaced by scaled, kitchen-rounded amounts.
// An ingredient with no amount renders as its item ("salt to taste" when it is to taste). A token
// whose key no ingredient has is left as written and reported, so nothing is lost.
import type { RecipeIngredientDraft } from '../types/recipe'
import { formatIngredientAmount, scaleAmount, type KitchenDisplayOptions } from './scale'
import { segmentsText } from './step-segments'
import { findStepTokens, stepTokenProblems, type StepTextSegment } from './step-text'

export interface RenderStepTextOptions extends KitchenDisplayOptions {
  ingredients: readonly Pick<RecipeIngredientDraft, 'key' | 'min' | 'max' | 'unit' | 'item' | 'toTaste'>[]
  fromServings: number
  toServings: number
}

/** A step's text with its tokens replaced by scaled, kitchen-rounded amounts. */
export function renderStepText(
  text: string,
  options: RenderStepTextOptions,
): { text: string; segments: StepTextSegment[]; problems: Array<{ token: string; reason: string }> } {
  const problems = stepTokenProblems(text, options.ingredients.map((i) => i.key))
  const bad = new Set(problems.map((p) => p.token))
  const segments: StepTextSegment[] = []
  let at = 0
  for (const t of findStepTokens(text)) {
    const ing = options.ingredients.find((i) => i.key === t.key)
    if (!ing || bad.has(t.raw)) continue
    if (t.start > at) segments.push({ text: text.slice(at, t.start) })
    const amount = formatIngredientAmount(ing, (v) => scaleAmount(v, options.fromServings, options.toServings) * t.factor, options)
    const rendered = amount.min === null ? (ing.toTaste ? `${ing.item} to taste` : ing.item) : t.withItem ? `${amount.text} ${ing.item}` : amount.text
    segments.push({ text: rendered, ingredientKey: ing.key, ...(amount.exactText ? { exactText: amount.sourceText ? `${amount.exactText}; ${amount.sourceText}` : amount.exactText } : {}) })
    at = t.end
  }
  if (at < text.length) segments.push({ text: text.slice(at) })
  return { text: segmentsText(segments), segments, problems }
}
