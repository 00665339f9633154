// The live shoot: its state, the commands that change it and their zod schema. The server applies
// commands with applyShootCommand (shared/utils/shoot-reducer.ts) and broadcasts the result; the
// screens apply the same commands for optimistic feedback. Times on the server clock are epoch ms
// ("serverMs"); times on the shoot clock are ms from the start of the shoot ("shootMs").
import type { z } from 'zod'
import type { shootCommandSchema } from '../utils/shoot-schema'
import type { PlanKitchen, PlanStep } from '../utils/plan-types'

export type ShootRole = 'producer' | 'host' | 'camera' | 'viewer'
export type ShootMode = 'rehearsal' | 'take'
export type ShootStatus = 'ready' | 'running' | 'paused' | 'ended'

/**
 * One segment of the run order as the server passes it in: its id and its step ids in order. A
 * segment without steps (a sponsor read, the intro) is one position of the cursor, stepId null.
 */
export interface ShootSegment {
  id: string
  title?: string
  stepIds: string[]
}

/** A position in the run order, by index: segment i, step j within it. */
export interface ShootCursor {
  segment: number
  step: number
}

/** A position with the ids it stands for, so references survive a later change of run order. */
export interface ShootStepRef extends ShootCursor {
  segmentId: string
  stepId: string | null
}

/**
 * The shoot clock: shootMs = anchorShootMs + (serverMs − anchorServerMs) × speed while running,
 * anchorShootMs while stopped. Speed is 1 in a take and 1–32 in a rehearsal.
 */
export interface ShootClock {
  anchorServerMs: number
  anchorShootMs: number
  speed: number
  running: boolean
}

export interface ShootActor {
  role: ShootRole
  id: string
  name?: string
}

export type ShootTimerState = 'running' | 'paused' | 'due' | 'acknowledged' | 'cancelled'

/**
 * A kitchen timer. Durations and remainders are kitchen time (shoot clock); a running timer is an
 * absolute deadline on the server clock, reached at `speed` × real time, never a ticking counter.
 */
export interface ShootTimer {
  id: string
  /** 0 … SHOOT_TIMER_SLOTS − 1, distinct among live timers, so each can ring its own sound. */
  slot: number
  label: string
  /** A named alarm sound, or null for the slot's own sound. */
  sound: string | null
  stepRef: ShootStepRef
  /** The time set, with any time added or taken off since. */
  durationMs: number
  /** Server-clock deadline while running; while due, the moment it was due; null while paused. */
  deadlineServerMs: number | null
  /** Kitchen time left while paused; null otherwise. */
  remainingMs: number | null
  /** Kitchen ms per server ms while running: the clock speed it runs at. */
  speed: number
  state: ShootTimerState
  /** Paused because the rehearsal clock stopped: it runs again when the rehearsal does. */
  heldByShoot: boolean
  startedAtServerMs: number
  startedBy: ShootActor
  dueAtServerMs: number | null
  acknowledgedBy: ShootActor | null
  acknowledgedAtServerMs: number | null
  cancelledAtServerMs: number | null
  /** 'step': started by reaching a wait of the cook plan (one per step); 'free': set by hand. Absent on old shoots: free. */
  origin?: 'step' | 'free'
  /** Kitchen time left when the "check it" signal comes (the short end of the step's range); null for none. */
  checkLeftMs?: number | null
  /** Shoot clock when it started, and when it was acknowledged or cancelled (for the live plan). */
  startedAtShootMs?: number
  closedAtShootMs?: number | null
}

/** The kinds a person marks; a chapter is marked by the shoot itself at every step change while rolling. */
export const SHOOT_MARKER_KINDS = ['good', 'flub', 'pickup', 'note'] as const
export type HandMarkerKind = (typeof SHOOT_MARKER_KINDS)[number]
export type ShootMarkerKind = HandMarkerKind | 'chapter'

export interface ShootMarker {
  id: string
  kind: ShootMarkerKind
  text: string | null
  shootMs: number
  serverMs: number
  stepRef: ShootStepRef
  by: ShootActor
  /** When the camera started rolling, if it was rolling: the take's timecode counts from here. */
  rollingSinceServerMs: number | null
  /**
   * Recording time when marked (ms of recording since the camera first rolled in this shoot, the
   * rolls before added up, as record-run timecode counts); null when the camera was not rolling.
   * Absent on markers made before it was kept: see markerRecordingMs in take-log.ts.
   */
  recordingMs?: number | null
}

/** The cursor arriving at a step, for planned vs. actual. */
export interface ShootStepVisit {
  stepRef: ShootStepRef
  enteredServerMs: number
  enteredShootMs: number
}

/** A step of the shoot's cook plan: the planner's input (seconds) and what a timer born from it is called. */
export interface ShootPlanStep extends PlanStep {
  recipeTitle: string
  /** The step's short name ("Pasta water"), or null. */
  name: string | null
  /** The step's written range, ms: a wait with a time gets a timer of maxMs, checked at minMs; null without a time. */
  minMs: number | null
  maxMs: number | null
}

/** Where the run order came from: the cook plan, or the recipes in their written order and why. */
export type ShootPlanSource =
  | { kind: 'plan'; sideBySide: boolean }
  | { kind: 'recipe-order'; reason: string; stepIds: string[] }

/** A step of the live plan, ms on the shoot clock. */
export interface ShootLiveStep {
  startMs: number
  endMs: number
  lane: string
  handsLane: string | null
  state: 'done' | 'running' | 'pending'
  /** How far its start moved since the plan before, ms (positive: later). */
  movedMs: number | null
}

/** A hands-on step that will wait because the cook's hands are held when a timer ends. */
export interface ShootCollision {
  stepId: string
  afterId: string
  heldBy: string
  dueMs: number
  startMs: number
  waitMs: number
  text: string
}

/** A wait to start while other work goes on, from the live plan. */
export interface ShootCue {
  stepId: string
  atMs: number
  endsAtMs: number
  during: string | null
  text: string
}

/** The cook plan as it stands now: computed again from the present after every change. */
export interface ShootLivePlan {
  /** The shoot clock when it was computed. */
  atShootMs: number
  /** The projected finish. */
  makespanMs: number
  steps: Record<string, ShootLiveStep>
  lanes: string[]
  cues: ShootCue[]
  collisions: ShootCollision[]
  /** Steps past their planned end, taken as ending now. */
  overdue: string[]
}

export interface ShootPlan {
  source: ShootPlanSource
  kitchen: PlanKitchen
  steps: ShootPlanStep[]
  /** The plan the shoot began with (planned vs projected); null when the episode could not be planned. */
  first: { makespanMs: number; steps: Record<string, { startMs: number; endMs: number; lane: string }> } | null
  live: ShootLivePlan | null
}

export interface ShootState {
  id: string
  mode: ShootMode
  status: ShootStatus
  runOrder: ShootSegment[]
  cursor: ShootCursor
  /** Raised by one for every applied command and every tick that marks timers due. */
  seq: number
  clock: ShootClock
  rolling: boolean
  rollingSinceServerMs: number | null
  rollingSinceShootMs: number | null
  /** Recording time of the rolls that have ended (ms); the current roll adds to it. Absent on old shoots: 0. */
  recordedMs?: number
  timers: ShootTimer[]
  markers: ShootMarker[]
  visits: ShootStepVisit[]
  startedAtServerMs: number | null
  endedAtServerMs: number | null
  /** The cook plan the shoot runs (absent on shoots made before plans were run live). */
  plan?: ShootPlan | null
}

// Limits: the zod schema (shared/utils/shoot-schema.ts) checks the shape of a command; the reducer
// checks it against state.
export const SHOOT_TIMER_SLOTS = 8
export const SHOOT_TIMER_LIMIT = 200
export const SHOOT_MARKER_LIMIT = 5000
export const SHOOT_TIMER_LABEL_MAX = 80
export const SHOOT_MARKER_TEXT_MAX = 200
export const SHOOT_TIMER_MIN_MS = 1000
export const SHOOT_TIMER_MAX_MS = 24 * 3600_000
export const SHOOT_ADD_TIME_MAX_MS = 2 * 3600_000
export const SHOOT_SPEED_MIN = 1
export const SHOOT_SPEED_MAX = 32

export type ShootCommand = z.infer<typeof shootCommandSchema>
export type ShootCommandType = ShootCommand['type']
export type ShootCommandOf<T extends ShootCommandType> = Extract<ShootCommand, { type: T }>

export const SHOOT_COMMAND_TYPES: readonly ShootCommandType[] = [
  'shoot.start', 'shoot.pause', 'shoot.resume', 'shoot.end',
  'step.next', 'step.previous', 'step.jump',
  'timer.start', 'timer.pause', 'timer.resume', 'timer.addTime', 'timer.cancel', 'timer.acknowledge',
  'rolling.set', 'clock.speed', 'marker.add', 'wait.start',
]

export type ShootErrorCode =
  | 'invalid' // the command's shape (a field is named in the message)
  | 'forbidden' // the sender's role may not send it
  | 'shoot-ended'
  | 'not-started'
  | 'already-started'
  | 'not-running'
  | 'not-paused'
  | 'no-change'
  | 'at-last-step'
  | 'at-first-step'
  | 'no-such-step'
  | 'take-mode'
  | 'rehearsal-stopped'
  | 'unknown-timer'
  | 'timer-closed'
  | 'timer-not-running'
  | 'timer-not-paused'
  | 'timer-not-due'
  | 'timer-due'
  | 'timers-active'
  | 'slot-taken'
  | 'too-many-timers'
  | 'too-many-markers'
  | 'duplicate-id'
  | 'no-id'

export interface ShootCommandError {
  code: ShootErrorCode
  message: string
  /** The field at fault, for 'invalid'. */
  field?: string
}

/** What happened, for the server to broadcast or log and for screens to react to (alarms). */
export type ShootEvent =
  | { type: 'shoot.status'; status: ShootStatus; atServerMs: number; shootMs: number }
  | { type: 'step.entered'; stepRef: ShootStepRef; atServerMs: number; shootMs: number }
  | { type: 'timer.changed'; timerId: string; state: ShootTimerState }
  | { type: 'timer.due'; timerId: string; label: string; slot: number; sound: string | null; dueAtServerMs: number }
  | { type: 'rolling.changed'; rolling: boolean; atServerMs: number }
  | { type: 'clock.changed'; speed: number; atServerMs: number }
  | { type: 'marker.added'; markerId: string; kind: ShootMarkerKind }

export type ShootApplyResult =
  | { ok: true; state: ShootState; events: ShootEvent[] }
  | { ok: false; error: ShootCommandError }

export interface ShootCommandContext {
  /** The server clock now (on a screen: serverNow(local now, offset)). */
  nowServerMs: number
  actor: ShootActor
  /** Makes ids for new timers and markers when the command brings none. */
  newId?: () => string
}
