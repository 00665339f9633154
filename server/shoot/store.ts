// The only code that reads or writes the `shoots` and `shoot_events` tables. One sqlite3
// connection of its own, kept open (Sequelize would open one per transaction, which costs more
// than a shoot command's work), and every job on it runs after the one before, through the
// process's one write queue (server/db/write-queue.ts), so a command never interleaves with
// another or with a Sequelize transaction elsewhere. Plain Node: no Nitro, so tests open it on a
// temporary file.
// A command's statements are prepared once and kept (each new statement would cost the sqlite3
// module a prepare and a finalize on its thread pool). A command logs its event with its JSON Patch
// and writes the whole state into the shoot's row only every CHECKPOINT_EVERY commands; the last
// state of each shoot is kept in memory, and a read asks the database for the shoot's last event's
// seq only, rebuilding the state (row + later patches) when another writer has moved it on.
import sqlite3 from 'sqlite3'
import { BUSY_TIMEOUT_MS } from '../db/connection'
import { queueWrite } from '../db/write-queue'
import { startCheckpoints, type Checkpoints } from './wal-checkpoint'
import type { ShootActor, ShootMode, ShootState } from '../../shared/types/shoot'
import { applyShootPatch, type ShootPatchOperation } from '../../shared/utils/shoot-wire'

export interface ShootRow {
  id: number
  studioId: number
  episodeId: number | null
  title: string
  mode: ShootMode
  status: string
  seq: number
  state: ShootState
  createdBy: number | null
}

/**
 * A shoot as a list shows it, read without the whole state: SQLite's JSON functions pick the clock,
 * the times, the marker counts by kind and the pickups and good takes (for openPickups in take-log.ts).
 */
export interface ShootSummaryRow {
  id: number
  studioId: number
  episodeId: number | null
  title: string
  mode: ShootMode
  status: string
  createdAt: string
  startedAtServerMs: number | null
  endedAtServerMs: number | null
  clock: ShootState['clock'] | null
  markerCounts: Record<string, number>
  /** Pickup and good-take markers, with only what openPickups reads. */
  pickupsAndGoods: Array<{ kind: 'pickup' | 'good'; serverMs: number; stepRef: { segmentId: string; stepId: string | null } }>
}

/** What a rehearsal report reads of another rehearsal: the parts stepActuals needs. */
export type ShootTimingParts = Pick<ShootState, 'status' | 'clock' | 'visits' | 'timers' | 'endedAtServerMs'> & {
  id: number
  planSteps: NonNullable<ShootState['plan']>['steps']
}

/** One accepted command (or the server's own timer.due), as the event log keeps it. */
export interface ShootLogEntry {
  type: string
  command: unknown
  actor: ShootActor | null
  serverMs: number
  /** The change as a JSON Patch (RFC 6902) from the state before; with it the row need not take the whole state every time. */
  patch?: ShootPatchOperation[]
}

export interface NewShoot {
  studioId: number
  episodeId: number | null
  title: string
  mode: ShootMode
  createdBy: number | null
  /** The first state, made once the row's id is known. */
  state: (id: number) => ShootState
}

/** What a job may do inside its transaction. */
export interface ShootTx {
  read(shootId: number): Promise<ShootRow | null>
  write(shootId: number, next: ShootState, entry: ShootLogEntry): Promise<void>
}

export interface ShootStore {
  create(input: NewShoot): Promise<ShootRow>
  read(shootId: number): Promise<ShootRow | null>
  studioOf(shootId: number): Promise<number | null>
  /** Shoots that have not ended: the ticker watches their timers. */
  live(): Promise<ShootRow[]>
  /** The shoots of an episode or of a studio, newest first, as a list shows them. */
  summaries(where: { episodeId: number } | { studioId: number }): Promise<ShootSummaryRow[]>
  /** The studio's rehearsals whose plan has a step of one of these recipes: their timing parts only. */
  rehearsalTimings(studioId: number, recipeIds: string[]): Promise<ShootTimingParts[]>
  /** An episode's recordings (take mode), newest first. */
  takesOf(episodeId: number): Promise<ShootRow[]>
  /** The event log of a shoot, in sequence order. */
  events(shootId: number): Promise<Array<ShootLogEntry & { seq: number }>>
  /** BEGIN IMMEDIATE … COMMIT around `fn` (ROLLBACK when it throws), after every earlier job. */
  transaction<T>(fn: (tx: ShootTx) => Promise<T>): Promise<T>
  close(): Promise<void>
}

export type Raw = {
  id: number; studio_id: number; episode_id: number | null; title: string; mode: ShootMode; status: string
  seq: number; state: string; created_by: number | null
}

export const COLUMNS = 'id, studio_id, episode_id, title, mode, status, seq, state, created_by'

export function toRow(r: Raw): ShootRow {
  return {
    id: r.id, studioId: r.studio_id, episodeId: r.episode_id ?? null, title: r.title, mode: r.mode,
    status: r.status, seq: r.seq, state: JSON.parse(r.state) as ShootState, createdBy: r.created_by ?? null,
  }
}

const SUMMARY_SQL = `SELECT s.id, s.studio_id, s.episode_id, s.title, s.mode, s.status, s.created_at,
  json_extract(s.state, '$.startedAtServerMs') AS started, json_extract(s.state, '$.endedAtServerMs') AS ended,
  json_extract(s.state, '$.clock') AS clock,
  (SELECT json_group_object(k, n) FROM (SELECT json_extract(m.value, '$.kind') AS k, count(*) AS n
     FROM json_each(s.state, '$.markers') m WHERE json_extract(m.value, '$.deleted') IS NOT 1 GROUP BY k)) AS counts,
  (SELECT json_group_array(json_object('kind', json_extract(m.value, '$.kind'), 'serverMs', json_extract(m.value, '$.serverMs'),
     'stepRef', json_object('segmentId', json_extract(m.value, '$.stepRef.segmentId'), 'stepId', json_extract(m.value, '$.stepRef.stepId'))))
     FROM json_each(s.state, '$.markers') m
     WHERE json_extract(m.value, '$.kind') IN ('pickup', 'good') AND json_extract(m.value, '$.deleted') IS NOT 1) AS picks
  FROM shoots s`

export type RawSummary = {
  id: number; studio_id: number; episode_id: number | null; title: string; mode: ShootMode; status: string; created_at: string
  started: number | null; ended: number | null; clock: string | null; counts: string | null; picks: string | null
}

export function toSummary(r: RawSummary): ShootSummaryRow {
  return {
    id: r.id, studioId: r.studio_id, episodeId: r.episode_id ?? null, title: r.title, mode: r.mode, status: r.status,
    createdAt: new Date(r.created_at).toISOString(),
    startedAtServerMs: r.started === null ? null : Number(r.started), endedAtServerMs: r.ended === null ? null : Number(r.ended),
    clock: r.clock ? JSON.parse(r.clock) : null, markerCounts: r.counts ? JSON.parse(r.counts) : {},
    pickupsAndGoods: r.picks ? JSON.parse(r.picks) : [],
  }
}

const TIMING_SQL = `SELECT s.id, json_extract(s.state, '$.status') AS status, json_extract(s.state, '$.clock') AS clock,
  json_extract(s.state, '$.visits') AS visits, json_extract(s.state, '$.timers') AS timers,
  json_extract(s.state, '$.endedAtServerMs') AS ended, json_extract(s.state, '$.plan.steps') AS plan_steps
  FROM shoots s WHERE s.studio_id = ? AND s.mode = 'rehearsal'
  AND EXISTS (SELECT 1 FROM json_each(s.state, '$.plan.steps') p WHERE json_extract(p.value, '$.recipe') IN (SELECT value FROM json_each(?)))
  ORDER BY s.id`

type RawTiming = { id: number; status: string; clock: string; visits: string | null; timers: string | null; ended: number | null; plan_steps: string | null }

/** How many shoots' last rows the store keeps in memory: more than a studio runs at once. */
const ROWS_KEPT = 200

/**
 * A shoot's row takes its whole state (tens to hundreds of KB once markers, timers and visits pile
 * up) at most every this many commands, and whenever the shoot ends; every event logs its JSON
 * Patch, so the state in between is the row's with the later patches applied (read). An
 * acknowledged command is its event row, committed with it.
 */
export const CHECKPOINT_EVERY = 64

/** Rows whose stored state is behind their shoot's event log. */
const BEHIND_SQL = 'SELECT s.id FROM shoots s WHERE s.seq < (SELECT MAX(e.seq) FROM shoot_events e WHERE e.shoot_id = s.id)'

/** The timestamp format the rest of the database uses (Sequelize's for SQLite). */
export function sqliteStamp(ms: number): string {
  return new Date(ms).toISOString().replace('T', ' ').replace('Z', ' +00:00')
}

function open(path: string): Promise<sqlite3.Database> {
  return new Promise((resolve, reject) => {
    const conn = new sqlite3.Database(path, sqlite3.OPEN_READWRITE, (err) => {
      if (err) return reject(err)
      conn.configure('busyTimeout', BUSY_TIMEOUT_MS)
      // As connection.ts sets Sequelize's: foreign keys, and with WAL a commit that survives a
      // crashed process without an fsync each time; checkpoints are wal-checkpoint.ts's, not a commit's.
      const checkpoints = path === ':memory:' ? '' : ' PRAGMA wal_autocheckpoint = 0;'
      conn.exec(`PRAGMA foreign_keys = ON; PRAGMA synchronous = NORMAL;${checkpoints}`, (e) => (e ? reject(e) : resolve(conn)))
    })
  })
}

/** `ready` is awaited before the file is first opened (the migrations that make its tables). */
export function openShootStore(path: string, ready: () => Promise<unknown> = async () => {}): ShootStore {
  let db: Promise<sqlite3.Database> | undefined
  let checkpoints: Checkpoints | undefined
  const conn = () => (db ??= ready().then(async () => {
    const opened = await open(path)
    if (path !== ':memory:') checkpoints = startCheckpoints(path)
    return opened
  }))
  const run = async (sql: string, params: unknown[] = []) => {
    const c = await conn()
    return new Promise<number>((resolve, reject) =>
      c.run(sql, params, function (this: sqlite3.RunResult, err) { return err ? reject(err) : resolve(this.lastID) }))
  }
  const get = async <T>(sql: string, params: unknown[] = []) => {
    const c = await conn()
    return new Promise<T | undefined>((resolve, reject) => c.get(sql, params, (err, row) => (err ? reject(err) : resolve(row as T | undefined))))
  }
  const all = async <T>(sql: string, params: unknown[] = []) => {
    const c = await conn()
    return new Promise<T[]>((resolve, reject) => c.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))))
  }

  const statements = new Map<string, sqlite3.Statement>()
  /** Runs a kept statement (all rows, so a SELECT always finishes and holds no read lock). */
  const kept = async <T>(sql: string, params: unknown[] = []) => {
    const c = await conn()
    let statement = statements.get(sql)
    if (!statement) statements.set(sql, statement = c.prepare(sql))
    return new Promise<{ rows: T[]; lastID: number }>((resolve, reject) => {
      if (/^\s*SELECT/i.test(sql)) statement.all(params, (err, rows) => (err ? reject(err) : resolve({ rows: rows as T[], lastID: 0 })))
      else statement.run(params, function (this: sqlite3.RunResult, err) { return err ? reject(err) : resolve({ rows: [], lastID: this.lastID }) })
    })
  }

  /** The last row of each shoot read or committed on this connection (the most recent ones; an ended shoot's is not kept). */
  const rows = new Map<number, ShootRow>()
  /** The seq of the state in each of those shoots' rows in the table (the row may be behind the shoot: see CHECKPOINT_EVERY). */
  const stored = new Map<number, number>()
  const keep = (row: ShootRow, storedSeq?: number) => {
    rows.delete(row.id)
    if (storedSeq !== undefined) stored.set(row.id, storedSeq)
    if (row.status === 'ended') return stored.delete(row.id)
    rows.set(row.id, row)
    if (rows.size > ROWS_KEPT) {
      const oldest = rows.keys().next().value!
      rows.delete(oldest)
      stored.delete(oldest)
    }
  }
  const forget = (shootId: number) => {
    rows.delete(shootId)
    stored.delete(shootId)
  }
  /** The shoot now: its row's state with the patches of the events logged after it applied in order. */
  const read = async (shootId: number): Promise<ShootRow | null> => {
    const known = rows.get(shootId)
    if (known) {
      const [head] = (await kept<{ seq: number | null }>('SELECT MAX(seq) AS seq FROM shoot_events WHERE shoot_id = ?', [shootId])).rows
      if ((head?.seq ?? known.seq) === known.seq) return known
    }
    const [r] = (await kept<Raw>(`SELECT ${COLUMNS} FROM shoots WHERE id = ?`, [shootId])).rows
    if (!r) return (forget(shootId), null)
    const row = toRow(r)
    const later = (await kept<{ seq: number; patch: string | null }>('SELECT seq, patch FROM shoot_events WHERE shoot_id = ? AND seq > ? ORDER BY seq', [shootId, r.seq])).rows
    let state = row.state
    for (const e of later) {
      if (e.patch === null) throw new Error(`shoot ${shootId}: event ${e.seq} is after the stored state and has no patch`)
      state = applyShootPatch(state, JSON.parse(e.patch) as ShootPatchOperation[])
      if (state.seq !== e.seq) throw new Error(`shoot ${shootId}: event ${e.seq}'s patch leads to seq ${state.seq}`)
    }
    const now = { ...row, state, seq: state.seq, status: state.status, mode: state.mode }
    keep(now, r.seq)
    return now
  }
  const writeRow = (shootId: number, state: ShootState, stamp: string) => kept('UPDATE shoots SET state = ?, seq = ?, status = ?, mode = ?, updated_at = ? WHERE id = ?',
    [JSON.stringify(state), state.seq, state.status, state.mode, stamp, shootId])
  /** Rows written by the transaction under way (and the seq stored in the table): kept once it commits, forgotten if it rolls back. */
  let written = new Map<number, { row: ShootRow; storedSeq?: number }>()
  const tx: ShootTx = {
    read: async (shootId) => written.get(shootId)?.row ?? read(shootId),
    async write(shootId, next, entry) {
      const stamp = sqliteStamp(entry.serverMs)
      const before = written.get(shootId)?.row ?? rows.get(shootId) ?? await read(shootId)
      const storedSeq = written.get(shootId)?.storedSeq ?? stored.get(shootId)
      // The whole state goes into the row when the shoot ends, when there is no patch to log, and every CHECKPOINT_EVERY commands.
      const checkpoint = !entry.patch || storedSeq === undefined || next.status === 'ended' || next.mode !== before?.mode
        || next.seq - storedSeq >= CHECKPOINT_EVERY
      if (checkpoint) await writeRow(shootId, next, stamp)
      await kept('INSERT INTO shoot_events (shoot_id, seq, type, command, actor, server_ms, created_at, patch) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
        [shootId, next.seq, entry.type, JSON.stringify(entry.command), JSON.stringify(entry.actor), entry.serverMs, stamp,
          entry.patch ? JSON.stringify(entry.patch) : null])
      const row = before && { ...before, state: next, seq: next.seq, status: next.status, mode: next.mode }
      if (row) written.set(shootId, { row, storedSeq: checkpoint ? next.seq : storedSeq })
    },
  }
  // Jobs on this one connection run one after another: a read between a transaction's BEGIN and
  // COMMIT would see its writes before they are committed. Reads wait only for this connection;
  // transactions also take their turn in the process's write queue.
  let chain: Promise<unknown> = Promise.resolve()
  const studios = new Map<number, number>()
  const queued = <T>(fn: () => Promise<T>): Promise<T> => {
    const next = chain.then(fn, fn)
    chain = next.catch(() => {})
    return next
  }

  function transaction<T>(fn: (t: ShootTx) => Promise<T>): Promise<T> {
    return queueWrite(() => queued(async () => {
      await kept('BEGIN IMMEDIATE')
      written = new Map()
      try {
        const result = await fn(tx)
        await kept('COMMIT')
        for (const { row, storedSeq } of written.values()) keep(row, storedSeq)
        return result
      } catch (error) {
        await kept('ROLLBACK').catch(() => {})
        for (const id of written.keys()) forget(id)
        throw error
      } finally {
        written = new Map()
      }
    }))
  }

  /** Writes the whole state into every row behind its shoot's event log (this process's or another's), so SQL reads of the table see it. */
  async function catchUp() {
    const behind = await queued(() => all<{ id: number }>(BEHIND_SQL))
    if (!behind.length) return
    await transaction(async () => {
      for (const { id } of behind) {
        const row = await read(id)
        if (!row) continue
        await writeRow(id, row.state, sqliteStamp(Date.now()))
        written.set(id, { row, storedSeq: row.seq })
      }
    })
  }

  return {
    transaction,
    read: (shootId) => queued(() => read(shootId)),
    // A shoot never changes studio: read once, then from memory (the guard asks on every event).
    async studioOf(shootId) {
      const known = studios.get(shootId)
      if (known !== undefined) return known
      const r = await queued(() => get<{ studio_id: number }>('SELECT studio_id FROM shoots WHERE id = ?', [shootId]))
      if (r) studios.set(shootId, r.studio_id)
      return r?.studio_id ?? null
    },
    // What reads the table with SQL first brings every row up to its event log.
    live: () => catchUp().then(() => queued(async () => (await all<Raw>(`SELECT ${COLUMNS} FROM shoots WHERE status IN ('ready', 'running', 'paused')`)).map(toRow))),
    summaries: (where) => catchUp().then(() => queued(async () => {
      const [column, value] = 'episodeId' in where ? ['episode_id', where.episodeId] : ['studio_id', where.studioId]
      return (await all<RawSummary>(`${SUMMARY_SQL} WHERE s.${column} = ? ORDER BY s.id DESC`, [value])).map(toSummary)
    })),
    rehearsalTimings: (studioId, recipeIds) => catchUp().then(() => queued(async () => (
      await all<RawTiming>(TIMING_SQL, [studioId, JSON.stringify(recipeIds)])).map((r) => ({
      id: r.id, status: r.status as ShootState['status'], clock: JSON.parse(r.clock), visits: r.visits ? JSON.parse(r.visits) : [],
      timers: r.timers ? JSON.parse(r.timers) : [], endedAtServerMs: r.ended === null ? null : Number(r.ended),
      planSteps: r.plan_steps ? JSON.parse(r.plan_steps) : [],
    })))),
    takesOf: (episodeId) => catchUp().then(() => queued(async () => (await all<Raw>(
      `SELECT ${COLUMNS} FROM shoots WHERE episode_id = ? AND mode = 'take' ORDER BY id DESC`, [episodeId],
    )).map(toRow))),
    events: (shootId) => queued(async () => (await all<{ seq: number; type: string; command: string; actor: string; server_ms: number }>(
      'SELECT seq, type, command, actor, server_ms FROM shoot_events WHERE shoot_id = ? ORDER BY seq', [shootId],
    )).map((e) => ({ seq: e.seq, type: e.type, command: JSON.parse(e.command), actor: JSON.parse(e.actor), serverMs: Number(e.server_ms) }))),
    create(input) {
      return transaction(async () => {
        const stamp = sqliteStamp(Date.now())
        const id = await run(
          'INSERT INTO shoots (studio_id, episode_id, title, mode, status, state, seq, created_by, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
          [input.studioId, input.episodeId, input.title, input.mode, 'ready', '{}', 0, input.createdBy, stamp, stamp],
        )
        const state = input.state(id)
        await run('UPDATE shoots SET state = ?, seq = ?, status = ? WHERE id = ?', [JSON.stringify(state), state.seq, state.status, id])
        return (await read(id))!
      })
    },
    async close() {
      if (db) await catchUp().catch((error) => console.error('[hobline] the shoot rows could not be brought up to their event log on close:', error))
      const c = await db
      db = undefined
      await checkpoints?.stop()
      checkpoints = undefined
      await Promise.all([...statements.values()].map((st) => new Promise<void>((resolve) => st.finalize(() => resolve()))))
      statements.clear()
      rows.clear()
      await new Promise<void>((resolve) => (c ? c.close(() => resolve()) : resolve()))
    },
  }
}
