// The live shoot, server side: the shared reducer applied inside a SQLite transaction (on the
// engine's own connection, shoot-store.ts), one command at a time, every accepted command logged
// and broadcast with its sequence number.
// The latest state of each live shoot is kept in memory for the due-timer tick; the database is
// what counts (a restart reloads it, and timers that fell due while the server was down fire).
import type { Database as Sqlite3Database } from 'sqlite3'
import { Episode, EpisodeSegment, Recipe, RecipeStep, Shoot } from '../db/models'
import { shootScript } from './shoot-script'
import type { ShootActor, ShootState } from '../../shared/types/shoot'
import type { ShootEventMessage, ShootPresence, ShootSnapshot } from '../../shared/types/socket-events'
import type { StudioAction } from '../../shared/utils/roles'
import type { Caller } from './guard'

type Broadcast = (shootId: number, message: ShootEventMessage) => void
let broadcast: Broadcast = () => {}
let shootPresence: (shootId: number) => ShootPresence = () => ({ screens: [] })
/** The socket plugin registers how to reach a shoot's room and who is in it. */
export function setShootBroadcast(fn: Broadcast, presence?: (shootId: number) => ShootPresence) {
  broadcast = fn
  if (presence) shootPresence = presence
}

const live = new Map<number, ShootState>()
let queue: Promise<unknown> = Promise.resolve()

/**
 * Runs `fn` after every earlier engine job: commands never interleave, on one shoot or across
 * shoots, since they share the engine's one connection.
 */
function serialised<T>(fn: () => Promise<T>): Promise<T> {
  const next = queue.then(fn, fn)
  queue = next.catch(() => {})
  return next
}

export function commandAction(type: string): StudioAction {
  if (type === 'marker.add') return 'shoot.mark'
  if (type === 'rolling.set') return 'shoot.roll'
  return 'shoot.drive'
}

export function actorFor(caller: Caller): ShootActor {
  return caller.kind === 'member'
    ? { role: caller.role, id: `user:${caller.user.id}`, name: caller.user.name }
    : { role: caller.role, id: `device:${caller.codeId}`, name: caller.role === 'host' ? 'Host tablet' : 'Camera device' }
}

async function runOrderFor(episodeId: number) {
  const segments = await EpisodeSegment.findAll({ where: { episodeId }, order: [['position', 'ASC']] })
  const recipeIds = segments.map((s) => s.recipeId).filter((x): x is number => !!x)
  const recipes = new Map((await Recipe.findAll({ where: { id: recipeIds }, attributes: ['id', 'title'] })).map((r) => [r.id, r.title]))
  const steps = await RecipeStep.findAll({ where: { recipeId: recipeIds }, attributes: ['id', 'recipeId', 'position'], order: [['position', 'ASC']] })
  return segments.map((s) => ({
    id: `segment-${s.id}`,
    title: s.title ?? (s.recipeId ? recipes.get(s.recipeId) : undefined) ?? 'Segment',
    stepIds: steps.filter((st) => st.recipeId === s.recipeId).map((st) => String(st.id)),
  }))
}

export async function createShoot(episodeId: number, studioId: number, mode: 'rehearsal' | 'take', createdBy: number | null) {
  const sequelize = await useDb()
  const episode = await Episode.findByPk(episodeId)
  const runOrder = await runOrderFor(episodeId)
  if (!runOrder.length) throw createError({ statusCode: 400, statusMessage: 'The episode has no segments yet. Add a recipe to it before shooting.' })
  const id = await sequelize.transaction(async () => {
    const row = await Shoot.create({ studioId, episodeId, title: `${episode!.title} — ${mode === 'take' ? 'take' : 'rehearsal'}`, mode, status: 'ready', createdBy })
    const state = createShootState({ id: String(row.id), mode, runOrder })
    await row.update({ state: JSON.stringify(state), seq: state.seq })
    return row.id
  })
  return id
}

async function loadState(shootId: number): Promise<{ row: Shoot; state: ShootState }> {
  const row = await Shoot.findByPk(shootId)
  if (!row) throw createError({ statusCode: 404, statusMessage: 'There is no such shoot.' })
  if (!row.state) throw createError({ statusCode: 409, statusMessage: 'This shoot was made without a run order; start a new shoot from its episode.' })
  return { row, state: JSON.parse(row.state) as ShootState }
}

export async function shootSnapshot(shootId: number, caller: Caller): Promise<ShootSnapshot> {
  await useDb()
  const { row, state } = await loadState(shootId)
  const actor = actorFor(caller)
  return {
    shoot: { id: row.id, studioId: row.studioId, episodeId: row.episodeId ?? null, title: row.title, mode: row.mode },
    state,
    serverNow: Date.now(),
    you: { kind: caller.kind, role: caller.role, actorId: actor.id },
    ...(await shootScript(state, { studioId: row.studioId, episodeId: row.episodeId ?? null })),
    presence: shootPresence(shootId),
  }
}

async function loadStateOn(conn: Sqlite3Database, shootId: number): Promise<ShootState> {
  const row = await shootGet<{ state: string | null }>(conn, 'SELECT state FROM shoots WHERE id = ?', [shootId])
  if (!row) throw createError({ statusCode: 404, statusMessage: 'There is no such shoot.' })
  if (!row.state) throw createError({ statusCode: 409, statusMessage: 'This shoot was made without a run order; start a new shoot from its episode.' })
  return JSON.parse(row.state) as ShootState
}

async function persist(conn: Sqlite3Database, shootId: number, next: ShootState, type: string, command: unknown, actor: ShootActor | null, now: number) {
  const stamp = new Date(now).toISOString().replace('T', ' ').replace('Z', ' +00:00')
  await shootRun(conn, 'UPDATE shoots SET state = ?, seq = ?, status = ?, mode = ?, updated_at = ? WHERE id = ?', [JSON.stringify(next), next.seq, next.status, next.mode, stamp, shootId])
  await shootRun(conn, 'INSERT INTO shoot_events (shoot_id, seq, type, command, actor, server_ms, created_at) VALUES (?, ?, ?, ?, ?, ?, ?)', [shootId, next.seq, type, JSON.stringify(command), JSON.stringify(actor), now, stamp])
}

export type CommandOutcome = { ok: true; seq: number } | { ok: false; error: { code: string; message: string; field?: string } }

/** Applies one command from `caller` (already authorised for the shoot) and broadcasts it. */
export function runShootCommand(shootId: number, command: { type: string; [k: string]: unknown }, caller: Caller): Promise<CommandOutcome> {
  return serialised(async () => {
    const actor = actorFor(caller)
    let message: ShootEventMessage | null = null
    const outcome = await shootTransaction(async (conn): Promise<CommandOutcome> => {
      const state = await loadStateOn(conn, shootId)
      const now = Date.now()
      const result = applyShootCommand(state, command, { nowServerMs: now, actor, newId: () => crypto.randomUUID().slice(0, 12) })
      if (!result.ok) return { ok: false, error: result.error }
      await persist(conn, shootId, result.state, command.type, command, actor, now)
      message = { shootId, seq: result.state.seq, type: command.type, by: actor, events: result.events, state: result.state, serverNow: now }
      return { ok: true, seq: result.state.seq }
    })
    if (message) {
      const m = message as ShootEventMessage
      remember(shootId, m.state)
      broadcast(shootId, m)
    }
    return outcome
  })
}

function remember(shootId: number, state: ShootState) {
  if (state.status === 'ended') live.delete(shootId)
  else live.set(shootId, state)
}

/** Loads every shoot that has not ended, so the tick watches their timers (called at start-up). */
export async function loadLiveShoots() {
  await useDb()
  const rows = await Shoot.findAll({ where: { status: ['ready', 'running', 'paused'] }, attributes: ['id', 'state'] })
  for (const r of rows) if (r.state) remember(r.id, JSON.parse(r.state))
  return rows.length
}

/** Marks due every timer whose deadline has passed, persists and broadcasts it. */
export async function tickDueTimers(now = Date.now()) {
  const candidates = [...live.entries()].filter(([, s]) => s.timers.some((t) => t.state === 'running' && t.deadlineServerMs !== null && t.deadlineServerMs <= now))
  for (const [shootId] of candidates) {
    await serialised(async () => {
      let message: ShootEventMessage | null = null
      await shootTransaction(async (conn) => {
        const state = await loadStateOn(conn, shootId)
        const at = Date.now()
        const { state: next, due } = markDueTimers(state, at)
        if (!due.length) return
        await persist(conn, shootId, next, 'timer.due', { type: 'timer.due', timerIds: due.map((t) => t.id) }, null, at)
        message = {
          shootId, seq: next.seq, type: 'timer.due', by: null, serverNow: at, state: next,
          events: due.map((t) => ({ type: 'timer.due' as const, timerId: t.id, label: t.label, slot: t.slot, sound: t.sound, dueAtServerMs: t.dueAtServerMs ?? at })),
        }
      })
      if (message) {
        const m = message as ShootEventMessage
        remember(shootId, m.state)
        broadcast(shootId, m)
      }
    })
  }
}
