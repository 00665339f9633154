// The episode builder's words for live fields and planned times. A chip in the script editor names
// the field in words ("Cost per serving: Stew"), never as code; the runtime bar says minutes.
import type { LiveField, LiveFieldKind } from './show-segments'
import { ovenSpoken } from './live-fields'

/** The field picker's list, in the order a presenter reaches for them. */
export const LIVE_FIELD_WORDS: readonly { kind: LiveFieldKind; label: string; hint: string }[] = [
  { kind: 'servings', label: 'Servings', hint: 'How many the episode cooks for.' },
  { kind: 'amount', label: 'Amount of an ingredient', hint: 'Scaled to the servings, in the units on set.' },
  { kind: 'cost', label: 'Cost per serving', hint: 'From the studio\'s prices, with or without the optional ingredients.' },
  { kind: 'budget', label: 'Budget per serving', hint: 'The episode\'s budget, or the studio\'s.' },
  { kind: 'oven', label: 'Oven temperature', hint: 'Said in °C and °F.' },
  { kind: 'total-time', label: 'Total time of a recipe', hint: 'Start to finish, as the recipe gives it.' },
]

/** A chip's words: the field and what it reads, with the recipe and ingredient names the page knows. */
export interface FieldNames {
  recipe?: (id: number) => string | undefined
  ingredient?: (recipeId: number, key: string) => string | undefined
}

export function liveFieldLabel(field: LiveField, names: FieldNames = {}): string {
  const recipe = (id: number) => names.recipe?.(id) ?? 'a recipe no longer in the studio'
  switch (field.kind) {
    case 'servings': return 'Servings'
    case 'budget': return 'Budget per serving'
    case 'oven': return `Oven: ${ovenSpoken(field.celsius).text}`
    case 'total-time': return `Total time: ${recipe(field.recipeId)}`
    case 'cost': return `Cost per serving${field.withOptional ? ' with the optional ingredients' : ''}: ${recipe(field.recipeId)}`
    case 'amount': return `Amount of ${names.ingredient?.(field.recipeId, field.ingredientKey) ?? 'an ingredient'}: ${recipe(field.recipeId)}`
  }
}

/** Planned minutes as said on the desk: "12 min", "1 h 5 min", "40 s" under a minute. */
export function plannedText(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000))
  if (s < 60) return `${s} s`
  const min = Math.round(s / 60)
  return min >= 60 ? `${Math.floor(min / 60)} h${min % 60 ? ` ${min % 60} min` : ''}` : `${min} min`
}

/** "3 min over the 75 min target", "on the 75 min target" (within half a minute), or null without one. */
export function targetText(overMs: number | null, targetMs: number | null): string | null {
  if (overMs === null || targetMs === null) return null
  const target = plannedText(targetMs)
  const min = Math.round(Math.abs(overMs) / 60_000)
  if (Math.abs(overMs) < 30_000) return `on the ${target} target`
  const amount = min ? `${min} min` : `${Math.round(Math.abs(overMs) / 1000)} s`
  return `${amount} ${overMs > 0 ? 'over' : 'under'} the ${target} target`
}
