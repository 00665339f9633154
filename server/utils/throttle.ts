// Attempt limits for everything that checks a secret or sends mail to a stranger: sign-in (per e-mail
// and per client address), invite accept, join codes, password-reset requests (per e-mail and per
// address) and sign-up. rate-limiter-flexible keeps the counts.
//
// A point is CONSUMED BEFORE the secret is checked, so concurrent guesses cannot all pass the check
// and then be counted; a success gives its point back (`refund`), so only failures use up a limit.
// A used-up limit is a 429 in the one error shape that says when to try again (Retry-After header).
//
// The counts live in this process's memory (RateLimiterMemory; its expiry timers are unref'd, so they
// never keep a process alive), or in Redis when NUXT_REDIS_URL is set (RateLimiterRedis), so several
// app processes behind one address count together (`limiterFor`; DEVELOPERS.md, "Rate limits").
import type { H3Event } from 'h3'
import { RateLimiterMemory, RateLimiterRedis, RateLimiterRes, type RateLimiterAbstract } from 'rate-limiter-flexible'
import { DomainError } from '../../shared/utils/domain-error'

export type LimitName = 'loginEmail' | 'loginAddress' | 'inviteAddress' | 'join' | 'resetEmail' | 'resetAddress' | 'signup'

/** Each limit's size in the runtime config (`auth.*`, NUXT_AUTH_*), and what the refusal calls the attempts. */
const LIMITS: Record<LimitName, { points: (auth: AuthLimits) => number; what: string }> = {
  loginEmail: { points: (a) => a.loginPerEmail, what: 'sign-in attempts for' },
  loginAddress: { points: (a) => a.loginPerAddress, what: 'sign-in attempts from this network' },
  inviteAddress: { points: (a) => a.loginPerAddress, what: 'invite attempts from this network' },
  join: { points: (a) => a.joinPerAddress, what: 'join-code attempts from this device' },
  resetEmail: { points: (a) => a.resetPerEmail, what: 'reset mails for' },
  resetAddress: { points: (a) => a.resetPerAddress, what: 'reset requests from this network' },
  signup: { points: (a) => a.signupPerAddress, what: 'new accounts from this network' },
}

interface AuthLimits {
  throttleWindowSeconds: number
  loginPerEmail: number
  loginPerAddress: number
  joinPerAddress: number
  resetPerEmail: number
  resetPerAddress: number
  signupPerAddress: number
}

function positive(value: unknown, fallback: number): number {
  const n = Number(value)
  return Number.isFinite(n) && n > 0 ? Math.floor(n) : fallback
}

const limiters = new Map<LimitName, RateLimiterAbstract>()

/**
 * The limiter of one limit, made on first use from the runtime config: in Redis (shared by every app
 * process, keys `hobline:limit:<name>:<key>`) when NUXT_REDIS_URL is set, else in memory. Every
 * caller goes through this function.
 */
function limiterFor(name: LimitName): RateLimiterAbstract {
  let limiter = limiters.get(name)
  if (!limiter) {
    const auth = useRuntimeConfig().auth as unknown as AuthLimits
    const size = { points: positive(LIMITS[name].points(auth), 1), duration: positive(auth.throttleWindowSeconds, 900) }
    const redis = useRedis()
    const memory = new RateLimiterMemory({ keyPrefix: name, ...size })
    // With Redis out of reach, each process counts in its own memory until it is back.
    limiter = redis ? new RateLimiterRedis({ storeClient: redis, keyPrefix: `hobline:limit:${name}`, ...size, insuranceLimiter: memory }) : memory
    limiters.set(name, limiter)
  }
  return limiter
}

export function waitWords(seconds: number): string {
  return seconds >= 90 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} ${seconds === 1 ? 'second' : 'seconds'}`
}

/**
 * Uses one attempt of `name` for `key` (an e-mail or a client address), or throws the 429 when
 * none is left. Call it BEFORE checking the password or code. `label` ends the message for the
 * per-e-mail limits ("… for camera@example.test").
 */
export async function consumeAttempt(event: H3Event, name: LimitName, key: string, label = ''): Promise<void> {
  try {
    await limiterFor(name).consume(key)
  } catch (refused) {
    if (!(refused instanceof RateLimiterRes)) throw refused
    const seconds = Math.max(1, Math.ceil(refused.msBeforeNext / 1000))
    setResponseHeader(event, 'Retry-After', seconds)
    const what = label ? `${LIMITS[name].what} ${label}` : LIMITS[name].what
    throw new DomainError('too-many', `Too many ${what}. Try again in ${waitWords(seconds)}.`, { data: { retryAfterSeconds: seconds } })
  }
}

/** Gives back the attempt a success used (only failures count against a limit). */
export async function refundAttempt(name: LimitName, key: string): Promise<void> {
  await limiterFor(name).reward(key, 1)
}

/** Forgets every attempt of `key` (a successful sign-in clears its e-mail's failures). */
export async function clearAttempts(name: LimitName, key: string): Promise<void> {
  await limiterFor(name).delete(key)
}

/** The requester's address, with X-Forwarded-For believed only from a trusted proxy (NUXT_TRUSTED_PROXIES). */
export function clientAddress(event: H3Event): string {
  const peer = event.node.req.socket?.remoteAddress
  const forwarded = event.node.req.headers['x-forwarded-for']
  return clientAddressFrom(peer, Array.isArray(forwarded) ? forwarded.join(',') : forwarded, String(useRuntimeConfig().trustedProxies ?? ''))
}
