// Cautions shown on the prompter for the steps they concern. Short and calm; food-safety figures
// quote USDA FSIS as published (°F) with °C converted by NIST SP 811 to one decimal, and every
// food-safety text defers to local rules. The other texts are common kitchen practice.
import { convertTemperature } from './units'

export const CAUTION_IDS = ['hot-oil', 'oven', 'knife', 'blending-hot', 'boiling', 'raw-meat', 'allergen', 'hot-holding'] as const
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
  // out no more than 2 hours, 1 hour when above 90 °F.
  dangerZoneLowF: 40,
  dangerZoneHighF: 140,
  hoursOutMax: 2,
  hotDayF: 90,
  hoursOutHotDay: 1,
  // USDA FSIS, Safe Minimum Internal Temperature Chart.
  poultryF: 165,
  groundMeatF: 160,
  wholeCutsF: 145,
  wholeCutsRestMinutes: 3,
  fishF: 145,
} as const

/** "140 °F (60 °C)": the published °F with °C to one decimal (NIST SP 811). */
export function fahrenheitWithCelsius(f: number): string {
  const c = Math.round(convertTemperature(f, 'F') * 10) / 10
  return `${f} °F (${c} °C)`
}

const F = FOOD_SAFETY_FIGURES
const LOCAL = 'Follow your local food-safety rules.'
const celsius = (f: number) => Math.round(convertTemperature(f, 'F') * 10) / 10

const list: Caution[] = [
  { id: 'hot-oil', label: 'Hot oil', source: 'common practice',
    text: 'Hot oil. Dry the food, lower it in gently, keep the handle turned in and never leave the pan. Keep a lid at hand; never put water on an oil fire.' },
  { id: 'oven', label: 'Hot oven', source: 'common practice',
    text: 'Hot oven. Use dry oven gloves and say "door open" before opening it: steam and heat come out first.' },
  { id: 'knife', label: 'Sharp knife', source: 'common practice',
    text: 'Sharp knife. Board steady on a damp cloth, fingertips tucked; lay the knife down flat, away from the edge, before turning to camera.' },
  { id: 'blending-hot', label: 'Blending hot liquid', source: 'common practice',
    text: 'Blending hot liquid. Fill the jug no more than half, vent the lid, hold it down with a folded towel and start slow: steam can lift the lid.' },
  { id: 'boiling', label: 'Boiling liquid', source: 'common practice',
    text: 'Boiling liquid and steam. Pan handles turned in; lift lids away from you; drain into a sink, not towards anyone.' },
  { id: 'raw-meat', label: 'Raw meat or fish', source: 'USDA FSIS, Safe Minimum Internal Temperature Chart',
    text: `Raw meat, poultry or fish. Keep it apart from ready-to-eat food, wash hands and boards after it, and check the inside with a thermometer. USDA FSIS safe minimum internal temperatures: poultry ${fahrenheitWithCelsius(F.poultryF)}; ground meat ${fahrenheitWithCelsius(F.groundMeatF)}; whole cuts of beef, pork, veal and lamb ${fahrenheitWithCelsius(F.wholeCutsF)} with a ${F.wholeCutsRestMinutes}-minute rest; fish ${fahrenheitWithCelsius(F.fishF)}. ${LOCAL}` },
  { id: 'allergen', label: 'Allergens', source: 'Regulation (EU) No 1169/2011 Annex II; FALCPA 2004 and FASTER Act 2021',
    text: 'Allergens in this step. Tell the crew and any tasters which ones, keep boards and spoons apart, and check labels: products change.' },
  { id: 'hot-holding', label: 'Food kept warm', source: 'USDA FSIS, "Danger Zone" (40 °F – 140 °F)',
    text: `Food kept warm. USDA FSIS calls ${F.dangerZoneLowF}–${F.dangerZoneHighF} °F (${celsius(F.dangerZoneLowF)}–${celsius(F.dangerZoneHighF)} °C) the "Danger Zone", where bacteria grow fastest: hold hot food at ${fahrenheitWithCelsius(F.dangerZoneHighF)} or above, and keep food in the Danger Zone no more than ${F.hoursOutMax} hours (${F.hoursOutHotDay} hour above ${F.hotDayF} °F, ${celsius(F.hotDayF)} °C). ${LOCAL}` },
]

export const CAUTIONS: Readonly<Record<CautionId, Caution>> = Object.fromEntries(list.map((c) => [c.id, c])) as Record<CautionId, Caution>

export function isCautionId(value: unknown): value is CautionId {
  return typeof value === 'string' && (CAUTION_IDS as readonly string[]).includes(value)
}

const CUES: Array<[CautionId, RegExp]> = [
  ['hot-oil', /\b(deep[- ]?fry|deep[- ]?fried|shallow[- ]?fry|fry|frying|fried|hot oil)\b/i],
  ['oven', /\b(oven|bake|baking|roast|roasting|broil|grill)\b/i],
  ['knife', /\b(chop|chopped|slice|sliced|dice|diced|mince|julienne|knife|cut|carve|fillet|halve|quarter)\b/i],
  ['boiling', /\b(boil|boiling|simmer|simmering|blanch|drain|steam)\b/i],
  ['raw-meat', /\b(raw )?(chicken|beef|pork|lamb|turkey|duck|veal|mince|sausages?|fish|salmon|cod|prawns?|shrimp)\b/i],
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
