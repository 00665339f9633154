// What the guard reads on every shoot command (an account's session version, a membership's role, a
// join code's revocation), kept in memory between changes. Every request that may change them (an
// /api request that is not a read) empties the memory at its start and again once answered, so a role
// changed, a member removed, a code revoked or an account signed out everywhere holds from the next
// command on, as when each command read the database. Only on the embedded SQLite database, where
// this process is the one writer; on a server database another process may change them, so every
// read goes to the database (01.database.ts decides). Measured by `npm run soak` (DEVELOPERS.md).
const kept = new Map<string, unknown>()
/** Bumped by every emptying: a read begun before one must not be kept after it. */
let generation = 0
let keeping = false
/** Enough for every member and device of a busy server; past it reads are not kept. */
const MOST_KEPT = 10_000

export function keepAccessReads(on: boolean) {
  keeping = on
  accessMayHaveChanged()
}

export function accessMayHaveChanged() {
  generation++
  kept.clear()
}

/** `read()` once per `key` until the next change; every time when not keeping. */
export async function accessRead<T>(key: string, read: () => Promise<T>): Promise<T> {
  if (!keeping) return read()
  if (kept.has(key)) return kept.get(key) as T
  const began = generation
  const value = await read()
  if (began === generation && kept.size < MOST_KEPT) kept.set(key, value)
  return value
}

/** Whether a request may change what the guard reads: any method but a read, under /api. */
export function mayChangeAccess(method: string, path: string): boolean {
  return method !== 'GET' && method !== 'HEAD' && method !== 'OPTIONS' && path.startsWith('/api/')
}
