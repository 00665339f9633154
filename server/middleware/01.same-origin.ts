// Cross-site request forgery: a POST, PUT, PATCH or DELETE from another site is refused before any
// route reads it (403, code 'cross-site'), by the rule in server/utils/same-origin.ts. First of the
// server middleware (numbered). socket.io's long-polling posts are left to the handshake's check
// (server/plugins/04.socket.ts): each names the session id of a handshake that passed it, and a page
// on another site cannot read that id (no CORS headers are sent).
import { crossSiteError, crossSiteReason, requestOrigin } from '../utils/same-origin'

const CHANGES = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export default defineEventHandler((event) => {
  if (!CHANGES.has(event.method) || event.path.split('?')[0] === '/socket.io/') return
  const siteUrl = String(useRuntimeConfig(event).public.siteUrl || '')
  const reason = crossSiteReason(requestOrigin(event.node.req.headers), siteUrl, 'mutation')
  if (reason) throw crossSiteError(reason, 'request')
})
