// The demo episode as a show: an intro with the budget premise and where the prices come from, the
// three recipes each closing on its cost per serving (live fields, so the figure said on camera is
// the data's), a sponsor read for an invented sponsor, and a sign-off. Every name here is invented.
import type { ScriptPiece, ShowSegment } from '../../shared/utils/show-segments'

/** The episode's settings: shot on a Thursday for four, within the studio's £1.50 a serving, for a 75-minute shoot. */
export const demoShowSettings = { shootDate: '2026-12-10', servings: 4, budgetPerServingMinor: null, targetSeconds: 75 * 60 }

/**
 * The call sheet: the crew is called at 08:30 at an invented address; the nearest hospital is left
 * for the producer to fill in (the sheet prints an empty line for it), as a real one must be looked up.
 */
export const demoCallSheet = { callTime: '08:30', place: 'Brackenford Test Kitchen, 4 Saltmarsh Yard, Brackenford (invented)', hospital: null, crewCalls: [], version: 1 }

/** The host's reading pace on camera (words a minute): a little quicker than the 150 default. */
export const DEMO_HOST_WPM = 160

const say = (text: string): ScriptPiece => ({ text })

/** The run order, given the demo recipes' ids in the order of demoRecipes (stew, flatbreads, squash). */
export function demoShow([stew, breads, squash]: number[]): ShowSegment[] {
  const cost = (recipeId: number, withOptional = false): ScriptPiece => ({ field: { kind: 'cost', recipeId, withOptional } })
  return [
    {
      id: 'intro', kind: 'intro', title: 'Welcome',
      script: [
        say('Welcome to Thursday supper at Brackenford. Tonight: three dinners, each for '), { field: { kind: 'servings' } },
        say(', each under £1.50 a serving. Every price you hear tonight is what we paid at Marrow Lane Grocer and Tallow Yard Pantry, '
          + 'and the figures come straight from our shopping list.'),
      ],
    },
    {
      id: 'stew', kind: 'recipe', recipeId: stew!, title: 'Smoky butter bean and tomato stew',
      script: [say('First, a smoky stew that does nearly all of its work in one pot.')],
      closing: [say('That is the stew: '), cost(stew!), say(' a serving, or '), cost(stew!, true), say(' with the parsley.')],
    },
    {
      id: 'breads', kind: 'recipe', recipeId: breads!, title: 'Pan flatbreads with mint yoghurt',
      script: [say('While the stew simmers: flatbreads from just two things in a bowl, '), { field: { kind: 'amount', recipeId: breads!, ingredientKey: 'self-raising-flour' } }, say(' of flour and the yoghurt.')],
      closing: [say('Flatbreads and the mint dip come to '), cost(breads!), say(' a serving.')],
    },
    {
      id: 'sponsor', kind: 'sponsor', title: 'A word from Kettlebrook Pans',
      script: [say('Tonight’s supper is cooked in pans from Kettlebrook, a small foundry that casts heavy pans which hold their heat. '
        + 'Find them through the link in the description.')],
    },
    {
      id: 'squash', kind: 'recipe', recipeId: squash!, title: 'Roast squash with lentils and tahini',
      script: [say('Last, the oven does the work. It goes to '), { field: { kind: 'oven', celsius: 200 } }, say(' while we cut the squash.')],
      closing: [say('Squash, lentils and tahini: '), cost(squash!), say(' a serving.')],
    },
    {
      id: 'outro', kind: 'outro', title: 'Sign-off',
      script: [say('Three dinners for '), { field: { kind: 'servings' } }, say(', each within our budget of '), { field: { kind: 'budget' } },
        say(' a serving. The recipes and the shopping list are in the description. See you next Thursday.')],
    },
  ]
}
