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

/** A step's "waits for" and links as the recipe editor keeps them: other steps named by row id. */
export interface EditorStepLinks {
  after: string[]
  links: Array<{ stepUid: string; kind: StepLinkDraft['kind']; lag: number }>
}

/** Whether the step starts together with the step before it (row id `before`). */
export function startsWithStepBefore(step: EditorStepLinks, before: string | undefined): boolean {
  return before !== undefined && step.links.some((l) => l.stepUid === before && isStartTogether(l))
}

/**
 * "Starts together with the step before", ticked: the step no longer follows the step before but
 * starts with it. Unticked: it follows the step before again, named in "waits for" as a new step
 * in the editor names it (unless it already waits for other steps the cook chose).
 */
export function setStartsWithStepBefore(step: EditorStepLinks, before: string | undefined, on: boolean): void {
  if (before === undefined) return
  step.links = step.links.filter((l) => !(l.stepUid === before && isStartTogether(l)))
  if (on) {
    step.after = step.after.filter((u) => u !== before)
    step.links.push({ stepUid: before, kind: 'start-start', lag: 0 })
  } else if (!step.after.length) {
    step.after = [before]
  }
}
