// Where an item is found in a shop, for grouping a shopping list. Common practice of grocery shops
// (no standard covers it): the keyword table below is Hobline's own, read on the item's name after
// lower case and plural folding; the longest keyword that matches wins, so "butter beans" goes to
// tins and jars although "butter" alone is dairy. A counted can or jar is a tin or jar whatever its
// name; anything the table does not know is "other".
import type { UnitId } from './units'

export const SHOP_SECTIONS = ['produce', 'dairy-eggs', 'meat-fish', 'tins-jars', 'dry-goods', 'spices', 'bakery', 'frozen', 'other'] as const
export type ShopSection = (typeof SHOP_SECTIONS)[number]

export const SHOP_SECTION_LABELS: Record<ShopSection, string> = {
  produce: 'Produce',
  'dairy-eggs': 'Dairy and eggs',
  'meat-fish': 'Meat and fish',
  'tins-jars': 'Tins and jars',
  'dry-goods': 'Dry goods',
  spices: 'Spices and seasonings',
  bakery: 'Bakery',
  frozen: 'Frozen',
  other: 'Other',
}

const TABLE: Record<Exclude<ShopSection, 'other'>, string[]> = {
  frozen: ['frozen', 'ice cream', 'frozen pea', 'frozen spinach'],
  bakery: ['bread', 'loaf', 'baguette', 'pitta', 'pita', 'tortilla', 'wrap', 'bun', 'roll', 'brioche', 'croissant', 'naan', 'sourdough'],
  'tins-jars': [
    'tinned', 'canned', 'chopped tomato', 'plum tomato', 'passata', 'tomato paste', 'tomato puree', 'butter bean', 'kidney bean', 'black bean',
    'cannellini bean', 'baked bean', 'chickpea', 'coconut milk', 'tahini', 'peanut butter', 'jam', 'honey', 'mustard', 'pickle', 'caper', 'olive',
    'anchovy', 'tuna', 'sweetcorn', 'mayonnaise', 'ketchup', 'soy sauce', 'fish sauce', 'vinegar', 'harissa', 'pesto',
  ],
  'dry-goods': [
    'flour', 'self-raising flour', 'plain flour', 'sugar', 'rice', 'pasta', 'spaghetti', 'noodle', 'lentil', 'dried', 'oat', 'couscous', 'bulgur',
    'quinoa', 'polenta', 'stock', 'olive oil', 'oil', 'baking powder', 'bicarbonate of soda', 'baking soda', 'yeast', 'cocoa', 'chocolate',
    'nut', 'almond', 'walnut', 'seed', 'raisin', 'breadcrumb', 'cornflour', 'cornstarch',
  ],
  spices: [
    'salt', 'sea salt', 'pepper', 'black pepper', 'paprika', 'smoked paprika', 'cumin', 'coriander seed', 'turmeric', 'chilli flake', 'chili flake',
    'cinnamon', 'nutmeg', 'clove powder', 'oregano', 'dried thyme', 'bay leaf', 'cardamom', 'garam masala', 'curry powder', 'five spice', 'vanilla',
  ],
  'meat-fish': [
    'chicken', 'beef', 'pork', 'lamb', 'mince', 'bacon', 'sausage', 'ham', 'turkey', 'duck', 'fish', 'salmon', 'cod', 'haddock', 'prawn',
    'shrimp', 'mussel', 'squid', 'mackerel', 'chorizo',
  ],
  'dairy-eggs': ['milk', 'butter', 'cream', 'cheese', 'yoghurt', 'yogurt', 'egg', 'creme fraiche', 'feta', 'parmesan', 'mozzarella', 'halloumi'],
  produce: [
    'onion', 'red onion', 'spring onion', 'shallot', 'garlic', 'ginger', 'tomato', 'cherry tomato', 'potato', 'sweet potato', 'carrot', 'celery',
    'leek', 'squash', 'butternut squash', 'courgette', 'zucchini', 'aubergine', 'eggplant', 'pepper bell', 'bell pepper', 'red pepper',
    'chilli', 'chili', 'lemon', 'lime', 'orange', 'apple', 'banana', 'berry', 'parsley', 'mint', 'coriander', 'cilantro', 'basil', 'thyme',
    'rosemary', 'sage', 'dill', 'chive', 'spinach', 'lettuce', 'kale', 'cabbage', 'broccoli', 'cauliflower', 'mushroom', 'avocado', 'cucumber',
    'pea', 'bean sprout', 'green bean', 'herb', 'salad', 'rocket', 'fennel', 'beetroot',
  ],
}

interface Entry { words: string[]; section: ShopSection }
const ENTRIES: Entry[] = Object.entries(TABLE)
  .flatMap(([section, keys]) => keys.map((k) => ({ words: k.split(' '), section: section as ShopSection })))
  // longest phrase first; among equals, the table's order
  .sort((a, b) => b.words.join(' ').length - a.words.join(' ').length)

/** Whether `phrase` occurs in `words` as whole words, in order. */
function hasPhrase(words: string[], phrase: string[]): boolean {
  outer: for (let i = 0; i + phrase.length <= words.length; i++) {
    for (let j = 0; j < phrase.length; j++) if (words[i + j] !== phrase[j]) continue outer
    return true
  }
  return false
}

/**
 * The shop section of an item, from its folded name (see `itemKey` in shopping-list.ts) and its
 * unit: `shopSection('butter bean', 'can')` → 'tins-jars', `shopSection('plain yoghurt')` → 'dairy-eggs'.
 */
export function shopSection(foldedName: string, unit: UnitId | 'each' | null = null): ShopSection {
  if (unit === 'can' || unit === 'jar') return 'tins-jars'
  const words = foldedName.split(/[\s,]+/).filter(Boolean)
  for (const e of ENTRIES) if (hasPhrase(words, e.words)) return e.section
  return 'other'
}
