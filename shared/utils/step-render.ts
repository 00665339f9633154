// A step's text with its amount tokens (step-text.ts) replaced by scaled, kitchen-rounded amounts.
// An ingredient with no amount renders as its item ("salt to taste" when it is to taste). A token
// whose key no ingredient has is left as written and reported, so nothing is lost.
import type { RecipeIngredientDraft } from '../types/recipe'
import { formatIngredientAmount, scaleAmount, type KitchenDisplayOptions } from './scale'
import { segmentsText } from './step-segments'
import { findStepTokens, ingredientKeyWords, stepTokenProblems, type StepTextSegment, type StepTokenProblem } from './step-text'

export interface RenderStepTextOptions extends KitchenDisplayOptions {
  ingredients: readonly Pick<RecipeIngredientDraft, 'key' | 'min' | 'max' | 'unit' | 'item' | 'toTaste' | 'stated'>[]
  fromServings: number
  toServings: number
}

/** A step's text with its tokens replaced by scaled, kitchen-rounded amounts. */
export function renderStepText(
  text: string,
  options: RenderStepTextOptions,
): { text: string; segments: StepTextSegment[]; problems: StepTokenProblem[] } {
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

export interface StepPreviewPart {
  text: string
  /** A rendered amount; `exactText` for its hover. */
  amount?: boolean
  exactText?: string
  /** An amount the renderer could not read (see `problems`), shown as its ingredient's words. */
  unread?: boolean
}

/**
 * The step as the prompter reads it, for the editor's preview: renderStepText's segments, with each
 * amount it could not read shown as its ingredient's words and marked, so no raw token reaches the screen.
 */
export function stepPreview(text: string, options: RenderStepTextOptions): { parts: StepPreviewPart[]; problems: StepTokenProblem[] } {
  const { segments, problems } = renderStepText(text, options)
  const parts = segments.flatMap((seg): StepPreviewPart[] => {
    if (seg.ingredientKey) return [{ text: seg.text, amount: true, ...(seg.exactText ? { exactText: seg.exactText } : {}) }]
    const out: StepPreviewPart[] = []
    let at = 0
    for (const t of findStepTokens(seg.text)) {
      if (t.start > at) out.push({ text: seg.text.slice(at, t.start) })
      out.push({ text: ingredientKeyWords(t.key), unread: true })
      at = t.end
    }
    if (at < seg.text.length) out.push({ text: seg.text.slice(at) })
    return out
  })
  return { parts, problems }
}
