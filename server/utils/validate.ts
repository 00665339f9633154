// Request validation with zod: a 400 whose message names the field and says what to fix.
import type { H3Event } from 'h3'
import type { z } from 'zod'

function fail(error: z.ZodError): never {
  const issue = error.issues[0]
  const field = issue?.path.join('.') || 'body'
  throw createError({
    statusCode: 400,
    statusMessage: `${field}: ${issue?.message ?? 'is not valid'}`,
    data: { field, issues: error.issues.map((i) => ({ field: i.path.join('.') || 'body', message: i.message })) },
  })
}

export async function validateBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  let body: unknown
  try {
    body = await readBody(event)
  } catch {
    throw createError({ statusCode: 400, statusMessage: 'body: send a JSON object (the body could not be read as JSON).' })
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
    throw createError({ statusCode: 400, statusMessage: `${name}: must be a positive whole number, got "${String(raw).slice(0, 40)}".` })
  }
  return id
}
