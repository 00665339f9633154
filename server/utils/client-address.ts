// Which address a request came from, for the attempt limits (server/utils/throttle.ts). The socket's
// peer address is the truth unless that peer is a proxy named in NUXT_TRUSTED_PROXIES (a comma-separated
// list of addresses, e.g. "127.0.0.1,10.0.0.2"); only then is X-Forwarded-For read, from the right,
// skipping the trusted proxies, so a client cannot pick its own address by sending the header itself.
import { isIP } from 'node:net'

/** "::ffff:10.0.0.1" (an IPv4 peer on a dual-stack socket) is 10.0.0.1. */
function plain(address: string): string {
  const a = address.trim().toLowerCase()
  return a.startsWith('::ffff:') && isIP(a.slice(7)) === 4 ? a.slice(7) : a
}

export function trustedProxyList(setting: string): Set<string> {
  return new Set(setting.split(',').map(plain).filter((a) => isIP(a) !== 0))
}

export function clientAddressFrom(peer: string | undefined, forwardedFor: string | undefined, trustedProxies: string): string {
  if (!peer) return 'unknown'
  const trusted = trustedProxyList(trustedProxies)
  let client = plain(peer)
  if (!trusted.has(client) || !forwardedFor) return client
  const hops = forwardedFor.split(',').map(plain).slice(-32)
  for (let i = hops.length - 1; i >= 0; i--) {
    const hop = hops[i]!
    // A malformed entry: the last proxy we trust named no usable address; count the request against that proxy.
    if (isIP(hop) === 0) return client
    client = hop
    if (!trusted.has(hop)) return hop
  }
  return client
}
