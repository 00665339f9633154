// Cautions shown on the prompter for the steps they concern. Short and calm; food-safety figures
// quote USDA FSIS as published (°F) and UK food hygiene law for hot holding (63 °C), with °C rounded
// conservatively to whole degrees: up for a temperature to reach or hold at least, down for one to stay
// below. A UK studio sees the UK figure first with the US one beside it; any other studio the reverse.
// Every food-safety text defers to local rules. The other texts are common kitchen practice.
import { convertTemperature } from './units'

export const CAUTION_IDS = [
  'hot-oil', 'hot-pan', 'oven', 'knife', 'blending-hot', 'boiling', 'raw-meat', 'egg-dish', 'reheating', 'allergen', 'hot-holding',
] as const
export type CautionId = (typeof CAUTION_IDS)[number]

export interface Caution {
  id: CautionId
  label: string
  text: string
  /** Where the figures come from, or "common practice". */
  source: string
}

/** USDA FSIS figures, in °F as published. */
export const FOOD_SAFETY_FIGURES = {
  // USDA FSIS, "Danger Zone" (40 °F – 140 °F): bacteria grow fastest in this range; leave food
  // out no more than 2 hours, 1 hour when above 90 °F. Hot food is held at 140 °F or above.
  dangerZoneLowF: 40,
  dangerZoneHighF: 140,
  hoursOutMax: 2,
  hotDayF: 90,
  hoursOutHotDay: 1,
  // USDA FSIS, Safe Minimum Internal Temperature Chart.
  poultryF: 165,
  groundMeatF: 160,
  groundPoultryF: 165,
  wholeCutsF: 145,
  wholeCutsRestMinutes: 3,
  fishF: 145,
  shellfishF: 145,
  eggDishesF: 160,
  leftoversF: 165,
} as const

/**
 * UK hot holding: hot food is kept at 63 °C or above (Food Safety and Hygiene (England) Regulations
 * 2013, Schedule 4, and the Food Standards Agency's guidance on hot holding; the Scottish, Welsh and
 * Northern Irish regulations say the same — the statute citation is from memory).
 */
export const UK_HOT_HOLDING_C = 63

/** Which way a temperature limit errs on the safe side: reach at least ("min") or stay below ("max"). */
export type LimitKind = 'min' | 'max'

/** °C of a published °F figure in whole degrees, rounded the safe way: 165 °F → 74 °C (73.9 up), 40 °F → 4 °C (4.4 down). */
export function safeCelsius(f: number, kind: LimitKind = 'min'): number {
  const c = Number(convertTemperature(f, 'F').toFixed(9))
  return kind === 'min' ? Math.ceil(c) : Math.floor(c)
}

/** "165 °F (74 °C)": the published °F with °C rounded the safe way (NIST SP 811 for the conversion). */
export function fahrenheitWithCelsius(f: number, kind: LimitKind = 'min'): string {
  return `${f} °F (${safeCelsius(f, kind)} °C)`
}

/** The country whose food-safety figures come first: the region of the studio's locale ("en-GB" → "GB"). */
export function countryOfLocale(locale: string | null | undefined): string {
  const region = /^[a-z]{2,3}[-_]([A-Z]{2})\b/i.exec(String(locale ?? ''))?.[1]?.toUpperCase()
  return region ?? 'US'
}

const F = FOOD_SAFETY_FIGURES
const LOCAL = 'Follow your local food-safety rules.'
const fc = fahrenheitWithCelsius

function hotHolding(country: string): Caution {
  const us = `USDA FSIS: hold hot food at ${fc(F.dangerZoneHighF)} or above`
  const uk = `UK food hygiene rules: hold hot food at ${UK_HOT_HOLDING_C} °C or above`
  const danger = `USDA FSIS calls ${F.dangerZoneLowF}–${F.dangerZoneHighF} °F (${safeCelsius(F.dangerZoneLowF, 'max')}–${safeCelsius(F.dangerZoneHighF)} °C) `
    + `the "Danger Zone": keep food in it no more than ${F.hoursOutMax} hours (${F.hoursOutHotDay} hour above ${F.hotDayF} °F, ${safeCelsius(F.hotDayF, 'max')} °C).`
  const first = country === 'GB' ? `${uk}; beside it, ${us}.` : `${us}; beside it, ${uk}.`
  return {
    id: 'hot-holding', label: 'Food kept warm',
    source: country === 'GB'
      ? 'UK food hygiene guidance on hot holding (63 °C); USDA FSIS, "Danger Zone" (40 °F – 140 °F)'
      : 'USDA FSIS, "Danger Zone" (40 °F – 140 °F); UK food hygiene guidance on hot holding (63 °C)',
    text: `Food kept warm. ${first} ${danger} ${LOCAL}`,
  }
}

const list: Caution[] = [
  { id: 'hot-oil', label: 'Hot oil', source: 'common practice',
    text: 'Hot oil. Dry the food, lower it in gently, keep the handle turned in and never leave the pan. Keep a lid at hand; never put water on an oil fire.' },
  { id: 'hot-pan', label: 'Hot pan', source: 'common practice',
    text: 'Hot pan or hot surface. Handles turned in, a dry cloth or glove for the handle, and say "hot pan" when you pass one; set it down on a trivet, not the counter.' },
  { id: 'oven', label: 'Hot oven', source: 'common practice',
    text: 'Hot oven. Use dry oven gloves and say "door open" before opening it: steam and heat come out first.' },
  { id: 'knife', label: 'Sharp knife', source: 'common practice',
    text: 'Sharp knife. Board steady on a damp cloth, fingertips tucked; lay the knife down flat, away from the edge, before turning to camera.' },
  { id: 'blending-hot', label: 'Blending hot liquid', source: 'common practice',
    text: 'Blending hot liquid. Fill the jug no more than half, vent the lid, hold it down with a folded towel and start slow: steam can lift the lid.' },
  { id: 'boiling', label: 'Boiling liquid', source: 'common practice',
    text: 'Boiling liquid and steam. Pan handles turned in; lift lids away from you; drain into a sink, not towards anyone.' },
  { id: 'raw-meat', label: 'Raw meat or fish', source: 'USDA FSIS, Safe Minimum Internal Temperature Chart',
    text: 'Raw meat, poultry or fish. Keep it apart from ready-to-eat food, wash hands and boards after it, and check the inside with a thermometer. '
      + `USDA FSIS safe minimum internal temperatures: poultry ${fc(F.poultryF)}; ground meat ${fc(F.groundMeatF)}, ground poultry ${fc(F.groundPoultryF)}; `
      + `whole cuts of beef, pork, veal and lamb ${fc(F.wholeCutsF)} with a ${F.wholeCutsRestMinutes}-minute rest; fish and shellfish ${fc(F.fishF)}. ${LOCAL}` },
  { id: 'egg-dish', label: 'Egg dish', source: 'USDA FSIS, Safe Minimum Internal Temperature Chart',
    text: `Egg dish. Cook until set; USDA FSIS gives egg dishes a safe minimum internal temperature of ${fc(F.eggDishesF)}. ${LOCAL}` },
  { id: 'reheating', label: 'Reheating', source: 'USDA FSIS, Safe Minimum Internal Temperature Chart',
    text: `Reheating. Heat leftovers through until steaming hot; USDA FSIS gives leftovers and casseroles ${fc(F.leftoversF)}. ${LOCAL}` },
  { id: 'allergen', label: 'Allergens', source: 'Regulation (EU) No 1169/2011 Annex II; FALCPA 2004 and FASTER Act 2021',
    text: `Allergens in this step. Tell the crew and any tasters which ones, keep boards and spoons apart, and check labels: products change. ${LOCAL}` },
]

/** The cautions with the food-safety figures of a country first ("GB" for a UK studio; anything else shows the US figures first). */
export function cautionsFor(country: string): Readonly<Record<CautionId, Caution>> {
  return Object.fromEntries([...list, hotHolding(country)].map((c) => [c.id, c])) as Record<CautionId, Caution>
}

/** The injection key under which a page provides its studio's country to the caution notes. */
export const CAUTION_COUNTRY = 'hobline-caution-country'

/** The cautions as a studio outside the UK sees them (labels are the same everywhere). */
export const CAUTIONS: Readonly<Record<CautionId, Caution>> = cautionsFor('US')

export function isCautionId(value: unknown): value is CautionId {
  return typeof value === 'string' && (CAUTION_IDS as readonly string[]).includes(value)
}

const CUES: Array<[CautionId, RegExp]> = [
  ['hot-oil', /\b(deep[- ]?fry|deep[- ]?fried|shallow[- ]?fry|fry|frying|fried|hot oil)\b/i],
  ['hot-pan', /\b(hot (?:dry )?pan|dry pan|hot (?:griddle|skillet|plate|surface|tray)|griddle|skillet|sear|searing|char|toast(?:ed)? in a (?:dry )?pan)\b/i],
  ['oven', /\b(oven|bake|baking|roast|roasting|broil|grill)\b/i],
  ['knife', /\b(chop|chopped|slice|sliced|dice|diced|mince|julienne|knife|cut|carve|fillet|halve|quarter)\b/i],
  ['boiling', /\b(boil|boiling|simmer|simmering|blanch|drain|steam)\b/i],
  ['raw-meat', /\b(raw )?(chicken|beef|pork|lamb|turkey|duck|veal|mince|sausages?|fish|salmon|cod|prawns?|shrimp|mussels?|clams?|scallops?|crab|lobster|shellfish)\b/i],
  ['egg-dish', /\b(frittata|omelet(?:te)?|quiche|scrambled eggs?|egg dish|strata|custard|shakshuka)\b/i],
  ['reheating', /\b(reheat|reheated|reheating|leftovers?)\b/i],
  ['hot-holding', /\b(keep warm|keep it warm|hold warm|warming drawer|hot[- ]hold)\b/i],
]
const BLEND = /\b(blend|blender|pur[eé]e|liquidi[sz]e)\b/i
const HOT = /\b(hot|soup|simmer\w*|boil\w*|warm)\b/i

/** Cautions a step's text suggests, with the word that suggested each; the user confirms them. */
export function suggestStepCautions(text: string): Array<{ id: CautionId; matched: string }> {
  const out: Array<{ id: CautionId; matched: string }> = []
  for (const [id, re] of CUES) {
    const m = re.exec(text)
    if (m) out.push({ id, matched: m[0] })
  }
  const b = BLEND.exec(text)
  const h = HOT.exec(text)
  if (b && h) out.push({ id: 'blending-hot', matched: `${b[0]} … ${h[0]}` })
  return out.sort((a, c) => CAUTION_IDS.indexOf(a.id) - CAUTION_IDS.indexOf(c.id))
}
