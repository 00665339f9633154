// The studio's own certificate authority (server/tls/local-ca.ts): the server certificate chains to
// the root (checked with Node's X509Certificate, i.e. OpenSSL), names every address given, is for
// serving only (RFC 5280 §4.2.1.3 keyUsage, §4.2.1.12 extendedKeyUsage serverAuth, §4.2.1.9 not a CA),
// lives at most 397 days (CA/Browser Forum Baseline Requirements §6.3.2); the root is kept across runs
// and the server certificate made again when a name is new.
import { createHash, X509Certificate } from 'node:crypto'
import { mkdtempSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { ensureLocalCertificates, spkiHash } from '../../server/tls/local-ca'

describe('the studio certificate authority', () => {
  it('makes a root and a server certificate for the names, keeps the root, renews for a new name', () => {
    const dir = mkdtempSync(join(tmpdir(), 'hobline-ca-'))
    const first = ensureLocalCertificates(dir, ['192.168.1.20', 'kitchen-laptop', 'kitchen-laptop.local'])
    expect([first.madeRoot, first.madeServer]).toEqual([true, true])
    const root = new X509Certificate(readFileSync(first.rootCert))
    const server = new X509Certificate(readFileSync(first.cert))
    expect(root.ca).toBe(true)
    expect(server.ca).toBe(false)
    expect(server.checkIssued(root)).toBe(true)
    expect(server.verify(root.publicKey)).toBe(true)
    expect(server.subjectAltName).toBe('IP Address:192.168.1.20, DNS:kitchen-laptop, DNS:kitchen-laptop.local')
    expect(server.checkIP('192.168.1.20')).toBe('192.168.1.20')
    expect(server.checkHost('kitchen-laptop.local')).toBe('kitchen-laptop.local')
    expect(server.keyUsage).toEqual(['1.3.6.1.5.5.7.3.1'])
    const days = (Date.parse(server.validTo) - Date.parse(server.validFrom)) / 86_400_000
    expect(days).toBeLessThanOrEqual(398)
    // The key matches the certificate (the hash Chromium's SPKI list and HPKP pins use, RFC 7469).
    const certificateSpki = createHash('sha256').update(server.publicKey.export({ type: 'spki', format: 'der' })).digest('base64')
    expect(spkiHash(readFileSync(first.key, 'utf8'))).toBe(certificateSpki)

    const again = ensureLocalCertificates(dir, ['192.168.1.20', 'kitchen-laptop'])
    expect([again.madeRoot, again.madeServer]).toEqual([false, false])
    const moved = ensureLocalCertificates(dir, ['10.0.0.7', 'kitchen-laptop'])
    expect([moved.madeRoot, moved.madeServer]).toEqual([false, true])
    const renewed = new X509Certificate(readFileSync(moved.cert))
    expect(renewed.checkIP('10.0.0.7')).toBe('10.0.0.7')
    expect(renewed.checkIssued(root)).toBe(true)
    expect(readFileSync(moved.rootCert, 'utf8')).toBe(readFileSync(first.rootCert, 'utf8'))
  })
})
