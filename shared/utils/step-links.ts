// "Starts together with the step before": the one link between steps a cook can set without
// knowing link kinds ("while the water heats, chop the onion"). Underneath it is a start-start link
// with no lag from the step before (plan-types.ts PlanLink). A step that names no earlier step and
// no link follows the step before it (server/utils/cook-plan.ts), so the link replaces that default.
import type { StepLinkDraft } from '../types/recipe'

/**
 * Step text that says it runs alongside the step before: "While the pasta cooks, …", "Meanwhile, …",
 * "In the meantime …", "At the same time …" (also "whilst", "meantime"), at the very start only.
 */
const ALONGSIDE_OPENING = /^[\s"“'‘(]*(?:meanwhile|meantime|in the meantime|at the same time|whil(?:e|st))\b/i

export function readsAsAlongside(text: string): boolean {
  return ALONGSIDE_OPENING.test(text)
}

/** The link that starts a step together with the step at `position` (the step before it). */
export function startTogetherLink(position: number): StepLinkDraft {
  return { step: position, kind: 'start-start', lag: 0 }
}

/** Whether a link is the start-together kind (start-start, no lag); the caller checks which step it names. */
export function isStartTogether(link: { kind: string; lag: number }): boolean {
  return link.kind === 'start-start' && link.lag === 0
}
