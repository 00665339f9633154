// The one mapping of a DomainError to HTTP: its status, and the same JSON body for every refusal
// (`{ statusCode, statusMessage, message, data: { code, message, field?, … } }`, the shape h3's
// own errors have, so pages read any refusal alike). The socket side is `refusal()` in
// shared/utils/domain-error.ts. server/error.ts sends it for every route.
import type { H3Event } from 'h3'
import type { DomainError, DomainErrorCode } from '../../shared/utils/domain-error'

const STATUS: Partial<Record<DomainErrorCode, number>> = {
  'invalid': 400,
  'signed-out': 401,
  'forbidden': 403,
  'cross-site': 403,
  'not-found': 404,
  'conflict': 409,
  'gone': 410,
  'length-required': 411,
  'too-large': 413,
  'unsupported-type': 415,
  // The cook plan's refusals (PlanError codes, shared/utils/plan-types.ts).
  'cycle': 422,
  'missing-station': 422,
  'impossible-lag': 422,
  'bad-input': 422,
  'too-many': 429,
  'server': 500,
  'upstream': 502,
  'unavailable': 503,
  'busy': 503,
  // 507 Insufficient Storage (RFC 4918 §11.5).
  'storage': 507,
}

/** The HTTP status of a code; the shoot reducer's own codes (a command the state refuses) are 409. */
export function httpStatusOf(code: DomainErrorCode): number {
  return STATUS[code] ?? 409
}

export function httpErrorBody(error: DomainError) {
  const statusCode = httpStatusOf(error.code)
  return { error: true, statusCode, statusMessage: error.message, message: error.message, data: { ...error.data, ...error.body() } }
}

/** Writes the refusal to the response (and Retry-After for a rate limit). */
export function sendDomainError(event: H3Event, error: DomainError) {
  const body = httpErrorBody(error)
  const retry = Number(error.data?.retryAfterSeconds)
  if (Number.isFinite(retry) && retry > 0) setResponseHeader(event, 'Retry-After', Math.ceil(retry))
  setResponseHeader(event, 'Content-Type', 'application/json')
  setResponseHeader(event, 'Cache-Control', 'no-store')
  setResponseStatus(event, body.statusCode)
  return send(event, JSON.stringify(body))
}
