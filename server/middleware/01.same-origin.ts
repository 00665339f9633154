// Cross-site request forgery: a POST, PUT, PATCH or DELETE from another site is refused before any
// route reads it (403, code 'cross-site'), by the rule in server/utils/same-origin.ts. It runs for
// every path, the socket.io long-polling posts included. First of the server middleware (numbered).
import { crossSiteError, crossSiteReason, requestOrigin } from '../utils/same-origin'

const CHANGES = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export default defineEventHandler((event) => {
  if (!CHANGES.has(event.method)) return
  const siteUrl = String(useRuntimeConfig(event).public.siteUrl || '')
  const reason = crossSiteReason(requestOrigin(event.node.req.headers), siteUrl, 'mutation')
  if (reason) throw crossSiteError(reason, 'request')
})
