// What a person should write instead, for each kind of problem zod finds: zod 4's per-parse error
// map (`safeParse(input, { error })`, https://zod.dev/error-customization) turns its programmer words
// ("Expected number, received string") into instructions ("write a number, such as 4."). A schema's
// own message (`z.number({ error: '…' })`) comes first; this covers the rest. `checkInput` is the one
// way the server checks a request against a schema: its refusal reads "Label: instruction".
import type { z } from 'zod'
import { fieldLabel, type FieldLabels } from './field-labels'

type RawIssue = z.core.$ZodRawIssue

const count = (n: number | bigint, one: string, many = `${one}s`) => `${n} ${Number(n) === 1 ? one : many}`

/** The quoted choices of an enum or literal, or of a union of them. */
function choices(issue: RawIssue): string[] {
  if (issue.code === 'invalid_value') return issue.values.map((v) => String(v))
  if (issue.code === 'invalid_union') return issue.errors.flat().flatMap((e) => (e.code === 'invalid_value' ? e.values.map(String) : []))
  return []
}

function missing(expected: string): string {
  if (expected === 'boolean') return 'choose yes or no (true or false).'
  if (expected === 'array') return 'send a list here (it is missing).'
  return 'fill it in.'
}

function wrongType(expected: string): string {
  switch (expected) {
    case 'number': return 'write a number, such as 4.'
    case 'int': return 'write a whole number, such as 4.'
    case 'string': return 'write it as text.'
    case 'boolean': return 'choose yes or no (true or false).'
    case 'array': return 'send a list of entries here.'
    case 'object': return 'send its fields as a group here.'
    case 'date': return 'write a date such as 2026-03-14.'
    default: return 'write what this field asks for.'
  }
}

/** The instruction for one issue, without the label: "write at most 120 characters." */
export function instructionFor(issue: RawIssue): string {
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined || issue.input === null ? missing(issue.expected) : wrongType(issue.expected)
    case 'too_small': {
      const n = issue.minimum
      if (issue.origin === 'string') return Number(n) <= 1 ? 'fill it in.' : `write at least ${count(n, 'character')}.`
      if (issue.origin === 'array' || issue.origin === 'set') return `choose at least ${n}.`
      return issue.inclusive ? `write a number of at least ${n}.` : `write a number above ${n}.`
    }
    case 'too_big': {
      const n = issue.maximum
      if (issue.origin === 'string') return `write at most ${count(n, 'character')}.`
      if (issue.origin === 'array' || issue.origin === 'set') return `keep it to at most ${count(n, 'entry', 'entries')}.`
      return issue.inclusive ? `write a number of at most ${n}.` : `write a number below ${n}.`
    }
    case 'invalid_format':
      if (issue.format === 'email') return 'write an e-mail address such as name@example.com.'
      if (issue.format === 'url') return 'write a web address that starts with https://.'
      if (issue.format === 'date' || issue.format === 'datetime') return 'write a date such as 2026-03-14.'
      return 'write it in the form this field asks for.'
    case 'not_multiple_of':
      return `write a multiple of ${issue.divisor}.`
    case 'unrecognized_keys':
      return `leave out ${issue.keys.length === 1 ? 'the field' : `the ${issue.keys.length} fields`} this form does not have.`
    case 'invalid_value':
    case 'invalid_union': {
      const list = [...new Set(choices(issue))]
      if (list.length === 1) return `write "${list[0]}".`
      if (list.length) return `choose one of: ${list.join(', ')}.`
      return 'write one of the kinds of value this field takes.'
    }
    case 'invalid_key':
    case 'invalid_element':
      return 'check its entries: one of them is not what this field takes.'
    default:
      return issue.message ?? 'check what was written here.'
  }
}

/** A schema's own words for a value of the wrong type, and the usual ones when the value is missing. */
export function typed(wrong: string) {
  return (issue: RawIssue): string => (issue.code === 'invalid_type' && issue.input === undefined ? missing(issue.expected) : wrong)
}

/** The error map to pass to `safeParse(input, { error: inputWords })`. */
export const inputWords = (issue: RawIssue): string => instructionFor(issue)

export interface InputRefusal {
  /** The field at fault as the request names it ("steps.2.durationMin"; "body" for the whole). */
  field: string
  /** "Step 3, shortest time: write a whole number of seconds, such as 900." */
  message: string
  /** Every problem, each with its field key and its own labelled message. */
  issues: { field: string; message: string }[]
}

/** Every issue as the refusal carries it: the field key for programs, "Label: instruction" for people. */
export function describeIssues(issues: readonly z.core.$ZodIssue[], own: FieldLabels = {}): InputRefusal {
  const described = issues.map((i) => ({
    field: i.path.map(String).join('.') || 'body',
    message: i.path.length ? `${fieldLabel(i.path, own)}: ${i.message}` : sentence(i.message),
  }))
  const first = described[0] ?? { field: 'body', message: 'Check what was sent: it is not what this form takes.' }
  return { field: first.field, message: first.message, issues: described }
}

/** An instruction standing alone, as a sentence ("send a list of entries here." → "Send …"). */
const sentence = (s: string) => s.charAt(0).toUpperCase() + s.slice(1)

/** `schema` checked against `input` with these words; a refusal names the field and what to write. */
export function checkInput<S extends z.ZodType>(
  schema: S, input: unknown, own: FieldLabels = {},
): { ok: true; data: z.output<S> } | ({ ok: false } & InputRefusal) {
  const parsed = schema.safeParse(input, { error: inputWords })
  if (parsed.success) return { ok: true, data: parsed.data }
  return { ok: false, ...describeIssues(parsed.error.issues, own) }
}
