// Security headers over the built app, against the policy written in DEVELOPERS.md ("Security
// headers"): the values below are that section's, written out again, not read from the config. The
// headers are W3C Content Security Policy Level 3, W3C Permissions Policy, W3C Referrer Policy, WHATWG
// Fetch (X-Content-Type-Options), RFC 7034 (X-Frame-Options) and RFC 6797 (Strict-Transport-Security).
import { spawn } from 'node:child_process'
import { resolve } from 'node:path'
import { url } from '@nuxt/test-utils/e2e'
import { beforeAll, describe, expect, it } from 'vitest'
import { rootDir, serverPort, tempDatabasePath, useBuiltApp } from '../support/app'
import { type Client, demo, signedIn } from '../support/client'
import { IMPORT_TOO_LARGE } from '../../shared/utils/schemaorg-read'

/** A page's policy, directive by directive ({{nonce}}: the request's own nonce). */
const PAGE_CSP: Record<string, string> = {
  'default-src': "'self'",
  'base-uri': "'none'",
  'connect-src': "'self'",
  'font-src': "'self'",
  'form-action': "'self'",
  'frame-ancestors': "'none'",
  'img-src': "'self' data:",
  'media-src': "'self' data:",
  'object-src': "'none'",
  'script-src': "'self' 'strict-dynamic' 'nonce-{{nonce}}'",
  'script-src-attr': "'none'",
  'style-src': "'self' 'unsafe-inline'",
  'worker-src': "'self'",
  'manifest-src': "'self'",
}
const API_CSP: Record<string, string> = { 'default-src': "'none'", 'frame-ancestors': "'none'" }
const PERMISSIONS = 'camera=(), display-capture=(), fullscreen=(self), geolocation=(), microphone=(self)'
const EVERY_ANSWER = {
  'referrer-policy': 'same-origin',
  'x-content-type-options': 'nosniff',
  'x-frame-options': 'DENY',
  'permissions-policy': PERMISSIONS,
}
const HSTS = 'max-age=15552000'

/** A CSP header as directive → sources (sources joined by one space). */
function directives(header: string | null): Record<string, string> {
  return Object.fromEntries((header ?? '').split(';').map((d) => d.trim()).filter(Boolean).map((d) => {
    const [name, ...sources] = d.split(/\s+/)
    return [name!, sources.join(' ')]
  }))
}

function pick(headers: Headers, names: string[]): Record<string, string | null> {
  return Object.fromEntries(names.map((n) => [n, headers.get(n)]))
}

async function getPage(path: string) {
  const res = await fetch(url(path), { redirect: 'manual' })
  return { headers: res.headers, html: await res.text(), status: res.status }
}

describe('security headers', async () => {
  await useBuiltApp()
  let producer: Client
  let studioId = 0

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    studioId = (await producer.get('/api/me')).body.memberships[0].studioId
  })

  it('a page: the documented policy, with a fresh nonce that its scripts carry', async () => {
    const first = await getPage('/signin')
    const second = await getPage('/signin')
    expect(first.status).toBe(200)
    const csp = directives(first.headers.get('content-security-policy'))
    const nonce = /'nonce-([^']+)'/.exec(csp['script-src'] ?? '')?.[1]
    expect(nonce).toMatch(/^[\w+/=-]{16,}$/)
    expect(csp).toEqual(Object.fromEntries(Object.entries(PAGE_CSP).map(([d, s]) => [d, s.replace('{{nonce}}', nonce!)])))
    expect(pick(first.headers, Object.keys(EVERY_ANSWER))).toEqual(EVERY_ANSWER)
    expect(first.headers.get('strict-transport-security')).toBeNull()
    // Every script Nuxt writes into the page (its module entry and inline hydration data) carries the
    // nonce of this answer, and the next answer has another.
    const scripts = first.html.match(/<script\b[^>]*>/g) ?? []
    expect(scripts.length).toBeGreaterThanOrEqual(2)
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`)
    expect(directives(second.headers.get('content-security-policy'))['script-src']).not.toContain(nonce)
  })

  it('a signed-in member\'s page has the same policy', async () => {
    const res = await fetch(url(`/studios/${studioId}`), { headers: { cookie: producer.cookie } })
    expect(res.status).toBe(200)
    const csp = directives(res.headers.get('content-security-policy'))
    expect(Object.keys(csp).sort()).toEqual(Object.keys(PAGE_CSP).sort())
    expect(csp['frame-ancestors']).toBe("'none'")
    expect(pick(res.headers, Object.keys(EVERY_ANSWER))).toEqual(EVERY_ANSWER)
  })

  it('an API answer, and an API refusal: nothing may load or frame it', async () => {
    for (const reply of [await producer.get('/api/me'), await producer.get('/api/health'), await new (producer.constructor as typeof Client)().get('/api/me')]) {
      expect([200, 401]).toContain(reply.status)
      expect(directives(reply.headers.get('content-security-policy'))).toEqual(API_CSP)
      expect(pick(reply.headers, Object.keys(EVERY_ANSWER))).toEqual(EVERY_ANSWER)
      expect(reply.headers.get('strict-transport-security')).toBeNull()
    }
  })

  it('nuxt-security\'s limiter refuses a body over 2 MB in the app\'s own shape; an import keeps its own 512 KB limit and message', async () => {
    const huge = JSON.stringify({ email: 'a@example.test', password: 'x'.repeat(2_100_000) })
    const refused = await producer.call('POST', '/api/auth/login', huge, { 'content-type': 'application/json' })
    expect(refused.status).toBe(413)
    expect(refused.body.data.code).toBe('too-large')
    expect(refused.body.message).toMatch(/over 2 MB/)
    // A recipe import over 2 MB reaches the app's own reader, which says what to paste instead.
    const page = '<html><body>' + 'a'.repeat(2_200_000) + '</body></html>'
    const imported = await producer.call('POST', `/api/studios/${studioId}/recipes/import?preview=1`, page, { 'content-type': 'text/html' })
    expect(imported.status).toBe(413)
    expect(imported.body.message).toBe(IMPORT_TOO_LARGE)
    // Text with markup in a JSON body is not refused as "XSS" (nuxt-security's validator is off):
    // the server keeps it as text and Vue escapes it when shown.
    const noted = await producer.call('POST', '/api/auth/login', { email: 'nobody@example.test', password: '<b>heat to < 80 °C</b>' })
    expect(noted.status).toBe(401)
  })
})

describe('Strict-Transport-Security when the site URL is https', () => {
  it('is sent on pages and API answers of a site whose URL is https', async () => {
    const port = await serverPort()
    const server = spawn(process.execPath, [resolve(rootDir, '.output/server/index.mjs')], {
      env: {
        ...process.env,
        PORT: String(port),
        HOST: '127.0.0.1',
        NUXT_DATABASE_PATH: tempDatabasePath('hsts'),
        NUXT_DATABASE_SEED: 'never',
        NUXT_PUBLIC_SITE_URL: 'https://studio.example',
        NUXT_SESSION_PASSWORD: 'test-session-password-of-at-least-32-characters',
      },
      stdio: 'ignore',
    })
    try {
      const base = `http://127.0.0.1:${port}`
      let health: Response | undefined
      for (let i = 0; i < 300 && health?.status !== 200; i++) {
        health = await fetch(`${base}/api/health`).catch(() => undefined)
        if (health?.status !== 200) await new Promise((r) => setTimeout(r, 50))
      }
      expect(health?.status).toBe(200)
      expect(health!.headers.get('strict-transport-security')).toBe(HSTS)
      const page = await fetch(`${base}/signin`)
      expect(page.status).toBe(200)
      expect(page.headers.get('strict-transport-security')).toBe(HSTS)
      expect(directives(page.headers.get('content-security-policy'))['frame-ancestors']).toBe("'none'")
    } finally {
      server.kill()
    }
  }, 60_000)
})
