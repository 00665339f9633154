// Which address the attempt limits count (server/utils/client-address.ts). X-Forwarded-For is the
// de-facto proxy header (MDN, "X-Forwarded-For": each proxy appends the address it received the
// request from, so only entries added by proxies you trust are reliable, read from the right).
import { describe, expect, it } from 'vitest'
import { clientAddressFrom, trustedProxyList } from '../../server/utils/client-address'
import { siteUrlProblem } from '../../server/utils/site-url'

describe('client address', () => {
  it('is the peer when no proxy is trusted, whatever X-Forwarded-For claims', () => {
    expect(clientAddressFrom('192.0.2.10', '203.0.113.5', '')).toBe('192.0.2.10')
    expect(clientAddressFrom('::ffff:192.0.2.10', undefined, '')).toBe('192.0.2.10')
    expect(clientAddressFrom(undefined, '203.0.113.5', '')).toBe('unknown')
  })

  it('is the peer when the peer is not a trusted proxy', () => {
    expect(clientAddressFrom('192.0.2.10', '203.0.113.5', '10.0.0.2')).toBe('192.0.2.10')
  })

  it('behind a trusted proxy: the rightmost address that is not itself a trusted proxy', () => {
    expect(clientAddressFrom('10.0.0.2', '203.0.113.5', '10.0.0.2')).toBe('203.0.113.5')
    // A client that sends its own X-Forwarded-For cannot choose the counted address: the proxy appended the real one.
    expect(clientAddressFrom('10.0.0.2', '198.51.100.1, 203.0.113.5', '10.0.0.2')).toBe('203.0.113.5')
    // Two proxies in a row, both trusted.
    expect(clientAddressFrom('::ffff:10.0.0.2', '203.0.113.5, 10.0.0.3', '10.0.0.2, 10.0.0.3')).toBe('203.0.113.5')
    expect(clientAddressFrom('10.0.0.2', '2001:db8::7', '10.0.0.2')).toBe('2001:db8::7')
  })

  it('a malformed entry counts against the last trusted hop, and an empty header against the proxy', () => {
    expect(clientAddressFrom('10.0.0.2', 'not-an-address', '10.0.0.2')).toBe('10.0.0.2')
    expect(clientAddressFrom('10.0.0.2', '203.0.113.5, garbage, 10.0.0.3', '10.0.0.2,10.0.0.3')).toBe('10.0.0.3')
    expect(clientAddressFrom('10.0.0.2', '', '10.0.0.2')).toBe('10.0.0.2')
  })

  it('reads the setting as a list of addresses and ignores words that are not addresses', () => {
    expect([...trustedProxyList(' 10.0.0.2 ,::1, localhost, ')]).toEqual(['10.0.0.2', '::1'])
  })
})

describe('site URL setting', () => {
  it('must be an absolute http(s) address', () => {
    expect(siteUrlProblem('https://hobline.example.com')).toBeNull()
    expect(siteUrlProblem('http://192.168.1.20:3000')).toBeNull()
    expect(siteUrlProblem('')).toMatch(/^NUXT_PUBLIC_SITE_URL is not set\./)
    expect(siteUrlProblem('hobline.example.com')).toMatch(/is not an absolute address/)
    expect(siteUrlProblem('ftp://hobline.example.com')).toMatch(/must start with http:\/\/ or https:\/\//)
  })
})
