// The session behind a socket.io connection: the same sealed nuxt-auth-utils cookie the HTTP routes
// read, unsealed from the handshake's Cookie header with h3's own session unsealer; and the limit on
// how fast one socket may send. A member session whose account ended it reads as signed out.
import { parse as parseCookies } from 'cookie-es'
import { unsealSession } from 'h3'
import type { UserSession } from '#auth-utils'
import type { DomainErrorBody } from '../../shared/utils/domain-error'

export async function sessionFromCookieHeader(header: string | undefined): Promise<UserSession> {
  const config = useRuntimeConfig()
  const name = config.session.name || 'nuxt-session'
  const sealed = header ? parseCookies(header)[name] : undefined
  if (!sealed) return { id: '' }
  const password = process.env.NUXT_SESSION_PASSWORD || config.session.password
  try {
    const unsealed = await unsealSession(null as never, { ...config.session, password } as never, sealed)
    const session = { ...(unsealed.data as object), id: String(unsealed.id ?? '') } as UserSession
    // A member session ended by its account (its session version is behind) counts as signed out;
    // every later command is checked again by the guard.
    return (await sessionIsCurrent(session)) ? session : { id: '' }
  } catch {
    // A cookie that is forged, from another secret or expired counts as signed out.
    return { id: '' }
  }
}

/**
 * How many messages one socket may send: a token bucket of `burst` refilled at `perSecond`
 * (HOBLINE_SOCKET_COMMANDS_PER_SECOND and HOBLINE_SOCKET_COMMAND_BURST; the benchmarks raise them
 * to measure the server rather than the limit). A screen's heaviest moment is a clock round of 8
 * pings with its join and snapshot; a producer tapping a control sends a few a second.
 */
export function socketCommandLimit(env: Record<string, string | undefined> = process.env) {
  const read = (value: string | undefined, fallback: number) => {
    const n = Number(value)
    return Number.isFinite(n) && n > 0 ? n : fallback
  }
  return { perSecond: read(env.HOBLINE_SOCKET_COMMANDS_PER_SECOND, 20), burst: read(env.HOBLINE_SOCKET_COMMAND_BURST, 40) }
}

/** A refusal from the limit: the one error shape, with when to try again (as HTTP's Retry-After). */
export interface TooManyRefusal {
  ok: false
  error: DomainErrorBody & { code: 'too-many'; retryAfterSeconds: number }
}

/** One socket's bucket: `take(now)` (monotonic ms) is null while a message may go on, else the refusal to answer with. */
export function createCommandBucket(limit: { perSecond: number; burst: number }) {
  let tokens = limit.burst
  let last = -Infinity
  return {
    take(nowMs: number): TooManyRefusal | null {
      // Time never runs backwards here: a clock stepped back must not take tokens away (pass a monotonic clock).
      tokens = Math.min(limit.burst, tokens + (Number.isFinite(last) ? (Math.max(0, nowMs - last) / 1000) * limit.perSecond : limit.burst))
      last = nowMs
      if (tokens >= 1) {
        tokens -= 1
        return null
      }
      const retryAfterSeconds = Math.ceil(((1 - tokens) / limit.perSecond) * 10) / 10
      return {
        ok: false,
        error: {
          code: 'too-many',
          message: `Too many messages from this screen: at most ${limit.perSecond} a second (${limit.burst} at once). This one was not applied; send it again in ${retryAfterSeconds} s.`,
          retryAfterSeconds,
        },
      }
    },
  }
}
