// First in Nitro's chain of error handlers (nuxt.config.ts puts it there): a DomainError thrown by
// any route or service becomes its refusal (server/utils/errors.ts). Anything else goes on to
// Nuxt's own handler (the error page, or its JSON).
import { isDomainError } from '../shared/utils/domain-error'
import { sendDomainError } from './utils/errors'

export default defineNitroErrorHandler(async (error, event) => {
  const domain = [error, error.cause].find(isDomainError)
  if (domain) await sendDomainError(event, domain)
})
