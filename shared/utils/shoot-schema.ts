// The shape of a shoot command, checked with zod where commands come from outside (the server, and
// tests of the reducer). Screens build their own commands and skip it (shoot-apply.ts), which keeps
// zod out of the prompter's bundle. Messages are instructions: the refusal puts the control's
// label in front ("Timer length: a timer runs at least 1 second."), shared/utils/field-labels.ts.
import { z } from 'zod'
import { fieldLabel } from './field-labels'
import { inputWords } from './input-words'
import {
  CAMERA_FIELD_LABELS, cameraRemoveCommandSchema, cameraSetCommandSchema, markerDeleteCommandSchema, markerEditCommandSchema,
} from './take-log-schemas'
import {
  SHOOT_ADD_TIME_MAX_MS, SHOOT_MARKER_KINDS, SHOOT_MARKER_TEXT_MAX, SHOOT_SPEED_MAX, SHOOT_SPEED_MIN,
  SHOOT_TIMER_LABEL_MAX, SHOOT_TIMER_MAX_MS, SHOOT_TIMER_MIN_MS, SHOOT_TIMER_SLOTS,
  type ShootCommand, type ShootCommandError,
} from '../types/shoot'

const ID_WORDS = "write 1–64 letters, digits, '-' or '_'"
const shootIdSchema = () => z.string({ error: ID_WORDS }).regex(/^[A-Za-z0-9_-]{1,64}$/, { error: ID_WORDS })
const INDEX_WORDS = 'write a whole number from 0 (the first) to 9999'
const indexSchema = () => z.number({ error: INDEX_WORDS }).int({ error: INDEX_WORDS }).min(0, { error: INDEX_WORDS }).max(9999, { error: INDEX_WORDS })
const cursorSchema = z.object({ segment: indexSchema(), step: indexSchema() })
const SLOT_WORDS = `choose a place from 0 (the first) to ${SHOOT_TIMER_SLOTS - 1}`
const SOUND_WORDS = "choose one of the alarm sounds (1–40 lower-case letters, digits or '-')"
const empty = <T extends string>(type: T) => z.object({ type: z.literal(type) })

export const shootCommandSchema = z.discriminatedUnion('type', [
  empty('shoot.start'),
  empty('shoot.pause'),
  empty('shoot.resume'),
  z.object({ type: z.literal('shoot.end'), cancelTimers: z.boolean({ error: 'choose yes or no (true or false)' }).optional() }),
  empty('step.next'),
  empty('step.previous'),
  z.object({ type: z.literal('step.jump'), segment: indexSchema(), step: indexSchema() }),
  z.object({
    type: z.literal('timer.start'),
    timerId: shootIdSchema().optional(),
    label: z.string({ error: 'name the timer (what is cooking)' }).trim()
      .min(1, { error: 'name the timer (what is cooking)' })
      .max(SHOOT_TIMER_LABEL_MAX, { error: `write at most ${SHOOT_TIMER_LABEL_MAX} characters` }),
    durationMs: z.number({ error: 'set a time from 1 second to 24 hours' }).int({ error: 'set a whole number of milliseconds' })
      .min(SHOOT_TIMER_MIN_MS, { error: 'a timer runs at least 1 second' })
      .max(SHOOT_TIMER_MAX_MS, { error: 'a timer runs at most 24 hours' }),
    slot: z.number({ error: SLOT_WORDS }).int({ error: SLOT_WORDS })
      .min(0, { error: SLOT_WORDS }).max(SHOOT_TIMER_SLOTS - 1, { error: SLOT_WORDS }).optional(),
    sound: z.string({ error: SOUND_WORDS }).regex(/^[a-z0-9-]{1,40}$/, { error: SOUND_WORDS }).optional(),
    stepRef: cursorSchema.optional(),
  }),
  z.object({ type: z.literal('timer.pause'), timerId: shootIdSchema() }),
  z.object({ type: z.literal('timer.resume'), timerId: shootIdSchema() }),
  z.object({
    type: z.literal('timer.addTime'),
    timerId: shootIdSchema(),
    deltaMs: z.number({ error: 'add or take off up to 2 hours' }).int({ error: 'set a whole number of milliseconds' })
      .min(-SHOOT_ADD_TIME_MAX_MS, { error: 'take off at most 2 hours at a time' })
      .max(SHOOT_ADD_TIME_MAX_MS, { error: 'add at most 2 hours at a time' })
      .refine((v) => v !== 0, { error: 'add or take off some time (not 0)' }),
  }),
  z.object({ type: z.literal('timer.cancel'), timerId: shootIdSchema() }),
  z.object({ type: z.literal('timer.acknowledge'), timerId: shootIdSchema() }),
  z.object({ type: z.literal('rolling.set'), rolling: z.boolean({ error: 'choose rolling (true) or not (false)' }) }),
  z.object({
    type: z.literal('clock.speed'),
    speed: z.number({ error: `choose a speed from ${SHOOT_SPEED_MIN}× (real time) to ${SHOOT_SPEED_MAX}×` })
      .min(SHOOT_SPEED_MIN, { error: `at least ${SHOOT_SPEED_MIN}× (real time)` })
      .max(SHOOT_SPEED_MAX, { error: `at most ${SHOOT_SPEED_MAX}×` }),
  }),
  z.object({
    type: z.literal('marker.add'),
    markerId: shootIdSchema().optional(),
    kind: z.enum(SHOOT_MARKER_KINDS, { error: `choose one of: ${SHOOT_MARKER_KINDS.join(', ')}` }),
    text: z.string({ error: 'write the note as text' }).trim()
      .max(SHOOT_MARKER_TEXT_MAX, { error: `write at most ${SHOOT_MARKER_TEXT_MAX} characters` }).optional(),
  }).refine((m) => m.kind !== 'note' || (m.text ?? '').length > 0, { error: 'write what the note says', path: ['text'] }),
  z.object({ type: z.literal('wait.start'), stepId: shootIdSchema() }),
  markerEditCommandSchema,
  markerDeleteCommandSchema,
  cameraSetCommandSchema,
  cameraRemoveCommandSchema,
])

export type ShootCommandParse = { ok: true; command: ShootCommand } | { ok: false; error: ShootCommandError }

/** Reads a command from untrusted input; the error names the field at fault and what to send. */
export function parseShootCommand(input: unknown): ShootCommandParse {
  const parsed = shootCommandSchema.safeParse(input, { error: inputWords })
  if (parsed.success) return { ok: true, command: parsed.data }
  const issue = parsed.error.issues[0]!
  const field = issue.path.map(String).join('.') || 'command'
  if (issue.code === 'invalid_union' && field === 'type') {
    // The command names are the wire's own words (SHOOT_COMMAND_TYPES in shared/types/shoot.ts), never shown to a person.
    const type = (input as { type?: unknown } | null)?.type
    const said = type === undefined ? 'This screen sent a command with no name' : 'This screen sent a command Hobline does not know'
    return { ok: false, error: { code: 'invalid', field, message: `${said}; reload the page to get the current controls.` } }
  }
  if (!issue.path.length) return { ok: false, error: { code: 'invalid', field, message: 'This screen sent a command Hobline cannot read; reload the page to get the current controls.' } }
  const own = (input as { type?: unknown }).type === 'camera.set' ? CAMERA_FIELD_LABELS : {}
  return { ok: false, error: { code: 'invalid', field, message: `${fieldLabel(issue.path, own)}: ${issue.message}` } }
}
