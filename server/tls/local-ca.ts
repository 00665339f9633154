// A small certificate authority of the studio's own, made on the laptop with node-forge, so the
// tablets and phones reach Hobline over https on the studio network. Plain Node (no Nitro): used by
// `npm run demo -- --https`, `npm run tls` and the tests. The root is made once and kept (a device
// trusts it once); the server certificate names the laptop's LAN addresses and host name and is made
// again when they change or it nears its end. Certificate profile: RFC 5280 (basicConstraints,
// keyUsage, extendedKeyUsage serverAuth, subjectAltName); the 397-day server lifetime is the
// CA/Browser Forum baseline's limit (§6.3.2), which Apple's devices apply to every certificate.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { createHash, createPublicKey, randomBytes } from 'node:crypto'
import { hostname, networkInterfaces } from 'node:os'
import { join } from 'node:path'
import forge from 'node-forge'

const { pki } = forge
const DAY_MS = 24 * 60 * 60 * 1000
const ROOT_DAYS = 10 * 365
const SERVER_DAYS = 397
/** A server certificate this close to its end is made again. */
const RENEW_DAYS = 30

export interface TlsFiles {
  dir: string
  rootCert: string
  rootKey: string
  cert: string
  key: string
}

export function tlsFiles(dir: string): TlsFiles {
  return {
    dir,
    rootCert: join(dir, 'hobline-root-ca.crt'),
    rootKey: join(dir, 'hobline-root-ca.key'),
    cert: join(dir, 'server.crt'),
    key: join(dir, 'server.key'),
  }
}

/** The names a device may use for this laptop: its host name (and .local), every LAN IPv4 address, loopback. */
export function lanHostNames(extra: string[] = []): string[] {
  const addresses = Object.values(networkInterfaces()).flat()
    .filter((a): a is NonNullable<typeof a> => !!a && a.family === 'IPv4' && !a.internal)
    .map((a) => a.address)
  const host = hostname().toLowerCase()
  const names = [...addresses, host, host.includes('.') ? '' : `${host}.local`, 'localhost', '127.0.0.1', ...extra]
  return [...new Set(names.map((n) => n.trim()).filter(Boolean))]
}

/** The first LAN IPv4 address, the one a tablet is most likely to reach (null without a network). */
export function lanAddress(): string | null {
  return lanHostNames().find((n) => /^\d+\.\d+\.\d+\.\d+$/.test(n) && n !== '127.0.0.1') ?? null
}

function serial(): string {
  // RFC 5280 §4.1.2.2: positive, at most 20 octets; the first bit cleared keeps it positive.
  const bytes = randomBytes(16)
  bytes[0] = bytes[0]! & 0x7f
  return bytes.toString('hex')
}

function isIp(name: string): boolean {
  return /^\d+\.\d+\.\d+\.\d+$/.test(name) || name.includes(':')
}

/** A new key pair and a certificate for it, valid from a day ago (clocks differ) for `days`. */
function newCertificate(days: number) {
  const keys = pki.rsa.generateKeyPair({ bits: 2048 })
  const cert = pki.createCertificate()
  cert.publicKey = keys.publicKey
  cert.serialNumber = serial()
  cert.validity.notBefore = new Date(Date.now() - DAY_MS)
  cert.validity.notAfter = new Date(Date.now() + days * DAY_MS)
  return { cert, keys }
}

function makeRoot(): { cert: forge.pki.Certificate; key: forge.pki.rsa.PrivateKey } {
  const { cert, keys } = newCertificate(ROOT_DAYS)
  const subject = [{ name: 'commonName', value: `Hobline studio root (${hostname()})` }, { name: 'organizationName', value: 'Hobline' }]
  cert.setSubject(subject)
  cert.setIssuer(subject)
  cert.setExtensions([
    { name: 'basicConstraints', cA: true, pathLenConstraint: 0, critical: true },
    { name: 'keyUsage', keyCertSign: true, cRLSign: true, critical: true },
    { name: 'subjectKeyIdentifier' },
  ])
  cert.sign(keys.privateKey, forge.md.sha256.create())
  return { cert, key: keys.privateKey }
}

function makeServer(root: { cert: forge.pki.Certificate; key: forge.pki.rsa.PrivateKey }, names: string[]) {
  const { cert, keys } = newCertificate(SERVER_DAYS)
  cert.setSubject([{ name: 'commonName', value: names.find((n) => !isIp(n)) ?? names[0]! }, { name: 'organizationName', value: 'Hobline' }])
  cert.setIssuer(root.cert.subject.attributes)
  cert.setExtensions([
    { name: 'basicConstraints', cA: false, critical: true },
    { name: 'keyUsage', digitalSignature: true, keyEncipherment: true, critical: true },
    { name: 'extKeyUsage', serverAuth: true },
    // Type 7 is an IP address, type 2 a DNS name (RFC 5280 §4.2.1.6).
    { name: 'subjectAltName', altNames: names.map((n) => (isIp(n) ? { type: 7, ip: n } : { type: 2, value: n })) },
    { name: 'authorityKeyIdentifier', keyIdentifier: root.cert.generateSubjectKeyIdentifier().getBytes() },
  ])
  cert.sign(root.key, forge.md.sha256.create())
  return { cert: pki.certificateToPem(cert), key: pki.privateKeyToPem(keys.privateKey) }
}

/** The names a PEM certificate covers, and when it ends. */
export function certificateNames(pem: string): { names: string[]; notAfter: Date } {
  const cert = pki.certificateFromPem(pem)
  const alt = cert.getExtension('subjectAltName') as { altNames?: { type: number; value?: string; ip?: string }[] } | null
  return { names: (alt?.altNames ?? []).map((a) => (a.type === 7 ? a.ip ?? '' : a.value ?? '')), notAfter: cert.validity.notAfter }
}

/**
 * Makes (or keeps) the root and a server certificate for `names` in `dir`. The root is made only
 * when missing; the server certificate again when a name is missing from it or it ends within 30 days.
 */
export function ensureLocalCertificates(dir: string, names: string[]): TlsFiles & { madeRoot: boolean; madeServer: boolean } {
  const files = tlsFiles(dir)
  mkdirSync(dir, { recursive: true, mode: 0o700 })
  let madeRoot = false
  if (!existsSync(files.rootCert) || !existsSync(files.rootKey)) {
    const root = makeRoot()
    writeFileSync(files.rootKey, pki.privateKeyToPem(root.key), { mode: 0o600 })
    writeFileSync(files.rootCert, pki.certificateToPem(root.cert))
    madeRoot = true
  }
  let madeServer = madeRoot || !existsSync(files.cert) || !existsSync(files.key)
  if (!madeServer) {
    const held = certificateNames(readFileSync(files.cert, 'utf8'))
    madeServer = names.some((n) => !held.names.includes(n)) || held.notAfter.getTime() - Date.now() < RENEW_DAYS * DAY_MS
  }
  if (madeServer) {
    const root = { cert: pki.certificateFromPem(readFileSync(files.rootCert, 'utf8')), key: pki.privateKeyFromPem(readFileSync(files.rootKey, 'utf8')) }
    const server = makeServer(root, names)
    writeFileSync(files.key, server.key, { mode: 0o600 })
    writeFileSync(files.cert, server.cert)
  }
  return { ...files, madeRoot, madeServer }
}

/** The base64 SHA-256 of a key's SubjectPublicKeyInfo (Chromium's --ignore-certificate-errors-spki-list, RFC 7469 pins). */
export function spkiHash(keyPem: string): string {
  const spki = createPublicKey(keyPem).export({ type: 'spki', format: 'der' })
  return createHash('sha256').update(spki).digest('base64')
}

/** The SHA-256 fingerprint of a PEM certificate, as devices show it ("AB:CD:…"), to compare before trusting. */
export function certificateFingerprint(pem: string): string {
  const der = Buffer.from(forge.asn1.toDer(pki.certificateToAsn1(pki.certificateFromPem(pem))).getBytes(), 'binary')
  return createHash('sha256').update(der).digest('hex').toUpperCase().match(/../g)!.join(':')
}
