// The built server as a studio laptop runs it on set: reached by a host name that is not localhost
// (hobline.test, mapped to 127.0.0.1 in Chromium), over plain http or over https with a certificate
// from the studio's own certificate authority (server/tls/local-ca.ts). Started on a port and a
// database file of the test's choosing, so it can be stopped and started again on the same ones.
import { readFileSync } from 'node:fs'
import { get } from 'node:https'
import { spawnBuiltApp } from './spawned'
import type { TlsFiles } from '../../server/tls/local-ca'

export const TEST_HOST = 'hobline.test'

export interface OnSetServer {
  base: string
  log: () => string
  stop: () => Promise<void>
}

export interface OnSetOptions {
  port: number
  databasePath: string
  /** The studio's certificate files: https when given. */
  tls?: TlsFiles
}

export async function startOnSetServer({ port, databasePath, tls }: OnSetOptions): Promise<OnSetServer> {
  const base = `${tls ? 'https' : 'http'}://${TEST_HOST}:${port}`
  const app = await spawnBuiltApp({
    NUXT_DATABASE_PATH: databasePath,
    NUXT_PUBLIC_SITE_URL: base,
    // As `npm run demo` sets it: a Secure cookie is dropped on a plain-http address that is not localhost.
    NUXT_SESSION_COOKIE_SECURE: String(!!tls),
    NUXT_TLS_ROOT_CERT_PATH: tls?.rootCert ?? 'none',
    ...(tls ? { NITRO_SSL_CERT: readFileSync(tls.cert, 'utf8'), NITRO_SSL_KEY: readFileSync(tls.key, 'utf8') } : {}),
  }, { port })
  let exited = false
  void app.exited.then(() => (exited = true))
  const server: OnSetServer = { base, log: app.log, stop: app.stop }
  for (let i = 0; i < 600; i++) {
    if (exited) throw new Error(`the on-set server exited:\n${app.log()}`)
    const status = await health(port, tls).catch(() => null)
    if (status === 'ok') return server
    await new Promise((r) => setTimeout(r, 100))
  }
  await app.stop()
  throw new Error(`the on-set server never became healthy:\n${app.log()}`)
}

/** /api/health's status, asked of 127.0.0.1 under the test host's name (over https: trusting the studio root only). */
function health(port: number, tls?: TlsFiles): Promise<string | undefined> {
  if (!tls) return fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.json()).then((b) => b.status)
  return new Promise((done, fail) => {
    get({ host: '127.0.0.1', port, path: '/api/health', servername: TEST_HOST, ca: readFileSync(tls.rootCert, 'utf8'), headers: { host: `${TEST_HOST}:${port}` } }, (res) => {
      let body = ''
      res.on('data', (c) => (body += c))
      res.on('end', () => {
        try {
          done(JSON.parse(body).status)
        } catch (e) {
          fail(e)
        }
      })
    }).on('error', fail)
  })
}
