// The shoot store (the ShootStore of store.ts, the same promises) on a PostgreSQL server, for more
// than one app process. Its own pool of connections; the `state` column stays JSON text as on
// SQLite, read inside with PostgreSQL's jsonb operators. Transactions run side by side, each on
// its own connection: the shoot's row is read with SELECT … FOR UPDATE, so two commands (or two
// processes' tickers marking the same timer due) on one shoot take turns, and the second sees what
// the first committed.
import pg from 'pg'
import { poolMax } from '../db/connection-postgres'
import type { ShootState } from '../../shared/types/shoot'
import { COLUMNS, toRow, toSummary, type Raw, type RawSummary, type ShootStore, type ShootTx } from './store'

const SUMMARY_SQL = `SELECT s.id, s.studio_id, s.episode_id, s.title, s.mode, s.status, s.created_at,
  s.state::jsonb ->> 'startedAtServerMs' AS started, s.state::jsonb ->> 'endedAtServerMs' AS ended,
  (s.state::jsonb -> 'clock')::text AS clock,
  (SELECT json_object_agg(k, n)::text FROM (SELECT m ->> 'kind' AS k, count(*) AS n
     FROM jsonb_array_elements(COALESCE(s.state::jsonb -> 'markers', '[]')) m
     WHERE (m -> 'deleted') IS DISTINCT FROM 'true'::jsonb GROUP BY 1) c) AS counts,
  (SELECT json_agg(json_build_object('kind', m -> 'kind', 'serverMs', m -> 'serverMs',
     'stepRef', json_build_object('segmentId', m #> '{stepRef,segmentId}', 'stepId', m #> '{stepRef,stepId}')))::text
     FROM jsonb_array_elements(COALESCE(s.state::jsonb -> 'markers', '[]')) m
     WHERE m ->> 'kind' IN ('pickup', 'good') AND (m -> 'deleted') IS DISTINCT FROM 'true'::jsonb) AS picks
  FROM shoots s`

const TIMING_SQL = `SELECT s.id, s.state::jsonb ->> 'status' AS status, (s.state::jsonb -> 'clock')::text AS clock,
  (s.state::jsonb -> 'visits')::text AS visits, (s.state::jsonb -> 'timers')::text AS timers,
  (s.state::jsonb ->> 'endedAtServerMs')::bigint AS ended, (s.state::jsonb #> '{plan,steps}')::text AS plan_steps
  FROM shoots s WHERE s.studio_id = $1 AND s.mode = 'rehearsal'
  AND EXISTS (SELECT 1 FROM jsonb_array_elements(COALESCE(s.state::jsonb #> '{plan,steps}', '[]')) p WHERE p ->> 'recipe' = ANY($2::text[]))
  ORDER BY s.id`

type RawTiming = { id: number; status: string; clock: string; visits: string | null; timers: string | null; ended: number | null; plan_steps: string | null }

type Runner = { query: pg.Pool['query'] }

/** `ready` is awaited before the first connection (the migrations that make the tables). */
export function openPostgresShootStore(url: string, ready: () => Promise<unknown> = async () => {}): ShootStore {
  let pool: Promise<pg.Pool> | undefined
  const conn = () => (pool ??= ready().then(() => new pg.Pool({ connectionString: url, max: poolMax() })))
  const all = async <T>(sql: string, params: unknown[] = [], on?: Runner) => (await (on ?? (await conn())).query(sql, params)).rows as T[]

  const read = async (shootId: number, on?: Runner, lock = false) => {
    const [r] = await all<Raw>(`SELECT ${COLUMNS} FROM shoots WHERE id = $1${lock ? ' FOR UPDATE' : ''}`, [shootId], on)
    return r ? toRow(r) : null
  }
  const txOn = (client: pg.PoolClient): ShootTx => ({
    read: (shootId) => read(shootId, client, true),
    async write(shootId, next, entry) {
      const stamp = new Date(entry.serverMs).toISOString()
      await client.query('UPDATE shoots SET state = $1, seq = $2, status = $3, mode = $4, updated_at = $5 WHERE id = $6',
        [JSON.stringify(next), next.seq, next.status, next.mode, stamp, shootId])
      await client.query('INSERT INTO shoot_events (shoot_id, seq, type, command, actor, server_ms, created_at) VALUES ($1, $2, $3, $4, $5, $6, $7)',
        [shootId, next.seq, entry.type, JSON.stringify(entry.command), JSON.stringify(entry.actor), entry.serverMs, stamp])
    },
  })

  async function transaction<T>(fn: (tx: ShootTx, client: pg.PoolClient) => Promise<T>): Promise<T> {
    const client = await (await conn()).connect()
    try {
      await client.query('BEGIN')
      const result = await fn(txOn(client), client)
      await client.query('COMMIT')
      return result
    } catch (error) {
      await client.query('ROLLBACK').catch(() => {})
      throw error
    } finally {
      client.release()
    }
  }

  const studios = new Map<number, number>()
  return {
    transaction: (fn) => transaction((tx) => fn(tx)),
    read: (shootId) => read(shootId),
    // A shoot never changes studio: read once, then from memory (the guard asks on every event).
    async studioOf(shootId) {
      const known = studios.get(shootId)
      if (known !== undefined) return known
      const [r] = await all<{ studio_id: number }>('SELECT studio_id FROM shoots WHERE id = $1', [shootId])
      if (r) studios.set(shootId, r.studio_id)
      return r?.studio_id ?? null
    },
    live: async () => (await all<Raw>(`SELECT ${COLUMNS} FROM shoots WHERE status IN ('ready', 'running', 'paused')`)).map(toRow),
    async summaries(where) {
      const [column, value] = 'episodeId' in where ? ['episode_id', where.episodeId] : ['studio_id', where.studioId]
      return (await all<RawSummary>(`${SUMMARY_SQL} WHERE s.${column} = $1 ORDER BY s.id DESC`, [value])).map(toSummary)
    },
    rehearsalTimings: async (studioId, recipeIds) => (await all<RawTiming>(TIMING_SQL, [studioId, recipeIds])).map((r) => ({
      id: r.id, status: r.status as ShootState['status'], clock: JSON.parse(r.clock), visits: r.visits ? JSON.parse(r.visits) : [],
      timers: r.timers ? JSON.parse(r.timers) : [], endedAtServerMs: r.ended === null ? null : Number(r.ended),
      planSteps: r.plan_steps ? JSON.parse(r.plan_steps) : [],
    })),
    takesOf: async (episodeId) => (await all<Raw>(
      `SELECT ${COLUMNS} FROM shoots WHERE episode_id = $1 AND mode = 'take' ORDER BY id DESC`, [episodeId],
    )).map(toRow),
    events: async (shootId) => (await all<{ seq: number; type: string; command: string; actor: string; server_ms: number }>(
      'SELECT seq, type, command, actor, server_ms FROM shoot_events WHERE shoot_id = $1 ORDER BY seq', [shootId],
    )).map((e) => ({ seq: e.seq, type: e.type, command: JSON.parse(e.command), actor: JSON.parse(e.actor), serverMs: Number(e.server_ms) })),
    create(input) {
      return transaction(async (_tx, client) => {
        const stamp = new Date().toISOString()
        const [{ id }] = (await client.query<{ id: number }>(
          `INSERT INTO shoots (studio_id, episode_id, title, mode, status, state, seq, created_by, created_at, updated_at)
           VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10) RETURNING id`,
          [input.studioId, input.episodeId, input.title, input.mode, 'ready', '{}', 0, input.createdBy, stamp, stamp],
        )).rows as [{ id: number }]
        const state = input.state(id)
        await client.query('UPDATE shoots SET state = $1, seq = $2, status = $3 WHERE id = $4', [JSON.stringify(state), state.seq, state.status, id])
        return (await read(id, client))!
      })
    },
    async close() {
      const p = await pool
      pool = undefined
      await p?.end()
    },
  }
}
