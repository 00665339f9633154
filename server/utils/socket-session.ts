// The session behind a socket.io connection: the same sealed nuxt-auth-utils cookie the HTTP routes
// read, unsealed from the handshake's Cookie header with h3's own session unsealer.
import { parse as parseCookies } from 'cookie-es'
import { unsealSession } from 'h3'
import type { UserSession } from '#auth-utils'

export async function sessionFromCookieHeader(header: string | undefined): Promise<UserSession> {
  const config = useRuntimeConfig()
  const name = config.session.name || 'nuxt-session'
  const sealed = header ? parseCookies(header)[name] : undefined
  if (!sealed) return { id: '' }
  const password = process.env.NUXT_SESSION_PASSWORD || config.session.password
  try {
    const unsealed = await unsealSession(null as never, { ...config.session, password } as never, sealed)
    return { ...(unsealed.data as object), id: String(unsealed.id ?? '') } as UserSession
  } catch {
    // A cookie that is forged, from another secret or expired counts as signed out.
    return { id: '' }
  }
}
