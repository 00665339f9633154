// The demo studio's dishes and shop prices. Invented for Hobline: the recipes, the shop and every
// price. Ingredient lines are written as a cook writes them and read with the app's own parser.
import type { CautionId } from '../../shared/utils/cautions'
import type { RecipeStation } from '../../shared/types/recipe'
import type { DemoPhotoName } from './demo-photos'

export interface DemoStep {
  /** Short name for the step's timer and cues. */
  name?: string
  text: string
  script?: string[]
  handsOn: boolean
  minutes?: [number, number]
  station?: RecipeStation
  after?: number[]
  links?: { step: number; kind: 'start-start' | 'finish-together'; lag: number }[]
  shot?: string
  note?: string
  cautions?: CautionId[]
}

export interface DemoRecipe {
  title: string
  summary: string
  servings: number
  /** Start to finish in minutes, as the recipe card states it. */
  totalMinutes: number
  tags: string[]
  photo: DemoPhotoName
  /** Ingredient lines, each with the demo price it is costed with (every line has one: the demo's cost is complete). */
  lines: [string, string][]
  steps: DemoStep[]
}

// [item, package size, unit ('each' for pieces), price in pence, shop]
export const demoPrices: [string, number, string, number, string][] = [
  ['Olive oil', 500, 'ml', 450, 'Marrow Lane Grocer'],
  ['Onions', 3, 'each', 60, 'Marrow Lane Grocer'],
  ['Garlic', 12, 'clove', 45, 'Marrow Lane Grocer'],
  ['Chopped tomatoes', 400, 'g', 55, 'Tallow Yard Pantry'],
  ['Butter beans', 1, 'can', 70, 'Tallow Yard Pantry'],
  ['Smoked paprika', 40, 'g', 125, 'Tallow Yard Pantry'],
  ['Vegetable stock', 1, 'l', 110, 'Tallow Yard Pantry'],
  ['Parsley', 1, 'bunch', 75, 'Marrow Lane Grocer'],
  ['Self-raising flour', 1.5, 'kg', 110, 'Tallow Yard Pantry'],
  ['Plain yoghurt', 500, 'g', 135, 'Tallow Yard Pantry'],
  ['Mint', 1, 'bunch', 75, 'Marrow Lane Grocer'],
  ['Butternut squash', 1, 'each', 120, 'Marrow Lane Grocer'],
  ['Green lentils', 500, 'g', 160, 'Tallow Yard Pantry'],
  ['Tahini', 300, 'g', 275, 'Tallow Yard Pantry'],
  ['Lemons', 1, 'each', 30, 'Marrow Lane Grocer'],
  ['Sea salt', 500, 'g', 65, 'Tallow Yard Pantry'],
]

export const demoRecipes: DemoRecipe[] = [
  {
    title: 'Smoky butter bean and tomato stew',
    totalMinutes: 45,
    summary: 'A one-pot stew for a cold evening: soft onions, smoked paprika and creamy beans.',
    servings: 4,
    tags: ['one-pot', 'vegan', 'budget'],
    photo: 'stew',
    lines: [
      ['2 tbsp olive oil', 'Olive oil'],
      ['1 onion, finely chopped', 'Onions'],
      ['3 cloves garlic, sliced', 'Garlic'],
      ['1 tsp (2 g) smoked paprika', 'Smoked paprika'],
      ['800 g chopped tomatoes', 'Chopped tomatoes'],
      ['2 cans butter beans, drained', 'Butter beans'],
      ['500 ml vegetable stock', 'Vegetable stock'],
      ['1 bunch parsley, chopped (optional)', 'Parsley'],
      ['1 tsp salt, or to taste', 'Sea salt'],
    ],
    steps: [
      { text: 'Chop {{onion|item}} finely and slice the garlic.', script: ['Start with the onion: small and even, so it softens at the same rate.'], handsOn: true, minutes: [4, 5], station: 'counter', shot: 'Overhead on the board', cautions: ['knife'] },
      { text: 'Warm {{olive-oil|item}} in a wide pan and soften the onion.', script: ['Low and slow here — we want it sweet, not brown.'], handsOn: true, minutes: [8, 10], station: 'burner', after: [1], shot: 'Side angle on the pan', cautions: ['hot-oil'] },
      { text: 'Stir in the garlic and {{smoked-paprika|item}} for a minute.', handsOn: true, minutes: [1, 2], station: 'burner', after: [2], shot: 'Close on the pan', note: 'Catch the colour change' },
      { text: 'Add the tomatoes, beans and {{vegetable-stock|item}}; bring to a simmer.', script: ['Everything else goes in now, and the pot does the work.'], handsOn: true, minutes: [3, 4], station: 'burner', after: [3], shot: 'Wide on the hob', cautions: ['boiling'] },
      { name: 'Stew simmer', text: 'Simmer, stirring now and then, until thick.', handsOn: false, minutes: [20, 25], station: 'burner', after: [4], shot: 'Locked-off on the pot' },
      { text: 'Season with salt and scatter the parsley.', script: ['Taste first, then salt. Parsley if you have it — it costs a little extra.'], handsOn: true, minutes: [2, 2], after: [5], shot: 'Hero shot of the bowl' },
    ],
  },
  {
    title: 'Pan flatbreads with mint yoghurt',
    totalMinutes: 35,
    summary: 'Two-ingredient dough rested while the yoghurt is mixed, cooked in a dry pan.',
    servings: 4,
    tags: ['bread', 'vegetarian', 'quick'],
    photo: 'flatbreads',
    lines: [
      ['250 g self-raising flour', 'Self-raising flour'],
      ['350 g plain yoghurt', 'Plain yoghurt'],
      ['1 bunch mint, leaves picked', 'Mint'],
      ['¼ tsp salt', 'Sea salt'],
    ],
    steps: [
      { text: 'Mix {{self-raising-flour|item}} with {{plain-yoghurt*5/7|item}} and the salt into a soft dough.', script: ['Just two things in the bowl: flour and yoghurt.'], handsOn: true, minutes: [4, 5], station: 'counter', shot: 'Overhead on the bowl', cautions: ['allergen'] },
      { name: 'Dough rest', text: 'Cover and rest the dough.', handsOn: false, minutes: [15, 20], after: [1], shot: 'Quick insert of the covered bowl' },
      // Made while the dough rests: starts together with the rest instead of after it.
      { text: 'Chop the mint and stir it into the rest of the yoghurt.', script: ['While the dough rests, the dip.'], handsOn: true, minutes: [3, 4], station: 'counter',
        links: [{ step: 2, kind: 'start-start', lag: 0 }], shot: 'Close on the knife', cautions: ['knife', 'allergen'] },
      { text: 'Divide and roll the dough into six rounds.', handsOn: true, minutes: [5, 6], station: 'counter', after: [2], shot: 'Hands on the board' },
      { text: 'Cook each round in a hot dry pan until puffed and spotted.', script: ['Watch for the bubbles — that is when you flip.'], handsOn: true, minutes: [10, 12], station: 'burner', after: [4], shot: 'Side angle on the pan', cautions: ['hot-pan'] },
    ],
  },
  {
    title: 'Roast squash with lentils and tahini',
    totalMinutes: 55,
    summary: 'Oven-roasted squash on lemony lentils with a loose tahini sauce.',
    servings: 4,
    tags: ['oven', 'vegan'],
    photo: 'squash',
    lines: [
      ['1 butternut squash, peeled and cut into chunks', 'Butternut squash'],
      ['3 tbsp olive oil', 'Olive oil'],
      ['200 g green lentils, rinsed', 'Green lentils'],
      ['3 tbsp (45 g) tahini', 'Tahini'],
      ['1 lemon, juiced', 'Lemons'],
      ['1 tsp salt, or to taste', 'Sea salt'],
    ],
    steps: [
      { text: 'Heat the oven to 200 °C. Peel and cut the squash into chunks.', script: ['A heavy knife and a flat side down — squash likes to roll.'], handsOn: true, minutes: [8, 10], station: 'counter', shot: 'Overhead on the board', cautions: ['knife'] },
      { name: 'Squash roast', text: 'Toss the squash with {{olive-oil*2/3|item}} and roast until soft and browned.', handsOn: false, minutes: [35, 40], station: 'oven', after: [1], shot: 'Tray into the oven', cautions: ['oven'] },
      { name: 'Lentil simmer', text: 'Simmer {{green-lentils|item}} in plenty of water until just tender.', handsOn: false, minutes: [20, 25], station: 'burner', after: [1], shot: 'Locked-off on the pot', cautions: ['boiling'] },
      // Whisked in the last five minutes of the roast, so sauce and squash are ready together.
      { text: 'Whisk {{tahini|item}} with the lemon juice and cold water to a pourable sauce.', script: ['It seizes first, then loosens — keep whisking.'], handsOn: true, minutes: [3, 4], station: 'counter', links: [{ step: 2, kind: 'finish-together', lag: 300 }], shot: 'Close on the whisk', cautions: ['allergen'] },
      { text: 'Drain the lentils, dress with the rest of the oil and salt, and top with squash and sauce.', script: ['Lentils down, squash on top, sauce over everything.'], handsOn: true, minutes: [3, 4], after: [2, 3, 4], shot: 'Hero shot of the plate', cautions: ['boiling'] },
    ],
  },
]

export const demoEpisode = { title: 'Thursday supper special' }
