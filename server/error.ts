// First in Nitro's chain of error handlers (nuxt.config.ts puts it there): a DomainError thrown by
// any route or service becomes its refusal (server/utils/errors.ts). nuxt-security's request size
// limiter (nuxt.config.ts, 2 MB) throws h3's 413: it is answered in the same shape. Anything else
// goes on to Nuxt's own handler (the error page, or its JSON). An address under /api that no route
// answers (or not for its method) is Nuxt's "Page not found": it is answered as the one shape's 404,
// so a mangled id gets the same kind of refusal as a missing row. SQLite's busy, full-disk and write failures
// are answered in the same shape through server/db/db-errors.ts.
import { DomainError, isDomainError } from '../shared/utils/domain-error'
import { databaseRefusal } from './db/db-errors'
import { sendDomainError } from './utils/errors'

/** What a request of each method asks, in words. */
const VERBS: Record<string, string> = { GET: 'read', HEAD: 'read', POST: 'send to', PUT: 'change', PATCH: 'change', DELETE: 'delete' }

const TOO_LARGE = 'The request is over 2 MB, the most any request may carry; send less (a recipe import can be up to 512 KB, a photo 8 MB).'

export default defineNitroErrorHandler(async (error, event) => {
  const domain = [error, error.cause].find(isDomainError)
  // A database held busy or a full disk (db-errors.ts): the one shape, not a 500.
  const database = domain ? null : databaseRefusal(error)
  if (domain) await sendDomainError(event, domain)
  else if (database) {
    console.warn('[hobline] request refused by the database:', event.method, event.path, String(error.cause ?? error))
    await sendDomainError(event, database)
  }
  else if (error.statusCode === 413) await sendDomainError(event, new DomainError('too-large', TOO_LARGE))
  else if (error.statusCode === 404 && event.path.startsWith('/api/')) {
    // The address is not echoed: the words are Hobline's own, whatever was sent.
    const verb = VERBS[event.method] ?? 'use'
    await sendDomainError(event, new DomainError('not-found', `There is nothing at this address to ${verb}; check the link, or the number in it.`))
  }
})
