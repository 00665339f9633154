// Fixed-window attempt counters for sign-in and join codes, kept in the server process (one box;
// a scaled-out deployment would move them to the shared store). A tripped limit is a 429 that says
// when to try again, with a Retry-After header.
import type { H3Event } from 'h3'
import { DomainError } from '../../shared/utils/domain-error'

interface Window {
  count: number
  resetAt: number
}

const windows = new Map<string, Window>()

function windowFor(key: string, windowMs: number, now: number): Window {
  let w = windows.get(key)
  if (!w || w.resetAt <= now) {
    w = { count: 0, resetAt: now + windowMs }
    windows.set(key, w)
  }
  return w
}

export function throttleWindowMs(): number {
  return useRuntimeConfig().auth.throttleWindowSeconds * 1000
}

/** Throws a 429 when `key` has used up `limit` attempts in the current window. */
export function assertUnderLimit(event: H3Event, key: string, limit: number, what: string) {
  const now = Date.now()
  const w = windowFor(key, throttleWindowMs(), now)
  if (w.count >= limit) {
    const seconds = Math.max(1, Math.ceil((w.resetAt - now) / 1000))
    setResponseHeader(event, 'Retry-After', seconds)
    const wait = seconds >= 90 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} seconds`
    throw new DomainError('too-many', `Too many ${what}. Try again in ${wait}.`, { data: { retryAfterSeconds: seconds } })
  }
}

export function countAttempt(key: string) {
  windowFor(key, throttleWindowMs(), Date.now()).count++
}

export function clearAttempts(key: string) {
  windows.delete(key)
}

export function clientAddress(event: H3Event): string {
  return getRequestIP(event) ?? 'unknown'
}
