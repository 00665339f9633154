// The recipe as schema.org JSON-LD (shared/utils/schemaorg-export.ts) with each ingredient's allergen
// certainty beside its allergens: suggested, checked (by whom, when) or none declared. An import reads the
// allergens back but not the check: a check belongs to the studio that made it, so imported allergens are
// suggestions until someone checks them there.
import type { RecipeView } from './recipes'
import { HOBLINE_LD_PREFIX } from '../../shared/utils/schemaorg-steps'

export function exportRecipeJsonLd(recipe: RecipeView) {
  const ld = exportSchemaOrgRecipe(recipeDraft(recipe)) as Record<string, unknown>
  const list = ld[`${HOBLINE_LD_PREFIX}:ingredients`]
  if (Array.isArray(list)) {
    const byKey = new Map(recipe.ingredients.map((i) => [i.key, i]))
    ld[`${HOBLINE_LD_PREFIX}:ingredients`] = list.map((entry: Record<string, unknown>) => {
      const i = byKey.get(String(entry.key))
      return i
        ? {
            ...entry, allergenState: i.allergenState, allergensCheckedBy: i.allergensCheckedBy, allergensCheckedAt: i.allergensCheckedAt,
            allergenCertainty: allergenCertaintyText(i as never),
          }
        : entry
    })
  }
  return ld
}
