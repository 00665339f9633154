// Request validation with zod: a refusal ('invalid', 400) whose message names the field and says
// what to fix.
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

/** The request body, which must be a JSON object (an empty body counts as `{}`). */
export async function readJsonObject(event: H3Event): Promise<Record<string, unknown>> {
  let body: unknown
  try {
    body = await readBody(event)
  } catch {
    throw new DomainError('invalid', 'body: send a JSON object (the body could not be read as JSON).', { field: 'body' })
  }
  if (body === undefined || body === null || body === '') return {}
  if (typeof body !== 'object' || Array.isArray(body)) throw new DomainError('invalid', 'body: send a JSON object.', { field: 'body' })
  return body as Record<string, unknown>
}

export async function validateBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  let body: unknown
  try {
    body = await readBody(event)
  } catch {
    throw new DomainError('invalid', 'body: send a JSON object (the body could not be read as JSON).', { field: 'body' })
  }
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
  const id = Number(raw)
  if (!raw || !Number.isSafeInteger(id) || id <= 0) {
    throw new DomainError('invalid', `${name}: must be a positive whole number, got "${String(raw).slice(0, 40)}".`, { field: name })
  }
  return id
}
