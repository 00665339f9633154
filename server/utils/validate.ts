// Request validation with zod: a refusal ('invalid', 400) whose message names the field and says
// what to fix. Bodies are JSON only ('unsupported-type', 415, for anything else).
import type { H3Event } from 'h3'
import type { z } from 'zod'
import { DomainError } from '../../shared/utils/domain-error'

function fail(error: z.ZodError): never {
  const issue = error.issues[0]
  const field = issue?.path.join('.') || 'body'
  throw new DomainError('invalid', `${field}: ${issue?.message ?? 'is not valid'}`, {
    field,
    data: { issues: error.issues.map((i) => ({ field: i.path.join('.') || 'body', message: i.message })) },
  })
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
    raw = (await readBodyWithin(event, JSON_BODY_MAX_BYTES, `body: larger than ${JSON_BODY_MAX_BYTES / 1024 / 1024} MB; send less at once.`)).toString('utf8')
  } catch (error) {
    if (error instanceof DomainError) throw error
    throw new DomainError('invalid', 'body: send a JSON object (the body could not be read).', { field: 'body' })
  }
  if (raw === undefined || raw.trim() === '') return undefined
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!isJsonType(type)) {
    const sent = type ? `"${type.split(';')[0]!.trim().slice(0, 60)}"` : 'a body with no Content-Type'
    throw new DomainError('unsupported-type', `body: this route reads JSON only; send it with Content-Type: application/json (got ${sent}; form posts are refused).`, {
      field: 'body', data: { accepted: ['application/json'] },
    })
  }
  try {
    return await readBody(event)
  } catch {
    throw new DomainError('invalid', 'body: send a JSON object (the body could not be read as JSON).', { field: 'body' })
  }
}

/** The request body, which must be a JSON object (an empty body counts as `{}`). */
export async function readJsonObject(event: H3Event): Promise<Record<string, unknown>> {
  const body = await readJson(event)
  if (body === undefined || body === null || body === '') return {}
  if (typeof body !== 'object' || Array.isArray(body)) throw new DomainError('invalid', 'body: send a JSON object.', { field: 'body' })
  return body as Record<string, unknown>
}

/** The JSON body checked against `schema` (no body is checked as `{}`). */
export async function validateBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  const body = await readJson(event)
  const parsed = schema.safeParse(body ?? {})
  if (!parsed.success) fail(parsed.error)
  return parsed.data
}

export function validateQuery<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  const parsed = schema.safeParse(getQuery(event))
  if (!parsed.success) fail(parsed.error)
  return parsed.data
}

/** A numeric id from the route, such as `studioId`; 400 naming it when it is not a positive whole number. */
export function routeId(event: H3Event, name: string): number {
  const raw = getRouterParam(event, name)
  // Digits only: Number() would also read " 1", "0x10" and "1e3" as ids of other rows.
  const id = raw && /^[1-9]\d{0,15}$/.test(raw) ? Number(raw) : Number.NaN
  if (!Number.isSafeInteger(id)) {
    throw new DomainError('invalid', `${name}: must be a positive whole number, got "${String(raw).slice(0, 40)}".`, { field: name })
  }
  return id
}
