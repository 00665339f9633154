// The live shoot inside the app: one socket.io server, one shoot store on the database file, the
// handlers every screen's request goes through, and the ticker. Made once, on first use; the
// socket plugin mounts it and the routes under server/api/shoots/ call its handlers.
import type { H3Event } from 'h3'
import { Server } from 'socket.io'
import { createAdapter } from '@socket.io/redis-adapter'
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/types/socket-events'
import { DomainError } from '../../shared/utils/domain-error'
import { shootServerNow } from '../shoot/clock'
import { createShootHandlers, type ShootConnection } from '../shoot/handlers'
import { createPresence } from '../shoot/presence'
import { createSharedPresence } from '../shoot/presence-redis'
import { createScriptCache } from '../shoot/script'
import { openShootStore } from '../shoot/store'
import { openPostgresShootStore } from '../shoot/store-postgres'
import { isServerDatabase } from '../db/dialect'

export const shootRoom = (shootId: number) => `shoot:${shootId}`

function createLiveShoot() {
  const io = new Server<ClientToServerEvents, ServerToClientEvents>({ serveClient: false })
  // The database the configuration names (server/db/dialect.ts): the SQLite file or a PostgreSQL server.
  const address = getDatabaseHandle()!.path
  const store = isServerDatabase(address) ? openPostgresShootStore(address, () => useDb()) : openShootStore(address, () => useDb())
  const script = createScriptCache()
  // With Redis (NUXT_REDIS_URL), rooms and presence reach across app processes: a broadcast to a
  // shoot's room goes to its screens on every process.
  const redis = useRedis()
  if (redis) io.adapter(createAdapter(redis, duplicateRedis()))
  const presence = redis
    ? createSharedPresence({
        redis,
        subscriber: duplicateRedis(),
        // Screens of a process that stopped were taken off: this process's screens hear it.
        changed: (shootId) => io.local.to(shootRoom(shootId)).emit('shoot:presence', { shootId, ...presence.of(shootId) }),
      })
    : createPresence()
  const handlers = createShootHandlers({
    store,
    presence,
    script,
    now: shootServerNow,
    authorize: (session, shootId) => authorizeSession(session, { shootId }, 'shoot.read'),
    broadcast: {
      // `sentAt` (wall clock, sub-millisecond) lets a screen and the benchmark see how long delivery took.
      event: (shootId, message) => io.to(shootRoom(shootId)).emit('shoot:event', { ...message, sentAt: performance.timeOrigin + performance.now() }),
      presence: (shootId, presence) => io.to(shootRoom(shootId)).emit('shoot:presence', { shootId, ...presence }),
    },
  })
  /**
   * After a change that may reach a script (a price, a recipe, an episode, the studio's settings):
   * every open shoot whose script changed gets the new one, so a cost line on an open prompter
   * follows the price. Changes in a burst (an editor's autosave) are gathered into one pass.
   */
  let pending: ReturnType<typeof setTimeout> | null = null
  async function refreshScripts() {
    pending = null
    for (const shootId of presence.open()) {
      try {
        const next = await script.changed(await handlers.engine.read(shootId))
        if (next) io.to(shootRoom(shootId)).emit('shoot:script', { shootId, ...next })
      } catch (error) {
        console.error('[hobline] could not refresh the script of shoot', shootId, error)
      }
    }
  }
  const scriptsMayHaveChanged = () => {
    pending ??= setTimeout(() => void refreshScripts(), 150)
  }
  return { io, store, script, presence, handlers, scriptsMayHaveChanged }
}

let live: ReturnType<typeof createLiveShoot> | undefined

export function useShoot() {
  return (live ??= createLiveShoot())
}

/** The connection of one HTTP request: its session, no room. */
export async function httpConnection(event: H3Event): Promise<ShootConnection> {
  return { id: 'http', session: await currentSession(event) }
}

/** A handler's answer over HTTP: its value, or its refusal thrown for the error handler to send. */
export function httpAnswer<T extends object>(result: ({ ok: true } & T) | { ok: false; error: { code: string; message: string; field?: string } }): T {
  if (!result.ok) throw new DomainError(result.error.code, result.error.message, { field: result.error.field })
  const { ok: _ok, ...value } = result
  return value as unknown as T
}
