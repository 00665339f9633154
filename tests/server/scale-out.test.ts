// More than one machine: two built app processes on one PostgreSQL database and one Redis, both
// real servers started here from Debian's packages (tests/support/servers.ts). A command sent to one
// process reaches the screens on the other (socket.io's Redis adapter); who is on the shoot is known
// on both (presence in Redis); sign-in attempts are counted together (RateLimiterRedis); a timer
// started on a process that is then killed still rings, once, from the other (live-watch.ts, and
// the due-marking transaction's SELECT … FOR UPDATE); and the migrations give the same tables and
// columns on SQLite and on PostgreSQL, up, down and up again.
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import pg from 'pg'
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { startDatabase } from '../../server/db'
import { openDatabase } from '../../server/db/connection'
import { DEMO_PASSWORD } from '../../server/db/demo'
import { createMigrator, migrate } from '../../server/db/migrator'
import { migrations } from '../../server/db/migrations'
import { createShootEngine } from '../../server/shoot/engine'
import { openShootStore, type ShootStore } from '../../server/shoot/store'
import { openPostgresShootStore } from '../../server/shoot/store-postgres'
import { connectTo, ProcessClient, startAppProcess, type AppProcess } from '../support/app-process'
import { demo } from '../support/client'
import { startPostgres, startRedis, type RunningServer } from '../support/servers'
import { emitAck, waitFor, type TestSocket } from '../support/sockets'

type Screen = TestSocket & { presences: Array<{ shootId: number; screens: Array<{ role: string }> }> }

describe('more than one app process: PostgreSQL and Redis', () => {
  let redis: RunningServer
  let postgres: Awaited<ReturnType<typeof startPostgres>>
  let a: AppProcess
  let b: AppProcess
  let db: pg.Client
  let shootId: number
  let episodeId: number
  const producer = new ProcessClient()
  const host = new ProcessClient()
  const screens: Screen[] = []
  const screen = async (app: AppProcess, client: ProcessClient) => {
    const s = (await connectTo(app, client)) as Screen
    screens.push(s)
    return s
  }

  beforeAll(async () => {
    ;[redis, postgres] = await Promise.all([startRedis(), startPostgres()])
    // Migrate and seed the demo studio on the server database, as `npm run db:seed` does, before any app process starts.
    const started = await startDatabase(postgres.url, true)
    expect(started.seeded).toBe(true)
    await started.sequelize.close()
    const env = { NUXT_DATABASE_URL: postgres.url, NUXT_REDIS_URL: redis.url, NUXT_AUTH_LOGIN_PER_EMAIL: '3' }
    ;[a, b] = await Promise.all([startAppProcess(env), startAppProcess(env)])
    db = new pg.Client({ connectionString: postgres.url })
    await db.connect()
    for (const [client, email, app] of [[producer, demo.producer, a], [host, demo.host, b]] as const) {
      const res = await client.call(app, 'POST', '/api/auth/login', { email, password: DEMO_PASSWORD })
      expect(res.status).toBe(200)
    }
    const episodes = (await producer.call(a, 'GET', '/api/studios/1/episodes')).body.episodes
    episodeId = episodes[0].id
    const shoot = await producer.call(a, 'POST', `/api/episodes/${episodeId}/shoots`, { mode: 'rehearsal' })
    expect(shoot.status).toBe(201)
    shootId = shoot.body.shoot.id
  }, 240_000)

  afterAll(async () => {
    for (const s of screens) s.disconnect()
    await db?.end()
    await Promise.all([a?.stop(), b?.stop()])
    await Promise.all([redis?.stop(), postgres?.stop()])
  }, 60_000)

  it('runs both processes on the server database: health names PostgreSQL, every migration applied', async () => {
    for (const app of [a, b]) {
      const health = await (await fetch(`${app.base}/api/health`)).json()
      expect(health.database).toEqual({ server: `127.0.0.1:${postgres.port}/hobline`, dialect: 'postgres' })
      expect(health.migrations).toEqual({ applied: migrations.map((m) => m.name), pending: [], migrated: true })
    }
  })

  it('sends a command made on process A to a screen on process B, in order, and both know who is on the shoot', async () => {
    const onA = await screen(a, producer)
    const onB = await screen(b, host)
    expect((await emitAck(onA, 'shoot:join', { shootId })).ok).toBe(true)
    const joined = await emitAck<{ ok: boolean } & ShootSnapshot>(onB, 'shoot:join', { shootId })
    expect(joined.ok).toBe(true)
    // Presence in Redis: the screen on A hears that the host joined on B, and the other way round.
    await waitFor(() => onA.presences.some((p) => p.screens.map((s) => s.role).sort().join() === 'host,producer'), 5000)
    await waitFor(() => onB.presences.some((p) => p.screens.map((s) => s.role).sort().join() === 'host,producer'), 5000)

    const before = joined.state.seq
    const acks = [
      await emitAck(onA, 'shoot:command', { shootId, type: 'shoot.start' }),
      await emitAck(onA, 'shoot:command', { shootId, type: 'step.next' }),
      await emitAck(onB, 'shoot:command', { shootId, type: 'step.next' }),
    ]
    expect(acks.map((x) => x.seq)).toEqual([before + 1, before + 2, before + 3])
    for (const s of [onA, onB]) {
      await waitFor(() => s.received.filter((m) => m.seq > before).length >= 3, 5000)
      expect(s.received.filter((m) => m.seq > before).map((m) => [m.seq, m.type, m.by?.role]))
        .toEqual([[before + 1, 'shoot.start', 'producer'], [before + 2, 'step.next', 'producer'], [before + 3, 'step.next', 'host']])
    }
    const stored = await db.query('SELECT seq, type FROM shoot_events WHERE shoot_id = $1 AND seq > $2 ORDER BY seq', [shootId, before])
    expect(stored.rows).toEqual([{ seq: before + 1, type: 'shoot.start' }, { seq: before + 2, type: 'step.next' }, { seq: before + 3, type: 'step.next' }])
  })

  it('rings a timer once while both processes watch it', async () => {
    const onA = screens[0]!
    const onB = screens[1]!
    const started = await emitAck(onA, 'shoot:command', { shootId, type: 'timer.start', label: 'Both watch', durationMs: 3000 })
    expect(started.ok).toBe(true)
    const due = await waitFor(() => onB.received.find((m) => m.type === 'timer.due' && m.events.some((e) => e.type === 'timer.due' && e.label === 'Both watch')), 8000)
    const timerId = (due.events[0] as { timerId: string }).timerId
    await new Promise((r) => setTimeout(r, 1500))
    // Both tickers tried; the row read under lock let only one mark it due.
    const rows = await db.query(`SELECT seq FROM shoot_events WHERE shoot_id = $1 AND type = 'timer.due' AND command::jsonb -> 'timerIds' ? $2`, [shootId, timerId])
    expect(rows.rows).toHaveLength(1)
    expect(onB.received.filter((m) => m.type === 'timer.due' && m.events.some((e) => 'timerId' in e && e.timerId === timerId))).toHaveLength(1)
  })

  it('counts sign-in attempts for one e-mail across both processes (limit 3)', async () => {
    const stranger = new ProcessClient()
    const tries = []
    for (const app of [a, b, a, b]) tries.push((await stranger.call(app, 'POST', '/api/auth/login', { email: 'nobody@example.test', password: 'wrong-password-1' })).status)
    expect(tries).toEqual([401, 401, 401, 429])
  })

  it('reads the shoot list, the rehearsal report and the shopping list from the server database (jsonb, GREATEST)', async () => {
    const onA = screens[0]!
    // The pickup comes last, after the good takes: it is still open (openPickups reads the picks list made with jsonb).
    for (const marker of [{ kind: 'good' }, { kind: 'flub' }, { kind: 'note', text: 'Steam on the lens' }, { kind: 'good' }, { kind: 'pickup' }]) {
      expect((await emitAck(onA, 'shoot:command', { shootId, type: 'marker.add', ...marker })).ok).toBe(true)
    }
    const list = await producer.call(b, 'GET', `/api/episodes/${episodeId}/shoots`)
    expect(list.status).toBe(200)
    const row = list.body.shoots.find((r: { id: number }) => r.id === shootId)
    expect(row).toMatchObject({ mode: 'rehearsal', status: 'running', started: true, markers: { good: 2, pickup: 1, flub: 1, note: 1 }, pickupsOpen: 1 })
    const report = await producer.call(b, 'GET', `/api/shoots/${shootId}/report`)
    expect(report.status).toBe(200)
    expect(report.body.recipes.length).toBeGreaterThan(0)

    const shopping = await producer.call(b, 'GET', `/api/episodes/${episodeId}/shopping`)
    const key = shopping.body.lines[0].key as string
    const on = await producer.call(b, 'PUT', `/api/episodes/${episodeId}/shopping/checks/${key}`, { ticked: true })
    const off = await producer.call(a, 'PUT', `/api/episodes/${episodeId}/shopping/checks/${key}`, { ticked: false })
    expect([on.status, off.status]).toEqual([200, 200])
    expect(on.body.lines.find((l: { key: string }) => l.key === key).check).toMatchObject({ by: expect.any(String) })
    expect(off.body.lines.find((l: { key: string }) => l.key === key).check).toBeNull()
    const stored = await db.query('SELECT ticked, at FROM shopping_checks WHERE episode_id = $1 AND line_key = $2', [episodeId, key])
    expect(stored.rows).toEqual([{ ticked: false, at: expect.any(Number) }])
  })

  it('rings a timer started on process A after A is killed (SIGKILL): the screen on B hears it and it is stored', async () => {
    const onA = screens[0]!
    const onB = screens[1]!
    const started = await emitAck<{ ok: boolean; seq: number }>(onA, 'shoot:command', { shootId, type: 'timer.start', label: 'Flatbread rest', durationMs: 4000 })
    expect(started.ok).toBe(true)
    const message = await waitFor(() => onB.received.find((m) => m.seq === started.seq), 3000)
    const timer = message.state.timers.find((t) => t.label === 'Flatbread rest' && t.state === 'running')!
    a.child.kill('SIGKILL')
    await a.exited

    const due = await waitFor(() => onB.received.find((m) => m.type === 'timer.due' && m.events.some((e) => 'timerId' in e && e.timerId === timer.id)), 10_000)
    // Within the reload period (2 s) and a tick of its deadline, never before it.
    expect(due.serverNow).toBeGreaterThanOrEqual(timer.deadlineServerMs!)
    expect(due.serverNow - timer.deadlineServerMs!).toBeLessThan(3000)
    console.info(`[scale-out] the timer of the killed process rang on the other ${due.serverNow - timer.deadlineServerMs!} ms after its deadline`)
    const row = await db.query('SELECT state FROM shoots WHERE id = $1', [shootId])
    expect(JSON.parse(row.rows[0].state).timers.find((t: { id: string }) => t.id === timer.id).state).toBe('due')
    const events = await db.query(`SELECT seq FROM shoot_events WHERE shoot_id = $1 AND type = 'timer.due' AND command::jsonb -> 'timerIds' ? $2`, [shootId, timer.id])
    expect(events.rows.map((r) => r.seq)).toEqual([due.seq])
    // B still serves: a fresh snapshot has the timer due.
    const snap = await emitAck<ShootSnapshot>(onB, 'shoot:snapshot', { shootId })
    expect(snap.state.timers.find((t) => t.id === timer.id)!.state).toBe('due')
  })
})

describe('the same migrations on SQLite and on PostgreSQL', () => {
  let postgres: Awaited<ReturnType<typeof startPostgres>>
  let sqlite: Sequelize
  let server: Sequelize

  beforeAll(async () => {
    postgres = await startPostgres()
    sqlite = await openDatabase(join(mkdtempSync(join(tmpdir(), 'hobline-migrations-')), 'hobline.sqlite'))
    server = await openDatabase(postgres.admin('hobline_fresh'))
  }, 120_000)

  afterAll(async () => {
    await Promise.all([sqlite?.close(), server?.close()])
    await postgres?.stop()
  })

  /** Every table (the migrations' record left out) with its columns: name, primary key or whether null is allowed. */
  async function schema(sequelize: Sequelize) {
    const q = sequelize.getQueryInterface()
    const tables = ((await q.showAllTables()) as Array<string | { tableName: string }>)
      .map((t) => (typeof t === 'string' ? t : t.tableName)).filter((t) => t !== 'hobline_migrations').sort()
    const out: Record<string, string[]> = {}
    for (const table of tables) {
      const columns = await q.describeTable(table)
      // A primary key is never null; SQLite's table_info reports its nullability loosely, so a key is just "key".
      out[table] = Object.entries(columns).map(([name, c]) => `${name}${c.primaryKey ? ' key' : c.allowNull ? '' : ' not null'}`).sort()
    }
    return out
  }

  it('applies every migration on both, giving the same tables and columns', async () => {
    const [onFile, onServer] = await Promise.all([migrate(sqlite), migrate(server)])
    expect(onFile).toEqual({ applied: migrations.map((m) => m.name), pending: [] })
    expect(onServer).toEqual(onFile)
    const [fileSchema, serverSchema] = await Promise.all([schema(sqlite), schema(server)])
    expect(Object.keys(fileSchema)).toHaveLength(20)
    expect(serverSchema).toEqual(fileSchema)
  })

  it('migrates a fresh server database once when two processes start on it together', async () => {
    const url = postgres.admin('hobline_together')
    const [one, two] = await Promise.all([openDatabase(url), openDatabase(url)])
    try {
      const states = await Promise.all([migrate(one), migrate(two)])
      expect(states).toEqual([{ applied: migrations.map((m) => m.name), pending: [] }, { applied: migrations.map((m) => m.name), pending: [] }])
    } finally {
      await Promise.all([one.close(), two.close()])
    }
  })

  it('takes every migration down and up again on both', async () => {
    for (const sequelize of [sqlite, server]) {
      const before = await schema(sequelize)
      await createMigrator(sequelize).down({ to: 0 })
      expect(await schema(sequelize)).toEqual({})
      expect(await migrate(sequelize)).toEqual({ applied: migrations.map((m) => m.name), pending: [] })
      expect(await schema(sequelize)).toEqual(before)
    }
  })
})

describe('the shoot store on PostgreSQL, as two app processes use it', () => {
  const RUN_ORDER = [{ id: 'segment-1', title: 'Lentil stew', stepIds: ['11', '12'] }]
  const PRODUCER = { role: 'producer', id: 'user:1' } as const
  let postgres: Awaited<ReturnType<typeof startPostgres>>
  let sequelize: Sequelize
  let sqlite: Sequelize
  let sqlitePath: string
  const stores: ShootStore[] = []
  let clock = Date.UTC(2026, 11, 3, 9, 0, 0)
  const now = () => clock
  const engineOn = (store: ShootStore) => createShootEngine({ store, broadcast: () => {}, now })
  const newShoot = (engine: ReturnType<typeof engineOn>) =>
    engine.create({ studioId: 1, episodeId: null, title: 'Thursday rehearsal', mode: 'rehearsal', createdBy: null, runOrder: RUN_ORDER })

  beforeAll(async () => {
    postgres = await startPostgres()
    sequelize = await openDatabase(postgres.url)
    await migrate(sequelize)
    await sequelize.query(`INSERT INTO studios (id, name, slug, created_at, updated_at) VALUES (1, 'Test kitchen', 'test-kitchen', NOW(), NOW())`)
    sqlitePath = join(mkdtempSync(join(tmpdir(), 'hobline-store-')), 'hobline.sqlite')
    sqlite = await openDatabase(sqlitePath)
    await migrate(sqlite)
    await sqlite.query(`INSERT INTO studios (id, name, slug, created_at, updated_at) VALUES (1, 'Test kitchen', 'test-kitchen', datetime('now'), datetime('now'))`)
    stores.push(openPostgresShootStore(postgres.url), openPostgresShootStore(postgres.url), openShootStore(sqlitePath))
  }, 120_000)

  afterAll(async () => {
    for (const store of stores) await store.close()
    await Promise.all([sequelize?.close(), sqlite?.close()])
    await postgres?.stop()
  })

  it('keeps every command two processes send at once to one shoot, in consecutive sequence numbers', async () => {
    const [a, b] = [engineOn(stores[0]!), engineOn(stores[1]!)]
    const { id } = await newShoot(a)
    expect((await a.apply(id, { type: 'shoot.start' }, PRODUCER)).ok).toBe(true)
    const outcomes = await Promise.all(Array.from({ length: 40 }, (_, n) =>
      (n % 2 ? a : b).apply(id, { type: 'marker.add', kind: n % 4 ? 'good' : 'note', text: `Take ${n}` }, PRODUCER)))
    expect(outcomes.every((o) => o.ok)).toBe(true)
    expect(outcomes.map((o) => (o.ok ? o.seq : 0)).sort((x, y) => x - y)).toEqual(Array.from({ length: 40 }, (_, n) => n + 2))
    expect((await stores[1]!.events(id)).map((e) => e.seq)).toEqual(Array.from({ length: 41 }, (_, n) => n + 1))
    const row = (await stores[0]!.read(id))!
    expect(row.seq).toBe(41)
    expect(row.state.markers).toHaveLength(40)
  })

  it('marks a timer due once when both processes tick at the same moment; the second learned of it by reading the live shoots', async () => {
    const [a, b] = [engineOn(stores[0]!), engineOn(stores[1]!)]
    const { id } = await newShoot(a)
    await a.apply(id, { type: 'shoot.start' }, PRODUCER)
    expect((await a.apply(id, { type: 'timer.start', label: 'Dough rest', durationMs: 60_000 }, PRODUCER)).ok).toBe(true)
    expect(await b.loadLive()).toBeGreaterThan(0)
    clock += 61_000
    const ticked = await Promise.all([a.tick(), b.tick(), a.tick(), b.tick()])
    expect(ticked.every((n) => n >= 0)).toBe(true)
    const due = (await stores[0]!.events(id)).filter((e) => e.type === 'timer.due')
    expect(due).toHaveLength(1)
    expect((await stores[1]!.read(id))!.state.timers.find((t) => t.label === 'Dough rest')!.state).toBe('due')
  })

  it('lists a shoot as the SQLite store does: marker counts and pickups read with jsonb', async () => {
    const rows = []
    for (const store of [stores[0]!, stores[2]!]) {
      const engine = engineOn(store)
      const { id } = await newShoot(engine)
      const at = clock
      for (const command of [{ type: 'shoot.start' }, { type: 'marker.add', kind: 'pickup' }, { type: 'marker.add', kind: 'good' },
        { type: 'marker.add', kind: 'flub' }, { type: 'marker.add', kind: 'pickup' }, { type: 'shoot.end' }]) {
        clock += 1000
        expect((await engine.apply(id, command, PRODUCER)).ok, JSON.stringify(command)).toBe(true)
      }
      clock = at
      const [summary] = (await store.summaries({ studioId: 1 })).filter((s) => s.id === id)
      rows.push({ ...summary!, id: 0, createdAt: '' })
    }
    expect(rows[0]!.markerCounts).toEqual({ pickup: 2, good: 1, flub: 1 })
    expect(rows[0]!.pickupsAndGoods.map((p) => p.kind)).toEqual(['pickup', 'good', 'pickup'])
    expect(rows[0]).toEqual(rows[1])
  })
})
