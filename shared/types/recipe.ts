// A recipe as Hobline edits, imports, exports, scales and costs it: plain, serialisable data
// (JSON-safe: strings, numbers, booleans, null, arrays), stored by the server as it is.
// Amounts are kept as the recipe states them (1½ cup) and converted only for display or maths.
import type { AllergenState, IngredientAllergens } from '../utils/allergens'
import type { CautionId } from '../utils/cautions'
import type { UnitId } from '../utils/units'

/** The same amount as the recipe also states it in another unit ("½ cup (100 g)" → 100 g): the author's own measure. */
export interface StatedMeasure {
  min: number
  max: number
  unit: UnitId
}

/** A step field an import read from the step's text, until a person confirms or changes it. */
export type StepReadField = 'duration' | 'handsOn' | 'station'

export type RecipeStation = 'burner' | 'oven' | 'counter'

export interface RecipeIngredientDraft {
  /** Stable within the recipe; step text names it as {{key}} (see step-text.ts). Letters, digits, "-" and "_". */
  key: string
  /** 1-based order in the recipe. */
  position: number
  /** The amount as a range; equal for a single amount; both null for no amount ("to taste"). */
  min: number | null
  max: number | null
  unit: UnitId | null
  item: string
  /** Prep note: "thinly sliced". */
  prep: string | null
  optional: boolean
  /** True for "salt, to taste": no amount, and the line says so. */
  toTaste: boolean
  /** Ingredient group heading: "For the sauce". */
  group: string | null
  allergens: IngredientAllergens
  /** How sure `allergens` is; absent: suggested when it lists something, else none declared. */
  allergenState?: AllergenState
  /** Who checked the allergens and when (ISO), for a checked ingredient. */
  allergensCheckedBy?: string | null
  allergensCheckedAt?: string | null
  /** The amount as the line also states it in another unit; used for showing that system and for costing. */
  stated?: StatedMeasure | null
  /** The studio price this ingredient is costed with (not exported: prices belong to the studio). */
  priceId?: string | number | null
}

export interface StepLinkDraft {
  step: number
  kind: 'start-start' | 'finish-together'
  lag: number
}

export interface RecipeStepDraft {
  /** 1-based order in the recipe. */
  position: number
  /** A short name for the step's timer and cues ("Pasta water"), at most 40 characters; null for none. */
  name: string | null
  /** What to do. May name ingredients as {{key}} tokens, which follow the scale. */
  text: string
  /** What to say on camera, one line each. */
  script: string[]
  /** Hands-on (true) or unattended wait (false). */
  handsOn: boolean
  /** Duration as a range in seconds; both null for none. */
  durationMin: number | null
  durationMax: number | null
  station: RecipeStation | null
  /** Positions of earlier steps this one waits for. */
  after: number[]
  /**
   * Links to earlier steps beyond "after", by position: start with it (after a lag in seconds) or
   * finish together with it (going in a lead before it ends). A step that names neither "after"
   * nor a link follows the step before it; "starts together with the step before" is a start-start
   * link to it with no lag (see step-links.ts).
   */
  links?: StepLinkDraft[]
  cameraShot: string | null
  cameraNote: string | null
  cautions: CautionId[]
  /** Step group (a schema.org HowToSection name): "Make the sauce". */
  group: string | null
  /** Fields read from the text by an import (step-time-read.ts), not yet confirmed by a person. */
  readFromText?: StepReadField[]
}

export interface RecipeTimes {
  /** Seconds, from schema.org prepTime, cookTime, totalTime. */
  prep: number | null
  cook: number | null
  total: number | null
}

export interface RecipeDraft {
  title: string
  summary: string | null
  /** Yield in servings, a positive number. */
  servings: number
  /** Yield as stated when it says more than a number ("1 loaf, 12 slices"). */
  yieldText: string | null
  tags: string[]
  notes: string | null
  times: RecipeTimes
  ingredients: RecipeIngredientDraft[]
  steps: RecipeStepDraft[]
}

/** Something an import could not understand: the field (a schema.org path) and why. */
export interface RecipeImportProblem {
  field: string
  reason: string
}
