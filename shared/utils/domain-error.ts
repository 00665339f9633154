// The one error model. Domain and service code throws a DomainError; the server maps it once to
// HTTP (server/utils/errors.ts: a status and the same JSON body everywhere) and once to a socket
// acknowledgement (`{ ok: false, error: { code, message, field? } }`). Messages are written for
// people: they say what to fix. Plain TypeScript, no h3: the shoot module and the tests use it as is.

/** What went wrong, as a word a program can act on. The shoot reducer's codes are kept as they are. */
export type DomainErrorCode =
  | 'invalid' // the input is wrong: the message says which field and what to write
  | 'signed-out' // nobody is signed in, or the device's join code was revoked
  | 'not-found' // no such thing (or not yours to see: ids cannot be probed)
  | 'forbidden' // the role may not do this
  | 'cross-site' // a change sent from another site's page (server/utils/same-origin.ts)
  | 'conflict' // the thing changed meanwhile, or is in a state that refuses this
  | 'gone' // a link that has expired or was used
  | 'too-large' // an upload or body over its limit
  | 'unsupported-type' // a file of a kind Hobline does not read
  | 'cycle' | 'missing-station' | 'impossible-lag' | 'bad-input' // the cook plan cannot be made
  | 'too-many' // a rate limit; `data.retryAfterSeconds` says when to try again
  | 'unavailable' // the database, mail or storage is not there yet
  | 'busy' // the database is held by another program past the busy timeout (server/db/db-errors.ts)
  | 'storage' // the server's disk is full or refused a write; nothing was saved (server/db/db-errors.ts)
  | 'upstream' // a service Hobline relies on answered with an error
  | 'server' // anything else: a bug, logged on the server, never shown in detail
  | (string & {}) // the shoot reducer's own codes (shoot-ended, no-change, …): a conflict with the state

/** What a refusal carries over any wire. */
export interface DomainErrorBody {
  code: DomainErrorCode
  message: string
  /** The field at fault, by the name the form uses. */
  field?: string
}

export class DomainError extends Error {
  override readonly name = 'DomainError'
  readonly code: DomainErrorCode
  readonly field?: string
  /** Extra facts for the caller (the current record after a conflict, the steps a plan names …). */
  readonly data?: Record<string, unknown>

  constructor(code: DomainErrorCode, message: string, options: { field?: string; data?: Record<string, unknown> } = {}) {
    super(message)
    this.code = code
    if (options.field) this.field = options.field
    if (options.data) this.data = options.data
  }

  body(): DomainErrorBody {
    return this.field ? { code: this.code, message: this.message, field: this.field } : { code: this.code, message: this.message }
  }
}

/** Duck-typed, so an error thrown from another bundle of the same code still counts. */
export function isDomainError(error: unknown): error is DomainError {
  return error instanceof DomainError
    || (!!error && typeof error === 'object' && (error as { name?: unknown }).name === 'DomainError'
      && typeof (error as { code?: unknown }).code === 'string' && typeof (error as { body?: unknown }).body === 'function')
}

/** A refusal as a socket acknowledgement carries it. */
export type Refusal = { ok: false; error: DomainErrorBody }

export function refusal(error: DomainError | DomainErrorBody): Refusal {
  return { ok: false, error: error instanceof DomainError ? error.body() : error }
}
