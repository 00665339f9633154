// The words a refusal uses for a field: the label the form shows beside the input, never the
// request's own key. A zod path such as ['steps', 2, 'durationMin'] reads "Step 3, shortest time":
// list entries count from 1, as a person counts. `field` in the JSON error keeps the key (a program
// places the message by it); only the human text uses these words. DEVELOPERS.md, "Errors".

/** A list whose entries are named one by one: ['steps', 2] → "Step 3". */
const ENTRY_NOUNS: Record<string, string> = {
  steps: 'Step',
  ingredients: 'Ingredient',
  tags: 'Tag',
  script: 'script line',
  links: 'link',
  recipeIds: 'Recipe',
  after: 'step waited for',
  cautions: 'caution',
  eu: 'EU allergen',
  us: 'US allergen',
  readFromText: 'read-from-text entry',
  segments: 'Segment',
  closing: 'closing line',
  crewCalls: 'Crew call',
}

/** Top-level fields, as the forms label them (sign-up, settings, prices, episodes, the plan's kitchen, join codes). */
const TOP: Record<string, string> = {
  // Accounts and crew
  name: 'Your name',
  email: 'E-mail address',
  password: 'Password',
  studioName: 'Studio name',
  role: 'Role',
  code: 'Join code',
  minutes: 'How long the code lasts',
  studioId: 'Studio',
  // Recipes
  title: 'Title',
  summary: 'Summary',
  servings: 'Servings',
  yieldText: 'Yield as stated',
  tags: 'Tags',
  notes: 'Notes',
  times: 'Times',
  ingredients: 'Ingredients',
  steps: 'Steps',
  version: 'Version',
  units: 'Units',
  // Prices
  item: 'Item',
  packageSize: 'Package size',
  packageUnit: 'Unit',
  priceMinor: 'Price',
  currency: 'Currency',
  shop: 'Shop',
  boughtOn: 'Date seen',
  file: 'File',
  // Studio settings
  locale: 'Language and country',
  timeZone: 'Time zone',
  budgetPerServingMinor: 'Budget per serving',
  cupUnit: 'What a bare “cup” means',
  unitSystem: 'Units shown by default',
  fluidMeasure: 'What a bare “pint” means',
  kitchen: 'Kitchen',
  // Episodes and the cook plan's what-if kitchen
  recipeIds: 'Recipes in run order',
  hands: 'Cooks’ hands',
  burners: 'Burners',
  ovens: 'Ovens',
  racks: 'Dishes per oven',
  parallel: 'Recipes side by side',
  mode: 'Rehearsal or recording',
  segments: 'Run order',
  // Lists and searches
  q: 'Search',
  tag: 'Tag',
  allergen: 'Contains',
  without: 'Free of',
  limit: 'How many to show',
  offset: 'Where to start',
  size: 'Photo size',
  preview: 'Preview',
  confirmed: 'Confirmed steps',
  photo: 'Photo',
  // Shoot commands and device settings (sockets)
  shootId: 'Shoot',
  type: 'Command',
  segment: 'Recipe in the run order',
  step: 'Step',
  stepRef: 'Step',
  timerId: 'Timer',
  label: 'Timer name',
  durationMs: 'Timer length',
  deltaMs: 'Time to add',
  slot: 'Timer place',
  sound: 'Alarm sound',
  rolling: 'Camera rolling',
  speed: 'Clock speed',
  markerId: 'Marker',
  kind: 'Kind of marker',
  text: 'Text',
  stepId: 'Step',
  cancelTimers: 'Cancel the timers',
  audibleWhileRolling: 'While the camera rolls',
  // The call sheet
  callTime: 'Call time',
  place: 'Place',
  hospital: 'Nearest hospital',
  slug: 'Address',
  videoUrl: 'Video address',
  crewCalls: 'Crew call times',
  hash: 'The sheet you read',
}

/** Fields inside an entry or group: ['steps', 2, 'durationMin'] → "Step 3, shortest time". */
const INNER: Record<string, Record<string, string>> = {
  steps: {
    name: 'short name', text: 'what to do', script: 'what to say on camera', handsOn: 'kind (hands-on or unattended wait)',
    durationMin: 'shortest time', durationMax: 'longest time', station: 'station', after: 'waits for',
    links: 'starts together with', step: 'step', kind: 'kind of link', lag: 'time after it',
    cameraShot: 'camera shot', cameraNote: 'camera note', cautions: 'cautions', group: 'part of', readFromText: 'read from the text',
  },
  ingredients: {
    key: 'name in the steps', min: 'amount', max: 'amount up to', unit: 'unit', item: 'item', prep: 'prep note',
    optional: 'optional', toTaste: 'to taste', group: 'group', allergens: 'allergens', eu: 'EU allergens', us: 'US allergens', allergenState: 'allergens checked',
    priceId: 'price', stated: 'amount as the recipe states it',
  },
  times: { prep: 'Prep time', cook: 'Cook time', total: 'Total time' },
  kitchen: { hands: 'Cooks’ hands', burners: 'Burners', ovens: 'Ovens', racksPerOven: 'Dishes per oven', parallelRecipes: 'Two recipes at once' },
  stepRef: { segment: 'recipe in the run order', step: 'step' },
  crewCalls: { userId: 'crew member', callTime: 'call time' },
  segments: {
    id: 'segment id', kind: 'kind of segment', title: 'title', recipeId: 'recipe', text: 'words', field: 'live field',
    ingredientKey: 'ingredient', withOptional: 'with the optional ingredients', celsius: 'oven temperature', shot: 'what to frame',
  },
}

/** Groups whose inner fields stand alone ("Prep time", not "Times, prep time"). */
const STANDALONE = new Set(['times', 'kitchen'])

/** A form's own word for a field where the same key means something else elsewhere ('name' on the studio settings). */
export type FieldLabels = Record<string, string>

/** "budgetPerServing" or "cooking_time" → "Budget per serving", "Cooking time": never a key as written. */
export function plainWords(key: string): string {
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[_\-.]+/g, ' ').trim().toLowerCase()
  return words ? words[0]!.toUpperCase() + words.slice(1) : 'This field'
}

/**
 * The label of a field for a person: a zod path, or a dotted key as `field` carries it.
 * `own` names the fields a form words its own way (the studio settings' 'name' is "Studio name").
 */
export function fieldLabel(path: readonly PropertyKey[] | string, own: FieldLabels = {}): string {
  const parts = (typeof path === 'string' ? path.split('.').filter(Boolean) : path.map(String))
    .map((p) => (/^\d+$/.test(p) ? Number(p) : p))
  if (!parts.length) return 'The request'
  const joined = parts.join('.')
  if (own[joined]) return own[joined]!
  const out: string[] = []
  let group: string | null = null
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i]!
    const prev = parts[i - 1]
    if (typeof part === 'number') {
      const noun = typeof prev === 'string' ? ENTRY_NOUNS[prev] : undefined
      // "Step 3" replaces "Steps", "script line 2" replaces "what to say on camera".
      if (noun) out[out.length - 1] = `${i === 1 ? noun : noun[0]!.toLowerCase() + noun.slice(1)} ${part + 1}`.replace(/^eU|^uS/, (m) => m.toUpperCase())
      else out.push(`entry ${part + 1}`)
      continue
    }
    if (i === 0) {
      out.push(own[part] ?? TOP[part] ?? plainWords(part))
      group = part
      continue
    }
    const inner = (group && INNER[group]?.[part]) ?? plainWords(part).toLowerCase()
    if (group && STANDALONE.has(group) && i === 1) out[0] = INNER[group]?.[part] ?? plainWords(part)
    else out.push(inner)
  }
  return out.join(', ')
}

/** "Label: what to write." — the one way a refusal names the field it is about. */
export function refusalText(path: readonly PropertyKey[] | string, instruction: string, own: FieldLabels = {}): string {
  return `${fieldLabel(path, own)}: ${instruction}`
}
