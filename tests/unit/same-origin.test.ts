// The same-origin rule as a table (server/utils/same-origin.ts). The header values are the ones the
// standards give: Sec-Fetch-Site is same-origin, same-site, cross-site or none (W3C Fetch Metadata
// Request Headers, §2.4); Origin is a serialised origin or "null" (RFC 6454 §7, Fetch §3.1).
import { describe, expect, it } from 'vitest'
import { createCommandBucket } from '../../server/utils/socket-session'
import { crossSiteReason, originMatches, type RequestOrigin } from '../../server/utils/same-origin'

const HOST = 'studio.local:3000'
const SITE = 'https://hobline.example'

describe('the same-origin rule', () => {
  const cases: [string, RequestOrigin, 'pass' | 'refuse', 'pass' | 'refuse'][] = [
    // what, request, as a change, as a handshake
    ['Sec-Fetch-Site same-origin', { secFetchSite: 'same-origin', cookie: 's=1', host: HOST }, 'pass', 'pass'],
    ['Origin of the host it was sent to', { origin: 'http://studio.local:3000', cookie: 's=1', host: HOST }, 'pass', 'pass'],
    ['Origin of the configured site', { origin: SITE, cookie: 's=1', host: 'internal:3000' }, 'pass', 'pass'],
    ['Origin of the host, in capitals', { origin: 'http://STUDIO.local:3000', cookie: 's=1', host: HOST }, 'pass', 'pass'],
    ['another site, with a cookie', { origin: 'https://elsewhere.example', secFetchSite: 'cross-site', cookie: 's=1', host: HOST }, 'refuse', 'refuse'],
    ['another site, no cookie', { origin: 'https://elsewhere.example', host: HOST }, 'refuse', 'refuse'],
    ['the same host on another port', { origin: 'http://studio.local:3001', cookie: 's=1', host: HOST }, 'refuse', 'refuse'],
    ['a sibling subdomain', { origin: 'https://www.hobline.example', secFetchSite: 'same-site', cookie: 's=1', host: 'hobline.example' }, 'refuse', 'refuse'],
    ['an opaque origin', { origin: 'null', cookie: 's=1', host: HOST }, 'refuse', 'refuse'],
    ['not an origin at all', { origin: 'not a url', cookie: 's=1', host: HOST }, 'refuse', 'refuse'],
    ['Sec-Fetch-Site cross-site, no Origin', { secFetchSite: 'cross-site', host: HOST }, 'refuse', 'refuse'],
    ['Sec-Fetch-Site none (typed in the address bar)', { secFetchSite: 'none', cookie: 's=1', host: HOST }, 'refuse', 'refuse'],
    ['a cookie and no browser header', { cookie: 's=1', host: HOST }, 'refuse', 'pass'],
    ['no cookie and no browser header', { host: HOST }, 'pass', 'pass'],
  ]
  for (const [what, request, change, handshake] of cases) {
    it(`${what}: a change is ${change === 'pass' ? 'let through' : 'refused'}, a handshake ${handshake === 'pass' ? 'let through' : 'refused'}`, () => {
      expect(crossSiteReason(request, SITE, 'mutation') === null ? 'pass' : 'refuse').toBe(change)
      expect(crossSiteReason(request, SITE, 'handshake') === null ? 'pass' : 'refuse').toBe(handshake)
    })
  }

  it('says why, in words', () => {
    expect(crossSiteReason({ origin: 'https://elsewhere.example', host: HOST }, '', 'mutation')).toBe('it came from https://elsewhere.example')
    expect(crossSiteReason({ secFetchSite: 'cross-site' }, '', 'mutation')).toBe('the browser marked it "cross-site" (Sec-Fetch-Site)')
    expect(crossSiteReason({ cookie: 's=1' }, '', 'mutation')).toBe('it carries cookies but no Origin or Sec-Fetch-Site header')
  })

  it('matches the configured site by its whole origin, scheme included, and the request host by host', () => {
    expect(originMatches('http://hobline.example', SITE, undefined)).toBe(false)
    expect(originMatches('https://hobline.example', `${SITE}/some/path/`, undefined)).toBe(true)
    // Behind a TLS proxy the server sees http; the browser's Origin says https.
    expect(originMatches('https://studio.local:3000', '', HOST)).toBe(true)
    expect(originMatches('https://studio.local', '', undefined)).toBe(false)
  })
})

describe('the per-socket limit', () => {
  it('lets a burst through, then one per 1/rate seconds, and says when to try again', () => {
    const bucket = createCommandBucket({ perSecond: 20, burst: 40 })
    const t0 = 1_000_000
    for (let i = 0; i < 40; i++) expect(bucket.take(t0)).toBeNull()
    const refused = bucket.take(t0)
    expect(refused).toEqual({
      ok: false,
      error: { code: 'too-many', message: 'Too many messages from this screen: at most 20 a second (40 at once). This one was not applied; send it again in 0.1 s.', retryAfterSeconds: 0.1 },
    })
    // 20 a second: one token every 50 ms.
    expect(bucket.take(t0 + 49)).not.toBeNull()
    expect(bucket.take(t0 + 50 + 49)).toBeNull()
    expect(bucket.take(t0 + 99)).not.toBeNull()
    // A second of quiet refills 20, never more than the burst.
    for (let i = 0; i < 20; i++) expect(bucket.take(t0 + 1099)).toBeNull()
    expect(bucket.take(t0 + 1099)).not.toBeNull()
    expect([...Array(40)].filter(() => bucket.take(t0 + 60_000) === null)).toHaveLength(40)
    expect(bucket.take(t0 + 60_000)).not.toBeNull()
  })
})
