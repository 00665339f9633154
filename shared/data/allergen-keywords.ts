// Keywords in ingredient names that suggest allergen groups: Regulation (EU) No 1169/2011 Annex II
// (the 14 EU groups) and the US major food allergens (FALCPA 2004; sesame by the FASTER Act 2021).
// Which foods contain what is common kitchen knowledge, not a legal list: these are suggestions
// the user confirms, and a product's label always wins. Entries with no groups shadow a shorter
// keyword that would mislead ("coconut milk" is not milk, "cocoa butter" is not butter).
// Matching ignores case, accents and a plural "s"/"es"/"ies"; longer keywords are matched first.
// Compound items (stock cubes, bouillon) are marked mayContain: their makers' recipes differ, so the
// suggestion says "may contain" and the label decides. Wheat species follow the FDA's reading of
// "wheat" as any species of Triticum (Q&A Edition 5, January 2025): spelt, einkorn, emmer, khorasan.
import type { EuAllergenId, UsAllergenId } from '../utils/allergens'

export interface AllergenKeyword {
  keywords: string[]
  eu: EuAllergenId[]
  us: UsAllergenId[]
  note?: string
  /** A compound item whose makers' recipes differ: the groups are what it often contains. */
  mayContain?: boolean
}

const WHEAT = { eu: ['cereals-gluten'], us: ['wheat'] } as const
const CHECK = 'recipes vary: check the label'

export const ALLERGEN_KEYWORDS: AllergenKeyword[] = [
  // Cereals containing gluten (EU Annex II item 1); wheat (US).
  { keywords: ['wheat', 'flour', 'plain flour', 'all-purpose flour', 'self-raising flour', 'bread flour', 'wholemeal flour', 'semolina', 'durum', 'spelt', 'kamut', 'farro', 'bulgur', 'bulgar', 'couscous', 'seitan', 'bread', 'breadcrumb', 'panko', 'pasta', 'spaghetti', 'penne', 'macaroni', 'lasagne', 'lasagna', 'tagliatelle', 'fettuccine', 'linguine', 'noodle', 'udon', 'pastry', 'puff pastry', 'filo', 'phyllo', 'pizza dough', 'cracker', 'pitta', 'pita', 'naan', 'baguette', 'ciabatta', 'croissant',
    'pie crust', 'shortcrust', 'shortcrust pastry', 'sourdough', 'crouton', 'orzo', 'ramen', 'bagel', 'freekeh', 'einkorn', 'emmer', 'khorasan'], ...copy(WHEAT) },
  { keywords: ['triticale'], ...copy(WHEAT), note: 'a wheat and rye hybrid (from memory: check the label)' },
  { keywords: ['gnocchi'], ...copy(WHEAT), note: `potato gnocchi are usually bound with wheat flour; ${CHECK}` },
  { keywords: ['ravioli', 'tortellini'], eu: ['cereals-gluten', 'eggs'], us: ['wheat', 'eggs'], note: `fresh filled pasta is usually made with egg; the filling varies; ${CHECK}` },
  { keywords: ['egg noodle'], eu: ['cereals-gluten', 'eggs'], us: ['wheat', 'eggs'] },
  { keywords: ['brioche'], eu: ['cereals-gluten', 'eggs', 'milk'], us: ['wheat', 'eggs', 'milk'] },
  { keywords: ['barley', 'pearl barley', 'rye', 'malt', 'malt vinegar', 'beer', 'ale', 'oat', 'oatmeal', 'rolled oat', 'porridge oat'], eu: ['cereals-gluten'], us: [], note: 'barley, rye and oats are EU cereals containing gluten but not US wheat' },
  { keywords: ['oat milk'], eu: ['cereals-gluten'], us: [] },
  { keywords: ['soy sauce', 'soya sauce', 'shoyu'], eu: ['soybeans', 'cereals-gluten'], us: ['soybeans', 'wheat'], note: 'brewed soy sauce is usually made with wheat' },
  { keywords: ['tamari'], eu: ['soybeans'], us: ['soybeans'], note: `usually brewed without wheat; ${CHECK}` },
  { keywords: ['rice flour', 'cornflour', 'corn flour', 'cornstarch', 'chickpea flour', 'gram flour', 'buckwheat flour', 'tapioca flour', 'potato flour', 'coconut flour', 'gluten-free flour', 'gluten-free bread', 'gluten-free pasta', 'gluten free', 'ginger ale', 'rice noodle', 'corn tortilla', 'polenta'], eu: [], us: [] },

  // Crustaceans (item 2); crustacean shellfish (US).
  { keywords: ['prawn', 'shrimp', 'crab', 'lobster', 'crayfish', 'crawfish', 'langoustine', 'scampi', 'krill'], eu: ['crustaceans'], us: ['crustacean-shellfish'] },
  { keywords: ['shellfish'], eu: ['crustaceans', 'molluscs'], us: ['crustacean-shellfish'], note: 'shellfish may be crustaceans or molluscs: keep the one that applies' },
  // Molluscs (item 14); not a US major allergen.
  { keywords: ['mussel', 'clam', 'oyster', 'oyster sauce', 'scallop', 'squid', 'calamari', 'octopus', 'cuttlefish', 'snail', 'escargot', 'whelk', 'cockle', 'abalone'], eu: ['molluscs'], us: [] },
  { keywords: ['oyster mushroom'], eu: [], us: [] },
  // Fish (item 4).
  { keywords: ['fish', 'fish sauce', 'anchovy', 'salmon', 'tuna', 'cod', 'haddock', 'mackerel', 'sardine', 'trout', 'sea bass', 'halibut', 'pollock', 'tilapia', 'hake', 'plaice', 'monkfish', 'swordfish', 'herring', 'kipper', 'bonito', 'dashi',
    'bass', 'flounder', 'sole', 'snapper', 'catfish', 'eel', 'roe', 'cod roe', 'caviar'], eu: ['fish'], us: ['fish'] },
  { keywords: ['worcestershire sauce', 'worcestershire', 'worcester sauce'], eu: ['fish'], us: ['fish'], note: `made with anchovies; some also with malt vinegar; ${CHECK}` },
  // Eggs (item 3).
  { keywords: ['egg', 'egg yolk', 'egg white', 'mayonnaise', 'mayo', 'aioli', 'meringue'], eu: ['eggs'], us: ['eggs'] },
  { keywords: ['custard', 'hollandaise'], eu: ['eggs', 'milk'], us: ['eggs', 'milk'] },
  // Peanuts (item 5).
  { keywords: ['peanut', 'groundnut', 'peanut butter', 'peanut oil', 'peanut flour', 'satay', 'arachis oil', 'monkey nut'], eu: ['peanuts'], us: ['peanuts'] },
  // Soybeans (item 6).
  { keywords: ['soy', 'soya', 'soybean', 'soya bean', 'tofu', 'tempeh', 'edamame', 'miso', 'soy milk', 'soya milk', 'natto'], eu: ['soybeans'], us: ['soybeans'] },
  { keywords: ['hoisin', 'hoisin sauce', 'teriyaki', 'teriyaki sauce'], eu: ['soybeans', 'cereals-gluten'], us: ['soybeans', 'wheat'], note: `made with soy sauce or soybean paste, usually with wheat; ${CHECK}` },
  { keywords: ['soybean oil', 'soya oil'], eu: [], us: [], note: 'fully refined soybean oil is exempt in the EU (Annex II item 6(a)) and highly refined oils under FALCPA; check the label' },
  // Milk (item 7).
  { keywords: ['milk', 'whole milk', 'butter', 'buttermilk', 'cream', 'double cream', 'single cream', 'whipping cream', 'sour cream', 'soured cream', 'creme fraiche', 'cheese', 'cream cheese', 'parmesan', 'parmigiano', 'pecorino', 'cheddar', 'mozzarella', 'feta', 'ricotta', 'mascarpone', 'halloumi', 'paneer', 'gruyere', 'brie', 'camembert', 'gorgonzola', 'yogurt', 'yoghurt', 'ghee', 'whey', 'condensed milk', 'evaporated milk', 'ice cream', 'lactose', 'casein', 'kefir', 'quark', 'labneh', 'milk chocolate',
    'burrata', 'gouda', 'queso', 'skyr', 'buttercream', 'emmental', 'stilton', 'manchego'], eu: ['milk'], us: ['milk'] },
  { keywords: ['coconut milk', 'coconut cream', 'rice milk', 'cocoa butter', 'shea butter', 'apple butter', 'butter bean', 'cream of tartar', 'vegan butter', 'plant butter'], eu: [], us: [] },
  // Nuts as listed in item 8; US tree nuts.
  { keywords: ['almond', 'ground almond', 'almond flour', 'almond milk', 'almond butter', 'marzipan', 'hazelnut', 'filbert', 'walnut', 'cashew', 'pecan', 'brazil nut', 'pistachio', 'macadamia', 'queensland nut', 'nut', 'mixed nut', 'nut butter', 'frangipane', 'praline'], eu: ['tree-nuts'], us: ['tree-nuts'] },
  { keywords: ['pine nut', 'pignoli', 'pinon nut', 'pinyon nut'], eu: [], us: ['tree-nuts'], note: 'on the FDA tree nut list (Q&A Edition 5) but not among the EU nuts' },
  { keywords: ['black walnut', 'heartnut', 'japanese walnut', 'california walnut', 'bush nut'], eu: [], us: ['tree-nuts'],
    note: 'on the FDA tree nut list (Q&A Edition 5); Annex II item 8 names walnuts of Juglans regia and macadamia of Macadamia ternifolia only: check the label' },
  // Not tree nuts in either list: chestnut and coconut left the FDA list in Edition 5 (January 2025).
  { keywords: ['chestnut', 'water chestnut', 'nutmeg', 'coconut', 'butternut', 'beech nut', 'hickory nut', 'ginkgo nut', 'kola nut', 'shea nut'], eu: [], us: [] },
  { keywords: ['pesto'], eu: ['milk'], us: ['milk', 'tree-nuts'], note: `classic pesto has parmesan and pine nuts; ${CHECK}` },
  // Celery (item 9).
  { keywords: ['celery', 'celeriac', 'celery salt', 'celery seed'], eu: ['celery'], us: [] },
  { keywords: ['stock cube', 'bouillon', 'bouillon cube', 'stock pot', 'stock powder', 'gravy granule'], eu: ['celery'], us: [], mayContain: true,
    note: `stock cubes and bouillon often contain celery (some also wheat, milk or mustard); ${CHECK}` },
  // Mustard (item 10).
  { keywords: ['mustard', 'dijon', 'mustard seed', 'mustard powder', 'wholegrain mustard'], eu: ['mustard'], us: [] },
  // Sesame (item 11); US since the FASTER Act 2021.
  { keywords: ['sesame', 'sesame seed', 'sesame oil', 'tahini', 'tahina', 'halva', 'halvah', 'gomasio'], eu: ['sesame'], us: ['sesame'] },
  { keywords: ['zaatar', 'hummus', 'houmous'], eu: ['sesame'], us: ['sesame'], note: `usually made with sesame; ${CHECK}` },
  // Sulphur dioxide and sulphites above 10 mg/kg or 10 mg/L (item 12).
  { keywords: ['wine', 'red wine', 'white wine', 'sherry', 'vermouth', 'prosecco', 'champagne', 'wine vinegar', 'balsamic vinegar', 'dried apricot', 'dried fruit'], eu: ['sulphites'], us: [], note: `usually sulphited above 10 mg/L; ${CHECK}` },
  // Lupin (item 13).
  { keywords: ['lupin', 'lupini', 'lupin flour'], eu: ['lupin'], us: [] },
]

function copy(g: { readonly eu: readonly EuAllergenId[]; readonly us: readonly UsAllergenId[] }) {
  return { eu: [...g.eu], us: [...g.us] }
}
