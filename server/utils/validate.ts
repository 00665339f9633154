// Request validation with zod: a refusal ('invalid', 400) whose message names the field by its label
// on the form and says what to write ("Package size: write a number above 0."); `field` and
// `data.issues[].field` keep the request's keys for programs. Bodies are JSON only
// ('unsupported-type', 415, for anything else).
import type { H3Event } from 'h3'
import type { z } from 'zod'
import { DomainError } from '../../shared/utils/domain-error'
import type { FieldLabels } from '../../shared/utils/field-labels'
import { checkInput } from '../../shared/utils/input-words'

function check<S extends z.ZodType>(schema: S, input: unknown, own?: FieldLabels): z.output<S> {
  const result = checkInput(schema, input, own)
  if (result.ok) return result.data
  throw new DomainError('invalid', result.message, { field: result.field, data: { issues: result.issues } })
}

const PER_ROUTE: Record<string, string> = {
  recipes: 'recipe', episodes: 'episode', shoots: 'shoot', studios: 'studio', prices: 'price', members: 'crew member',
  invites: 'invite', outbox: 'mail', steps: 'step', 'join-codes': 'join code',
}
const PARAM_NOUNS: Record<string, string> = {
  studioId: 'studio', priceId: 'price', userId: 'crew member', inviteId: 'invite', mailId: 'mail', stepId: 'step', codeId: 'join code',
}

/** What a route parameter names, in words: the `id` of /api/recipes/:id is a recipe. */
function paramNoun(event: H3Event, name: string): string {
  return PARAM_NOUNS[name] ?? PER_ROUTE[event.path.split('?')[0]!.split('/')[2] ?? ''] ?? 'thing'
}

/** Whether a Content-Type is JSON: application/json, or a JSON dialect such as application/ld+json. */
function isJsonType(contentType: string): boolean {
  const type = contentType.split(';')[0]!.trim().toLowerCase()
  return type === 'application/json' || (type.startsWith('application/') && type.endsWith('+json'))
}

/**
 * The body of a route that reads JSON, or undefined when there is none. A body of any other type is
 * refused (415) before it is read: an HTML form on another site can post url-encoded, multipart or
 * text/plain bodies without the browser asking first, but never application/json. Uploads (photos,
 * price lists, recipe imports) have their own readers in photos.ts and prices.ts.
 */
async function readJson(event: H3Event): Promise<unknown> {
  let raw: string | undefined
  try {
    raw = (await readBodyWithin(event, JSON_BODY_MAX_BYTES, `The request is larger than ${JSON_BODY_MAX_BYTES / 1024 / 1024} MB; send less at once.`)).toString('utf8')
  } catch (error) {
    if (error instanceof DomainError) throw error
    throw new DomainError('invalid', 'The request could not be read; send the form again, as JSON.', { field: 'body' })
  }
  if (raw === undefined || raw.trim() === '') return undefined
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!isJsonType(type)) {
    const sent = type ? `"${type.split(';')[0]!.trim().slice(0, 60)}"` : 'a request with no Content-Type'
    throw new DomainError('unsupported-type', `This address reads JSON only: send it with Content-Type: application/json (this was ${sent}; form posts are refused).`, {
      field: 'body', data: { accepted: ['application/json'] },
    })
  }
  try {
    return await readBody(event)
  } catch {
    throw new DomainError('invalid', 'The request is not readable JSON; send the fields as a JSON object, such as {"title": "Soup"}.', { field: 'body' })
  }
}

/** The request body, which must be a JSON object (an empty body counts as `{}`). */
export async function readJsonObject(event: H3Event): Promise<Record<string, unknown>> {
  const body = await readJson(event)
  if (body === undefined || body === null || body === '') return {}
  if (typeof body !== 'object' || Array.isArray(body)) throw new DomainError('invalid', 'Send the fields as a JSON object, such as {"title": "Soup"}, not a list or a single value.', { field: 'body' })
  return body as Record<string, unknown>
}

/** The JSON body checked against `schema` (no body is checked as `{}`). */
/** The JSON body checked against `schema` (no body is checked as `{}`); `own` words a form's fields its own way. */
export async function validateBody<S extends z.ZodType>(event: H3Event, schema: S, own?: FieldLabels): Promise<z.output<S>> {
  return check(schema, (await readJson(event)) ?? {}, own)
}

export function validateQuery<S extends z.ZodType>(event: H3Event, schema: S, own?: FieldLabels): z.output<S> {
  return check(schema, getQuery(event), own)
}

/** A numeric id from the route, such as `studioId`; 400 in words ("This address names no studio …") when it is not a positive whole number. */
export function routeId(event: H3Event, name: string): number {
  const raw = getRouterParam(event, name)
  // Digits only: Number() would also read " 1", "0x10" and "1e3" as ids of other rows.
  const id = raw && /^[1-9]\d{0,15}$/.test(raw) ? Number(raw) : Number.NaN
  if (!Number.isSafeInteger(id)) {
    // The text sent is not echoed: the words are Hobline's own, whatever the address held.
    const noun = paramNoun(event, name)
    throw new DomainError('invalid', `This address names no ${noun}: the ${noun} number in it must be a whole number such as 12. Check the link.`, { field: name })
  }
  return id
}
