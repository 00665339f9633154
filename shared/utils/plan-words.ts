// The cook plan's words, in a crew's language rather than a scheduling textbook's. The plan's maths
// (plan-cpm.ts, plan-types.ts) keeps its own names in code; every screen that shows the plan says
// these instead, one name each.
export const PLAN_WORDS = {
  /** Steps with no spare time: any delay in one delays the end of the cook. */
  setsFinish: 'Sets the finish time',
  setsFinishList: 'Steps that set the finish time',
  setsFinishHint: 'a delay here delays the whole cook',
  /** How much later a step can start without delaying the end of the cook. */
  spare: 'Spare time',
  /** The length no plan for this kitchen can beat. */
  shortest: 'Shortest possible',
  /** The kitchen switch: cook several recipes in the same stretch of time, or one after another. */
  sideBySide: 'Recipes side by side',
  oneAtATime: 'one recipe at a time',
  dishesPerOven: 'Dishes per oven',
  dishesPerOvenHint: 'Dishes one oven holds at once, at one temperature',
} as const

/** "4 min to spare" or the words for a step that sets the finish time. */
export function spareText(critical: boolean, spare: string): string {
  return critical ? `${PLAN_WORDS.setsFinish.toLowerCase()}: ${PLAN_WORDS.setsFinishHint}` : `${spare} to spare`
}
