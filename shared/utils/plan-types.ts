// Shapes of the cook plan (shared/utils/plan.ts): what goes in, what comes out, and the one error it throws.
// Times are seconds from the start of the cook; inside the scheduler they are kept to the millisecond.

export type PlanStation = 'burner' | 'oven' | 'counter'

/**
 * How a step waits for an earlier one (`from`):
 * - `finish-start` (the default): it starts `lag` seconds (default 0) after `from` finishes;
 * - `start-start`: it starts `lag` seconds (default 0) after `from` starts;
 * - `finish-together`: it goes in `lag` seconds before `from` finishes, its lead (default: its own
 *   duration, so both finish at the same moment): the eggs go into the simmering sauce for its last
 *   six minutes. The lead must be at least the step's own duration (it may not outlast `from`) and at
 *   most the duration of `from` (it may not start before `from` has begun).
 */
export type PlanLinkKind = 'finish-start' | 'start-start' | 'finish-together'

export interface PlanLink {
  from: string
  kind?: PlanLinkKind
  /** Seconds, never negative; for `finish-together` the lead. */
  lag?: number
}

export interface PlanStep {
  id: string
  /** Planned duration in seconds (the planned value of the step's range). */
  duration: number
  /** Hands-on steps hold a cook's hands; unattended steps hold only their station. */
  handsOn: boolean
  station?: PlanStation | null
  /** Finish-to-start links with no lag, the short form of `links`. */
  after?: string[]
  links?: PlanLink[]
  /** Which recipe the step belongs to: used for cues and for kitchens that cook one recipe at a time. */
  recipe?: string
  /** What the cook reads in cues; the id when absent. */
  label?: string
}

export interface PlanKitchen {
  /** Cooks' hands, one lane per cook (default 1). */
  hands?: number
  /** Default 4. */
  burners?: number
  /** Default 1. */
  ovens?: number
  /**
   * Dishes one oven takes at once (default 1: two dishes share an oven only when they want the same
   * temperature, which the plan does not know; common practice).
   */
  racksPerOven?: number
  /** Counter places; unlimited when absent. */
  counters?: number
  /** Whether two recipes may cook at once (default true); when false, each recipe's steps run in one span. */
  parallelRecipes?: boolean
}

/** A studio's kitchen as it is saved and edited: every figure set, counters unlimited. */
export type KitchenProfile = Required<Pick<PlanKitchen, 'hands' | 'burners' | 'ovens' | 'racksPerOven' | 'parallelRecipes'>>

/** A new studio's kitchen: one cook, four burners, one oven taking one dish, recipes side by side. */
export const DEFAULT_KITCHEN: Readonly<KitchenProfile> = { hands: 1, burners: 4, ovens: 1, racksPerOven: 1, parallelRecipes: true }

export interface PlanInput {
  steps: PlanStep[]
  kitchen?: PlanKitchen
}

export interface PlannedStep {
  id: string
  start: number
  end: number
  /** The lane drawn for the step: its station (`burner-2`), else its cook (`hands-1`), else `aside-n`. */
  lane: string
  /** The cook whose hands the step holds (`hands-1`), null for unattended steps. */
  handsLane: string | null
  /** For oven steps: which rack of the oven (1…racksPerOven); null otherwise. */
  rack: number | null
  /** Critical path method, ignoring capacity: latest start − earliest start. */
  slack: number
  /** Slack is zero. */
  critical: boolean
  earliestStart: number
  latestStart: number
}

/** "Start the unattended step now, while you are on this hands-on step" — for the prompter. */
export interface PlanCue {
  stepId: string
  at: number
  endsAt: number
  /** The hands-on step under way at that moment, null when the cook's hands are free. */
  during: string | null
  text: string
}

/** Lower bounds on any feasible plan, in seconds, beside the plan's own length. */
export interface PlanBounds {
  /** Critical path length, ignoring capacity. */
  criticalPath: number
  /** Total hands-on work ÷ hands. */
  handsOn: number
  /** Total burner time ÷ burners, oven time ÷ oven places, counter time ÷ counters (0 when unlimited). */
  burners: number
  ovens: number
  counters: number
  /** The largest of the bounds above. */
  lower: number
  /** (makespan − lower) ÷ lower, 0 when lower is 0. */
  gap: number
}

export interface PlanResult {
  makespan: number
  /** In the order of the input. */
  steps: PlannedStep[]
  lanes: string[]
  bounds: PlanBounds
  /** One chain of critical steps from the start to the end of the cook (critical path method). */
  criticalPath: string[]
  /** One cue per unattended step, in time order. */
  cues: PlanCue[]
  /** The priority rule (and pass) that gave this plan. */
  rule: string
}

export type PlanErrorCode = 'cycle' | 'missing-station' | 'impossible-lag' | 'bad-input'

export class PlanError extends Error {
  readonly code: PlanErrorCode
  readonly stepIds: string[]
  constructor(code: PlanErrorCode, message: string, stepIds: string[] = []) {
    super(message)
    this.name = 'PlanError'
    this.code = code
    this.stepIds = stepIds
  }
}

/** What has happened so far in the shoot, for a re-plan (plan-replan.ts). Times in seconds from the start of the cook. */
export interface PlanProgress {
  /** The present on the shoot clock. */
  now: number
  /** Steps finished, with their real start and end. */
  done?: Record<string, { start: number; end: number }>
  /** Steps under way: their real start, and the end they are due at (a timer's deadline). */
  running?: Record<string, { start: number; end: number }>
  /** The plan being followed; its start times order the re-plan, so that it stays close. */
  previous?: { steps: Array<Pick<PlannedStep, 'id' | 'start'>> } | null
}

/** A step of a re-plan: where it is now, as a first plan gives it, and how far along it is. */
export interface ReplannedStep extends Pick<PlannedStep, 'id' | 'start' | 'end' | 'lane' | 'handsLane' | 'rack'> {
  state: 'done' | 'running' | 'pending'
  /** Start − its start in the previous plan, seconds (positive: later); null without a previous plan or step. */
  moved: number | null
}

/**
 * A hands-on step that falls due when a timer ends (the end of an unattended step it waits for) but
 * starts later because every cook's hands are then held: the food waits.
 */
export interface PlanCollision {
  /** The hands-on step that will wait. */
  stepId: string
  /** The unattended step whose end makes it due. */
  afterId: string
  /** The hands-on step that holds the hands when it falls due (with several cooks, the one that frees first). */
  heldBy: string
  /** When its links let it start (the present, if that moment has passed). */
  due: number
  /** When the re-plan starts it. */
  start: number
  /** start − due, seconds. */
  wait: number
  text: string
}

export interface ReplanResult {
  now: number
  /** The projected finish of the cook. */
  makespan: number
  /** In the order of the input. */
  steps: ReplannedStep[]
  lanes: string[]
  /** Cues for the unattended steps not yet started, in time order. */
  cues: PlanCue[]
  /** In order of when they fall due. */
  collisions: PlanCollision[]
  /** Running steps past their deadline: taken as still under way, ending now. */
  overdue: string[]
  /** The order that gave this re-plan: the plan being followed, or a priority rule. */
  rule: string
}
