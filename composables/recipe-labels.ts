// Short names for the allergen groups, for chips, table cells and filters.
import type { EuAllergenId, UsAllergenId } from '~~/shared/utils/allergens'

/** "Cereals containing gluten (wheat, rye…)" → "Cereals containing gluten"; the full label stays in the title. */
export function euAllergenShort(id: EuAllergenId | string): string {
  const a = EU_ALLERGENS.find((x) => x.id === id)
  return a ? (a.id === 'tree-nuts' ? 'Nuts' : a.label.split(' (')[0]!) : String(id)
}

export function usAllergenShort(id: UsAllergenId | string): string {
  return US_ALLERGENS.find((x) => x.id === id)?.label ?? String(id)
}

/** One list of allergen filters for the recipe list: the EU 14, then the US groups the EU list has no id for. */
export function allergenFilterOptions(): Array<{ id: string; label: string }> {
  const eu = EU_ALLERGENS.map((a) => ({ id: a.id as string, label: `${euAllergenShort(a.id)} (EU)` }))
  const us = US_ALLERGENS.map((a) => ({ id: a.id as string, label: `${a.label} (US)` }))
  const byId = new Map<string, string>()
  for (const o of [...eu, ...us]) byId.set(o.id, byId.has(o.id) ? `${byId.get(o.id)!.replace(/ \(EU\)$/, '')} (EU and US)` : o.label)
  return [...byId].map(([id, label]) => ({ id, label }))
}
