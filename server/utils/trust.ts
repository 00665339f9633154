// The studio's own root certificate (server/tls/local-ca.ts), served so a tablet or phone can trust
// it once: `npm run demo -- --https` and `npm run tls` keep it at NUXT_TLS_ROOT_CERT_PATH. A studio
// that serves its own certificate has no root here, and the trust page says so.
import { readFile } from 'node:fs/promises'
import { certificateFingerprint } from '../tls/local-ca'

export async function studioRoot(): Promise<{ pem: string; fingerprint: string } | null> {
  const path = String(useRuntimeConfig().tls.rootCertPath || '')
  if (!path) return null
  const pem = await readFile(path, 'utf8').catch(() => null)
  if (!pem || !pem.includes('BEGIN CERTIFICATE')) return null
  return { pem, fingerprint: certificateFingerprint(pem) }
}
