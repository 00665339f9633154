// How recipes write units: names, plurals and abbreviations, mapped to Hobline's unit ids.
// Common practice of English-language recipes (US, UK, Australian print and web); "T" and "t"
// for tablespoon and teaspoon are the old US print convention and are the only case-sensitive
// names. "generic" names (cup, pint, quart, gallon, fl oz) follow the studio's choice of US,
// imperial or metric cups; names that say which one ("imperial pint", "US cup") never do.
import type { UnitId } from '../utils/units'

export interface UnitName {
  id: UnitId
  generic?: 'cup' | 'fluid'
  caseSensitive?: boolean
}

const table: Array<[UnitId, string[], UnitName['generic']?]> = [
  ['tsp', ['teaspoon', 'teaspoons', 'teaspoonful', 'teaspoonfuls', 'tsp', 'tsps', 'tspn', 'ts']],
  ['tbsp', ['tablespoon', 'tablespoons', 'tablespoonful', 'tablespoonfuls', 'tbsp', 'tbsps', 'tbs', 'tbl', 'tbls', 'tblsp', 'tb']],
  ['cup', ['cup', 'cups', 'c'], 'cup'],
  ['cup', ['us cup', 'us cups']],
  ['floz', ['fluid ounce', 'fluid ounces', 'fl oz', 'fl. oz', 'fl.oz', 'floz', 'fl ounce', 'fl ounces'], 'fluid'],
  ['floz', ['us fl oz', 'us fluid ounce', 'us fluid ounces']],
  ['pint', ['pint', 'pints', 'pt', 'pts'], 'fluid'],
  ['pint', ['us pint', 'us pints']],
  ['quart', ['quart', 'quarts', 'qt', 'qts'], 'fluid'],
  ['quart', ['us quart', 'us quarts']],
  ['gallon', ['gallon', 'gallons', 'gal', 'gals'], 'fluid'],
  ['gallon', ['us gallon', 'us gallons']],
  ['ml', ['ml', 'mls', 'millilitre', 'millilitres', 'milliliter', 'milliliters']],
  ['cl', ['cl', 'centilitre', 'centilitres', 'centiliter', 'centiliters']],
  ['dl', ['dl', 'decilitre', 'decilitres', 'deciliter', 'deciliters']],
  ['l', ['l', 'ltr', 'ltrs', 'litre', 'litres', 'liter', 'liters']],
  ['metric-cup', ['metric cup', 'metric cups']],
  ['imp-floz', ['imperial fl oz', 'imperial fluid ounce', 'imperial fluid ounces', 'imp fl oz', 'uk fl oz']],
  ['imp-pint', ['imperial pint', 'imperial pints', 'imp pint', 'imp pints', 'uk pint', 'uk pints']],
  ['imp-quart', ['imperial quart', 'imperial quarts', 'imp quart', 'uk quart', 'uk quarts']],
  ['imp-gallon', ['imperial gallon', 'imperial gallons', 'imp gallon', 'uk gallon', 'uk gallons']],
  ['mg', ['mg', 'milligram', 'milligrams', 'milligramme', 'milligrammes']],
  ['g', ['g', 'gr', 'grs', 'gram', 'grams', 'gramme', 'grammes', 'gm', 'gms']],
  ['kg', ['kg', 'kgs', 'kilo', 'kilos', 'kilogram', 'kilograms', 'kilogramme', 'kilogrammes']],
  ['oz', ['oz', 'ozs', 'ounce', 'ounces']],
  ['lb', ['lb', 'lbs', 'pound', 'pounds']],
  ['pinch', ['pinch', 'pinches']],
  ['dash', ['dash', 'dashes']],
  ['drop', ['drop', 'drops']],
  ['clove', ['clove', 'cloves']],
  ['can', ['can', 'cans', 'tin', 'tins']],
  ['jar', ['jar', 'jars']],
  ['packet', ['packet', 'packets', 'pack', 'packs', 'package', 'packages']],
  ['bunch', ['bunch', 'bunches']],
  ['handful', ['handful', 'handfuls']],
  ['sprig', ['sprig', 'sprigs']],
  ['slice', ['slice', 'slices']],
  ['piece', ['piece', 'pieces', 'pc', 'pcs']],
  ['stalk', ['stalk', 'stalks']],
  ['head', ['head', 'heads']],
  ['sheet', ['sheet', 'sheets']],
  ['stick', ['stick', 'sticks']],
]

/** Every unit name, lower-cased, longest first (so "fl oz" wins over "oz"). */
const caseSensitive: Array<{ name: string } & UnitName> = [
  { name: 'T', id: 'tbsp', caseSensitive: true },
  { name: 't', id: 'tsp', caseSensitive: true },
]
export const UNIT_NAMES: ReadonlyArray<{ name: string } & UnitName> = [
  ...table.flatMap(([id, names, generic]) => names.map((name): { name: string } & UnitName => ({ name, id, ...(generic ? { generic } : {}) }))),
  ...caseSensitive,
].sort((a, b) => b.name.length - a.name.length)
