// A tiny HTTP client for server tests: one cookie jar per person, raw status and headers kept; it
// sends the app's own Origin, as the app's pages do.
import { url } from '@nuxt/test-utils/e2e'
import { DEMO_PASSWORD } from '../../server/db/demo'

/**
 * A decoded JSON reply when the test names no type. Server tests read reply bodies field by field and
 * assert on them, so the default stays loose on purpose; name a type (`get<{ id: number }>(…)`) where it helps.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the one loose type for untyped JSON replies, see above
export type Json = any

export interface Reply<T = Json> {
  status: number
  body: T
  headers: Headers
}

/**
 * The Origin header of a page of the app under test. The server refuses a cookie-carrying change that
 * does not name its origin (server/utils/same-origin.ts); this client speaks for the app's own pages.
 */
export function appOrigin(): string {
  return new URL(url('/')).origin
}

export class Client {
  cookie = ''

  /** `base`: the address of a server the test started itself (spawned.ts); default, the file's built app. */
  constructor(readonly base?: string) {}

  url(path: string): string {
    return this.base ? new URL(path, this.base).href : url(path)
  }

  origin(): string {
    return this.base ? new URL(this.base).origin : appOrigin()
  }

  async call<T = Json>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
    const res = await fetch(this.url(path), {
      method,
      headers: {
        accept: 'application/json',
        origin: this.origin(),
        ...(body !== undefined && typeof body !== 'string' ? { 'content-type': 'application/json' } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
      redirect: 'manual',
    })
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))
    if (setCookie) this.cookie = setCookie.split(';')[0]!
    const text = await res.text()
    let parsed: unknown = text
    try {
      parsed = text ? JSON.parse(text) : null
    } catch {
      // not JSON: the body stays the raw text
    }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get = <T = Json>(path: string) => this.call<T>('GET', path)
  post = <T = Json>(path: string, body?: unknown) => this.call<T>('POST', path, body ?? {})
  put = <T = Json>(path: string, body?: unknown) => this.call<T>('PUT', path, body ?? {})
  patch = <T = Json>(path: string, body?: unknown) => this.call<T>('PATCH', path, body ?? {})
  delete = <T = Json>(path: string) => this.call<T>('DELETE', path)
}

export async function signedIn(email: string, password = DEMO_PASSWORD, base?: string): Promise<Client> {
  const client = new Client(base)
  const res = await client.post('/api/auth/login', { email, password })
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return client
}

export const demo = {
  producer: 'producer@brackenford.test',
  host: 'host@brackenford.test',
  camera: 'camera@brackenford.test',
  viewer: 'viewer@brackenford.test',
} as const

let counter = 0
export function uniqueEmail(label: string) {
  return `${label}-${Date.now().toString(36)}-${++counter}@example.test`
}

/** Mail the server sent, read straight from the catcher's table (for mail with no studio, such as resets). */
export function linkIn(text: string, path: string): string {
  const m = new RegExp(`https?://[^\\s"<>]+${path}[^\\s"<>]*`).exec(text)
  if (!m) throw new Error(`no ${path} link in: ${text.slice(0, 300)}`)
  return new URL(m[0]).pathname
}
