// What a screen can ask of a live shoot, as plain functions `(connection, payload) → result`: the
// socket mount (server/plugins/04.socket.ts) loops over them, and the HTTP routes under
// server/api/shoots/ call the same ones, so a refusal reads the same over either wire. Everything
// they need comes in through the factory: no Nitro, no socket.io, so tests drive them directly.
import type { UserSession } from '#auth-utils'
import type { ShootActor } from '../../shared/types/shoot'
import type { ShootEventMessage, ShootPresence, ShootSnapshot } from '../../shared/types/socket-events'
import { DomainError, isDomainError, refusal, type Refusal } from '../../shared/utils/domain-error'
import type { DeviceRole, StudioRole } from '../../shared/utils/roles'
import { databaseRefusal } from '../db/db-errors'
import { createShootEngine, type CommandOutcome, type ShootEngine } from './engine'
import type { Presence } from './presence'
import type { ShootRow, ShootStore } from './store'
import type { ShootScript } from './script'

/** Who is let into a shoot, as the guard answers it. */
export type ShootCaller =
  | { kind: 'member'; user: { id: number; name: string }; studioId: number; role: StudioRole }
  | { kind: 'device'; studioId: number; shootId: number; role: DeviceRole; codeId: number }

/** One screen's link to the server: a socket, or a single HTTP request (no rooms, no presence). */
export interface ShootConnection {
  id: string
  session: UserSession
  rooms?: { join(shootId: number): unknown; leave(shootId: number): unknown }
}

export interface ShootHandlerDeps {
  store: ShootStore
  /** Membership and 'shoot.read' (the one guard); which role may send which command is the engine's. */
  authorize: (session: UserSession, shootId: number) => Promise<ShootCaller>
  presence: Presence
  broadcast: {
    event: (shootId: number, message: ShootEventMessage) => void
    presence: (shootId: number, presence: ShootPresence) => void
  }
  /** The screens' script of a shoot (cached per shoot, script.ts). */
  script: (row: ShootRow) => Promise<ShootScript>
  engine?: ShootEngine
  now?: () => number
}

export type Result<T> = ({ ok: true } & T) | Refusal

const SERVER_FAULT = 'The server could not do that; nothing changed. Try again.'

export function actorFor(caller: ShootCaller): ShootActor {
  return caller.kind === 'member'
    ? { role: caller.role, id: `user:${caller.user.id}`, name: caller.user.name }
    : { role: caller.role, id: `device:${caller.codeId}`, name: caller.role === 'host' ? 'Host tablet' : 'Camera device' }
}

/** The shoot a payload names, or a refusal that says what to send. */
export function shootIdOf(payload: unknown): number {
  // A number, not text or true that happens to convert to one.
  const id = (payload as { shootId?: unknown } | null)?.shootId
  if (typeof id !== 'number' || !Number.isSafeInteger(id) || id <= 0) throw new DomainError('invalid', 'This screen did not say which shoot it is on; reload the page, or open the shoot again from its episode.', { field: 'shootId' })
  return id
}

/** Runs a handler body; a DomainError becomes its refusal, anything else is logged and hidden. */
async function answer<T extends object>(fn: () => Promise<T>): Promise<Result<T>> {
  try {
    return { ok: true, ...(await fn()) }
  } catch (error) {
    if (isDomainError(error)) return refusal(error)
    const database = databaseRefusal(error)
    if (database) {
      console.warn('[hobline] shoot handler refused by the database:', String(error))
      return refusal(database)
    }
    console.error('[hobline] shoot handler failed:', error)
    return refusal({ code: 'server', message: SERVER_FAULT })
  }
}

export type ShootHandlers = ReturnType<typeof createShootHandlers>

export function createShootHandlers(deps: ShootHandlerDeps) {
  const { store, authorize, presence, broadcast, script, now = Date.now } = deps
  const engine = deps.engine ?? createShootEngine({ store, broadcast: broadcast.event, now })
  const announce = (shootId: number) => broadcast.presence(shootId, presence.of(shootId))

  async function snapshotOf(shootId: number, caller: ShootCaller): Promise<ShootSnapshot> {
    const row = await engine.read(shootId)
    return {
      shoot: { id: row.id, studioId: row.studioId, episodeId: row.episodeId, title: row.title, mode: row.mode },
      state: row.state,
      serverNow: now(),
      you: { kind: caller.kind, role: caller.role, actorId: actorFor(caller).id },
      ...(await script(row)),
      presence: presence.of(shootId),
    }
  }

  return {
    engine,

    /** A screen opens the shoot: it joins the room and gets the whole picture. */
    join: (conn: ShootConnection, payload: unknown) => answer(async () => {
      const shootId = shootIdOf(payload)
      const caller = await authorize(conn.session, shootId)
      if (conn.rooms) {
        await conn.rooms.join(shootId)
        presence.enter(shootId, conn.id, caller.role)
      }
      const snapshot = await snapshotOf(shootId, caller)
      if (conn.rooms) announce(shootId)
      return snapshot
    }),

    /** The whole picture again (a gap in sequence numbers, a reconnect, the page's first fetch). */
    snapshot: (conn: ShootConnection, payload: unknown) => answer(async () => {
      const shootId = shootIdOf(payload)
      return snapshotOf(shootId, await authorize(conn.session, shootId))
    }),

    leave: (conn: ShootConnection, payload: unknown) => answer(async () => {
      const shootId = shootIdOf(payload)
      await conn.rooms?.leave(shootId)
      if (presence.leave(shootId, conn.id)) announce(shootId)
      return {}
    }),

    /** One command: the guard lets the caller into the shoot, the engine decides by role and state. */
    command: (conn: ShootConnection, payload: unknown): Promise<Result<{ seq: number }>> => answer(async () => {
      const shootId = shootIdOf(payload)
      const caller = await authorize(conn.session, shootId)
      const { shootId: _named, ...command } = payload as { shootId: unknown }
      const outcome: CommandOutcome = await engine.apply(shootId, command, actorFor(caller))
      if (!outcome.ok) throw new DomainError(outcome.error.code, outcome.error.message, { field: outcome.error.field })
      return { seq: outcome.seq }
    }),

    /** This screen's alarm setting, so the others know whether anyone rings while rolling. */
    alarm: (conn: ShootConnection, payload: unknown) => answer(async () => {
      const shootId = shootIdOf(payload)
      const audible = (payload as { audibleWhileRolling?: unknown }).audibleWhileRolling
      if (typeof audible !== 'boolean') {
        throw new DomainError('invalid', 'While the camera rolls: choose whether this screen’s alarms ring (true) or stay silent (false).', { field: 'audibleWhileRolling' })
      }
      if (!presence.has(shootId, conn.id)) throw new DomainError('conflict', 'Open the shoot on this screen first.')
      await authorize(conn.session, shootId)
      presence.setAudible(shootId, conn.id, audible)
      announce(shootId)
      return {}
    }),

    /** Clock sync (RFC 5905): the server's receive and send times for the screen's sample. */
    ping: async (_conn: ShootConnection, payload: unknown) => {
      const t2 = now()
      return { t1: Number((payload as { t1?: unknown } | null)?.t1) || 0, t2, t3: now() }
    },

    /** A connection has gone: it leaves every shoot it was on. */
    disconnect(conn: ShootConnection) {
      for (const shootId of presence.leaveAll(conn.id)) announce(shootId)
    },
  }
}
