// Gram weights of household measures, used as densities to turn volume into mass and back.
//
// Source: USDA FoodData Central, SR Legacy (the Standard Reference "household measure" gram
// weights), one food each, named by its SR Legacy description and NDB number. Measures are US
// customary (the SR "cup" is the US cup of 8 US fl oz).
//
// Provenance: the gram weights were first written from memory of SR Legacy; a reading of all 32
// against SR Legacy's household-measure weights (Hobline issue 14) found them right, but two cited
// the wrong food: bread flour now names NDB 20083 (bread, enriched; 20481 is all-purpose,
// unenriched) and soy sauce 16123 (shoyu, 16 g/tbsp; 16124 is tamari, 18 g/tbsp). The short-grain
// rice description now reads as SR's, and the cornstarch tablespoon is derived from SR's cup weight
// (128 g ÷ 16), which `provenance` says. Each entry's `provenance` names the NDB number it was checked
// against on https://fdc.nal.usda.gov/; correct an entry by editing `grams` and `provenance`.
//
// `names` are the item names a recipe uses for that food, matched whole (after lower-casing);
// which everyday name means which SR food ("plain flour" = all-purpose, "cornflour" in the UK =
// cornstarch, basmati and jasmine = long-grain rice) is common practice. A name that could mean
// several foods (bare "rice", "cream", "oil") is left out on purpose: Hobline asks instead.
import type { VolumeUnitId } from '../utils/units'

export interface DensityEntry {
  id: string
  names: string[]
  /** The SR Legacy food description. */
  food: string
  /** SR Legacy NDB number (FoodData Central also lists it). */
  ndb: string
  measure: { amount: number; unit: VolumeUnitId; note?: string }
  grams: number
  provenance: string
}

export const checkedAgainst = (ndb: string) => `checked against SR Legacy NDB ${ndb}`
const e = (
  id: string, names: string[], food: string, ndb: string, amount: number, unit: VolumeUnitId, grams: number, note?: string, derived?: string,
): DensityEntry => ({
  id, names, food, ndb, measure: note ? { amount, unit, note } : { amount, unit }, grams, provenance: checkedAgainst(ndb) + (derived ? `; ${derived}` : ''),
})

export const DENSITIES: readonly DensityEntry[] = [
  e('flour-all-purpose', ['flour', 'all-purpose flour', 'all purpose flour', 'plain flour', 'white flour', 'plain white flour'], 'Wheat flour, white, all-purpose, enriched, bleached', '20081', 1, 'cup', 125),
  e('flour-bread', ['bread flour', 'strong flour', 'strong white flour', 'strong bread flour'], 'Wheat flour, white, bread, enriched', '20083', 1, 'cup', 137),
  e('flour-whole-grain', ['whole wheat flour', 'whole-wheat flour', 'wholemeal flour', 'whole grain flour'], 'Wheat flour, whole-grain', '20080', 1, 'cup', 120),
  e('sugar-granulated', ['sugar', 'granulated sugar', 'white sugar'], 'Sugars, granulated', '19335', 1, 'cup', 200),
  e('sugar-brown', ['brown sugar', 'light brown sugar', 'dark brown sugar', 'packed brown sugar'], 'Sugars, brown', '19334', 1, 'cup', 220, 'packed'),
  e('sugar-powdered', ['powdered sugar', 'icing sugar', 'confectioners sugar', "confectioners' sugar"], 'Sugars, powdered', '19336', 1, 'cup', 120, 'unsifted'),
  e('salt-table', ['salt', 'table salt', 'fine salt', 'fine table salt'], 'Salt, table', '02047', 1, 'tsp', 6),
  e('oil-olive', ['olive oil', 'extra virgin olive oil', 'extra-virgin olive oil'], 'Oil, olive, salad or cooking', '04053', 1, 'tbsp', 13.5),
  e('oil-canola', ['canola oil', 'rapeseed oil'], 'Oil, canola', '04582', 1, 'tbsp', 14),
  e('butter-salted', ['butter', 'salted butter'], 'Butter, salted', '01001', 1, 'cup', 227),
  e('butter-unsalted', ['unsalted butter'], 'Butter, without salt', '01145', 1, 'cup', 227),
  e('milk-whole', ['milk', 'whole milk', 'full-fat milk', 'full fat milk'], 'Milk, whole, 3.25% milkfat, with added vitamin D', '01077', 1, 'cup', 244),
  e('cream-heavy', ['heavy cream', 'heavy whipping cream', 'whipping cream'], 'Cream, fluid, heavy whipping', '01053', 1, 'cup', 238, 'fluid, not whipped'),
  e('yogurt-plain-whole', ['plain yogurt', 'plain yoghurt', 'natural yogurt', 'natural yoghurt', 'whole milk yogurt'], 'Yogurt, plain, whole milk', '01116', 1, 'cup', 245),
  e('water-tap', ['water', 'tap water', 'cold water', 'warm water'], 'Beverages, water, tap, drinking', '14411', 1, 'cup', 237),
  e('rice-long-grain', ['long-grain rice', 'long grain rice', 'long-grain white rice', 'basmati rice', 'jasmine rice'], 'Rice, white, long-grain, regular, raw, enriched', '20044', 1, 'cup', 185),
  e('rice-medium-grain', ['medium-grain rice', 'medium grain rice'], 'Rice, white, medium-grain, raw, enriched', '20050', 1, 'cup', 195),
  e('rice-short-grain', ['short-grain rice', 'short grain rice', 'sushi rice'], 'Rice, white, short-grain, enriched, uncooked', '20052', 1, 'cup', 200),
  e('peas-frozen', ['frozen peas', 'frozen green peas', 'frozen garden peas'], 'Peas, green, frozen, unprepared', '11312', 1, 'cup', 134),
  e('honey', ['honey', 'runny honey'], 'Honey', '19296', 1, 'tbsp', 21),
  e('syrup-maple', ['maple syrup'], 'Syrups, maple', '19353', 1, 'tbsp', 20),
  e('cocoa', ['cocoa', 'cocoa powder', 'unsweetened cocoa powder'], 'Cocoa, dry powder, unsweetened', '19165', 1, 'tbsp', 5.4),
  e('oats', ['rolled oats', 'porridge oats', 'old-fashioned oats', 'oats'], 'Cereals, oats, regular and quick, not fortified, dry', '08120', 1, 'cup', 81),
  e('cornstarch', ['cornstarch', 'corn starch', 'cornflour'], 'Cornstarch', '20027', 1, 'tbsp', 8, undefined,
    'the tablespoon is derived from the cup weight, 128 g ÷ 16'),
  e('baking-soda', ['baking soda', 'bicarbonate of soda', 'bicarb'], 'Leavening agents, baking soda', '18372', 1, 'tsp', 4.6),
  e('baking-powder', ['baking powder'], 'Leavening agents, baking powder, double-acting, sodium aluminum sulfate', '18369', 1, 'tsp', 4.6),
  e('soy-sauce', ['soy sauce', 'soya sauce', 'shoyu'], 'Soy sauce made from soy and wheat (shoyu)', '16123', 1, 'tbsp', 16),
  e('parmesan-grated', ['grated parmesan', 'grated parmesan cheese'], 'Cheese, parmesan, grated', '01032', 1, 'tbsp', 5),
  e('peanut-butter', ['peanut butter', 'smooth peanut butter'], 'Peanut butter, smooth style, with salt', '16098', 1, 'tbsp', 16),
  e('tomato-paste', ['tomato paste', 'tomato concentrate'], 'Tomato products, canned, paste, without salt added', '11546', 1, 'tbsp', 16),
  e('lentils', ['lentils', 'dried lentils'], 'Lentils, raw', '16069', 1, 'cup', 192),
  e('chickpeas-dried', ['dried chickpeas', 'dried garbanzo beans'], 'Chickpeas (garbanzo beans, bengal gram), mature seeds, raw', '16056', 1, 'cup', 200),
]

/** Names that could mean several foods of different density: the message says what to add. */
export const DENSITY_HINTS: Readonly<Record<string, string>> = {
  rice: 'Say which rice (long-, medium- or short-grain): their cup weights differ.',
  'white rice': 'Say which rice (long-, medium- or short-grain): their cup weights differ.',
  cream: 'Say which cream (for example heavy whipping cream): their weights differ.',
  oil: 'Say which oil (for example olive oil or canola oil).',
  'vegetable oil': 'Say which oil (for example canola oil), or enter its weight for a measured amount.',
}
