// The live shoot: its state, the commands that change it and their zod schema. The server applies
// commands with applyShootCommand (shared/utils/shoot-reducer.ts) and broadcasts the result; the
// screens apply the same commands for optimistic feedback. Times on the server clock are epoch ms
// ("serverMs"); times on the shoot clock are ms from the start of the shoot ("shootMs").
import { z } from 'zod'

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
 * anchorShootMs while stopped. Speed is 1 in a take and 1–8 in a rehearsal.
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
}

export const SHOOT_MARKER_KINDS = ['good', 'flub', 'pickup', 'note'] as const
export type ShootMarkerKind = (typeof SHOOT_MARKER_KINDS)[number]

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
}

/** The cursor arriving at a step, for planned vs. actual. */
export interface ShootStepVisit {
  stepRef: ShootStepRef
  enteredServerMs: number
  enteredShootMs: number
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
  timers: ShootTimer[]
  markers: ShootMarker[]
  visits: ShootStepVisit[]
  startedAtServerMs: number | null
  endedAtServerMs: number | null
}

// Limits: the zod schema below checks the shape of a command; the reducer checks it against state.
export const SHOOT_TIMER_SLOTS = 8
export const SHOOT_TIMER_LIMIT = 200
export const SHOOT_MARKER_LIMIT = 5000
export const SHOOT_TIMER_LABEL_MAX = 80
export const SHOOT_MARKER_TEXT_MAX = 200
export const SHOOT_TIMER_MIN_MS = 1000
export const SHOOT_TIMER_MAX_MS = 24 * 3600_000
export const SHOOT_ADD_TIME_MAX_MS = 2 * 3600_000
export const SHOOT_SPEED_MIN = 1
export const SHOOT_SPEED_MAX = 8

const shootIdSchema = (field: string) =>
  z.string({ error: `${field} must be text` }).regex(/^[A-Za-z0-9_-]{1,64}$/, {
    error: `${field} must be 1–64 letters, digits, '-' or '_'`,
  })
const indexSchema = (field: string) =>
  z.number({ error: `${field} must be a number` }).int({ error: `${field} must be a whole number` })
    .min(0, { error: `${field} counts from 0` }).max(9999, { error: `${field} is at most 9999` })
const cursorSchema = z.object({ segment: indexSchema('segment'), step: indexSchema('step') })
const empty = <T extends string>(type: T) => z.object({ type: z.literal(type) })

export const shootCommandSchema = z.discriminatedUnion('type', [
  empty('shoot.start'),
  empty('shoot.pause'),
  empty('shoot.resume'),
  z.object({ type: z.literal('shoot.end'), cancelTimers: z.boolean({ error: 'cancelTimers must be true or false' }).optional() }),
  empty('step.next'),
  empty('step.previous'),
  z.object({ type: z.literal('step.jump'), segment: indexSchema('segment'), step: indexSchema('step') }),
  z.object({
    type: z.literal('timer.start'),
    timerId: shootIdSchema('timerId').optional(),
    label: z.string({ error: 'label must be text' }).trim()
      .min(1, { error: 'label: name the timer (what is cooking)' })
      .max(SHOOT_TIMER_LABEL_MAX, { error: `label: at most ${SHOOT_TIMER_LABEL_MAX} characters` }),
    durationMs: z.number({ error: 'durationMs must be a number of ms' }).int({ error: 'durationMs must be whole ms' })
      .min(SHOOT_TIMER_MIN_MS, { error: 'durationMs: a timer runs at least 1 second' })
      .max(SHOOT_TIMER_MAX_MS, { error: 'durationMs: a timer runs at most 24 hours' }),
    slot: z.number({ error: 'slot must be a number' }).int({ error: 'slot must be a whole number' })
      .min(0, { error: 'slot counts from 0' }).max(SHOOT_TIMER_SLOTS - 1, { error: `slot is at most ${SHOOT_TIMER_SLOTS - 1}` }).optional(),
    sound: z.string({ error: 'sound must be text' }).regex(/^[a-z0-9-]{1,40}$/, { error: "sound: 1–40 lower-case letters, digits or '-'" }).optional(),
    stepRef: cursorSchema.optional(),
  }),
  z.object({ type: z.literal('timer.pause'), timerId: shootIdSchema('timerId') }),
  z.object({ type: z.literal('timer.resume'), timerId: shootIdSchema('timerId') }),
  z.object({
    type: z.literal('timer.addTime'),
    timerId: shootIdSchema('timerId'),
    deltaMs: z.number({ error: 'deltaMs must be a number of ms' }).int({ error: 'deltaMs must be whole ms' })
      .min(-SHOOT_ADD_TIME_MAX_MS, { error: 'deltaMs: take off at most 2 hours at a time' })
      .max(SHOOT_ADD_TIME_MAX_MS, { error: 'deltaMs: add at most 2 hours at a time' })
      .refine((v) => v !== 0, { error: 'deltaMs: add or take off some time (not 0)' }),
  }),
  z.object({ type: z.literal('timer.cancel'), timerId: shootIdSchema('timerId') }),
  z.object({ type: z.literal('timer.acknowledge'), timerId: shootIdSchema('timerId') }),
  z.object({ type: z.literal('rolling.set'), rolling: z.boolean({ error: 'rolling must be true or false' }) }),
  z.object({
    type: z.literal('clock.speed'),
    speed: z.number({ error: 'speed must be a number' })
      .min(SHOOT_SPEED_MIN, { error: `speed: at least ${SHOOT_SPEED_MIN}× (real time)` })
      .max(SHOOT_SPEED_MAX, { error: `speed: at most ${SHOOT_SPEED_MAX}×` }),
  }),
  z.object({
    type: z.literal('marker.add'),
    markerId: shootIdSchema('markerId').optional(),
    kind: z.enum(SHOOT_MARKER_KINDS, { error: `kind must be one of ${SHOOT_MARKER_KINDS.join(', ')}` }),
    text: z.string({ error: 'text must be text' }).trim()
      .max(SHOOT_MARKER_TEXT_MAX, { error: `text: at most ${SHOOT_MARKER_TEXT_MAX} characters` }).optional(),
  }).refine((m) => m.kind !== 'note' || (m.text ?? '').length > 0, { error: 'text: a note needs its text', path: ['text'] }),
])

export type ShootCommand = z.infer<typeof shootCommandSchema>
export type ShootCommandType = ShootCommand['type']
export type ShootCommandOf<T extends ShootCommandType> = Extract<ShootCommand, { type: T }>

export const SHOOT_COMMAND_TYPES: readonly ShootCommandType[] = [
  'shoot.start', 'shoot.pause', 'shoot.resume', 'shoot.end',
  'step.next', 'step.previous', 'step.jump',
  'timer.start', 'timer.pause', 'timer.resume', 'timer.addTime', 'timer.cancel', 'timer.acknowledge',
  'rolling.set', 'clock.speed', 'marker.add',
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
