// The same-origin rule for requests that change something (server/middleware/01.same-origin.ts) and
// for the socket handshake (server/plugins/04.socket.ts), in one place. Browsers say where a request
// came from in two headers a page cannot set: `Sec-Fetch-Site` (W3C Fetch Metadata) and `Origin`
// (RFC 6454, sent on every cross-origin request and on every POST, PUT, PATCH and DELETE).
// DEVELOPERS.md, "Security", states the rule and how a non-browser client passes it.
import { DomainError } from '../../shared/utils/domain-error'

export interface RequestOrigin {
  origin?: string
  secFetchSite?: string
  /** The Host header: the address this server was reached at. */
  host?: string
  cookie?: string
}

/** The headers the rule reads, from a Node request's header record. */
export function requestOrigin(headers: Record<string, string | string[] | undefined>): RequestOrigin {
  const one = (name: string) => {
    const value = headers[name]
    return Array.isArray(value) ? value[0] : value
  }
  return { origin: one('origin'), secFetchSite: one('sec-fetch-site'), host: one('host'), cookie: one('cookie') }
}

function originOf(url: string): string | null {
  try {
    return new URL(url).origin
  } catch {
    return null
  }
}

/**
 * Whether an Origin header names this site: the configured site URL (NUXT_PUBLIC_SITE_URL), or the
 * host the request was sent to (a studio LAN reaches the server by its address). Scheme is not
 * compared for the host: behind a TLS proxy the server itself sees plain http.
 */
export function originMatches(origin: string, siteUrl: string, host: string | undefined): boolean {
  const named = originOf(origin)
  if (!named || named === 'null') return false
  if (siteUrl && originOf(siteUrl) === named) return true
  return !!host && new URL(named).host === host.toLowerCase()
}

/**
 * Why a request must be refused as coming from another site, or null when it may go on.
 * - `Sec-Fetch-Site: same-origin` passes; a matching `Origin` passes.
 * - A request a browser marks as from elsewhere (another Origin, or Sec-Fetch-Site cross-site,
 *   same-site or none) is refused, cookies or not: that also stops signing a visitor in as someone else.
 * - With neither header: a 'mutation' that carries cookies is refused (a browser always sends Origin
 *   on these methods, so only a non-browser client lacks it, and it can send one); without cookies
 *   it is no one's session and goes on. A 'handshake' goes on: browsers send Origin on every
 *   WebSocket and cross-origin poll, and an older browser's same-origin poll carries neither header.
 */
export function crossSiteReason(request: RequestOrigin, siteUrl: string, kind: 'mutation' | 'handshake'): string | null {
  const site = (request.secFetchSite ?? '').trim().toLowerCase()
  if (site === 'same-origin') return null
  const origin = request.origin?.trim()
  if (origin) return originMatches(origin, siteUrl, request.host) ? null : `it came from ${origin.slice(0, 100)}`
  if (site) return `the browser marked it "${site.slice(0, 20)}" (Sec-Fetch-Site)`
  if (kind === 'mutation' && request.cookie?.trim()) return 'it carries cookies but no Origin or Sec-Fetch-Site header'
  return null
}

/** The refusal: 'cross-site', 403 over HTTP, a connect error on a socket. */
export function crossSiteError(reason: string, what: 'request' | 'connection'): DomainError {
  const fix = what === 'request'
    ? 'Use Hobline from its own pages; a program calling the API sends an Origin header naming this site.'
    : 'Open the shoot from Hobline\'s own pages; a program connecting sends an Origin header naming this site.'
  return new DomainError('cross-site', `This ${what} was refused because ${reason}, not from this site. ${fix}`)
}
