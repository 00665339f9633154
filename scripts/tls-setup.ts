// The certificate files of `npm run demo -- --https` and `npm run tls`: the studio's own (HOBLINE_TLS_CERT
// and HOBLINE_TLS_KEY, PEM files) when given, otherwise the local certificate authority's in
// NUXT_TLS_DIR (default .data/tls), made or renewed for this laptop's names.
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { ensureLocalCertificates, lanHostNames } from '../server/tls/local-ca'

export interface DemoTls {
  cert: string
  key: string
  /** The root a device installs; null with the studio's own certificate. */
  rootCert: string | null
  madeRoot: boolean
  madeServer: boolean
  extraHosts: string[]
}

export function localTls(): DemoTls & { rootCert: string } {
  const extraHosts = (process.env.HOBLINE_TLS_HOSTS ?? '').split(',').map((h) => h.trim()).filter(Boolean)
  const files = ensureLocalCertificates(resolve(process.env.NUXT_TLS_DIR || '.data/tls'), lanHostNames(extraHosts))
  return { cert: files.cert, key: files.key, rootCert: files.rootCert, madeRoot: files.madeRoot, madeServer: files.madeServer, extraHosts }
}

export function demoTls(): DemoTls {
  const cert = process.env.HOBLINE_TLS_CERT
  const key = process.env.HOBLINE_TLS_KEY
  if (cert || key) {
    if (!cert || !key) throw new Error('Set both HOBLINE_TLS_CERT and HOBLINE_TLS_KEY (PEM files of the studio\'s own certificate and its key).')
    return { cert: resolve(cert), key: resolve(key), rootCert: null, madeRoot: false, madeServer: false, extraHosts: [] }
  }
  return localTls()
}

/** The environment that makes the built server (Nitro's node-server) listen over https. */
export function tlsEnv(tls: DemoTls): Record<string, string> {
  return {
    NITRO_SSL_CERT: readFileSync(tls.cert, 'utf8'),
    NITRO_SSL_KEY: readFileSync(tls.key, 'utf8'),
    // 'none': the studio's own certificate, no root for devices to install.
    NUXT_TLS_ROOT_CERT_PATH: tls.rootCert ?? 'none',
  }
}
