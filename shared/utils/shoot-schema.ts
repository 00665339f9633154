// The shape of a shoot command, checked with zod where commands come from outside (the server, and
// tests of the reducer). Screens build their own commands and skip it (shoot-apply.ts), which keeps
// zod out of the prompter's bundle.
import { z } from 'zod'
import {
  SHOOT_ADD_TIME_MAX_MS, SHOOT_MARKER_KINDS, SHOOT_MARKER_TEXT_MAX, SHOOT_SPEED_MAX, SHOOT_SPEED_MIN,
  SHOOT_TIMER_LABEL_MAX, SHOOT_TIMER_MAX_MS, SHOOT_TIMER_MIN_MS, SHOOT_TIMER_SLOTS, SHOOT_COMMAND_TYPES,
  type ShootCommand, type ShootCommandError,
} from '../types/shoot'

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
  z.object({ type: z.literal('wait.start'), stepId: shootIdSchema('stepId') }),
])

export type ShootCommandParse = { ok: true; command: ShootCommand } | { ok: false; error: ShootCommandError }

/** Reads a command from untrusted input; the error names the field at fault and what to send. */
export function parseShootCommand(input: unknown): ShootCommandParse {
  const parsed = shootCommandSchema.safeParse(input)
  if (parsed.success) return { ok: true, command: parsed.data }
  const issue = parsed.error.issues[0]!
  const field = issue.path.map(String).join('.') || 'command'
  if (issue.code === 'invalid_union' && field === 'type') {
    const type = (input as { type?: unknown } | null)?.type
    const said = type === undefined ? 'a command needs a type' : `"${String(type)}" is not a shoot command`
    return { ok: false, error: { code: 'invalid', field, message: `type: ${said}; use one of ${SHOOT_COMMAND_TYPES.join(', ')}` } }
  }
  const message = issue.message.startsWith(field) ? issue.message : `${field}: ${issue.message}`
  return { ok: false, error: { code: 'invalid', field, message } }
}
