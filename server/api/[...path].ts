// An address under /api that no route answers: a 404 in the one error shape, for any method, so a
// mistyped or mangled address (an id with "?" or "#" in it) gets the same refusal as a missing row.
import { DomainError } from '../../shared/utils/domain-error'

export default defineEventHandler((event) => {
  const path = event.path.split('?')[0]!.slice(0, 200)
  throw new DomainError('not-found', `No Hobline address ${path} answers ${event.method}; check the link, or the id in it.`)
})
