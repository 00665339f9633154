// The shoot store (server/shoot/store.ts) on a real SQLite file: a shoot's row takes its whole
// state only every CHECKPOINT_EVERY commands, every event logs its JSON Patch (RFC 6902), and the
// state read is the row's with the later patches applied. A second store opened on the same file
// while the first is never closed stands for the server after a SIGKILL: what it reads is every
// acknowledged command, and its first SQL read brings the rows up to the event log.
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Sequelize } from 'sequelize'
import sqlite3 from 'sqlite3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openDatabase } from '../../server/db/connection'
import { migrate } from '../../server/db/migrator'
import { initModels } from '../../server/db/models'
import { createShootEngine } from '../../server/shoot/engine'
import { CHECKPOINT_EVERY, openShootStore, type ShootStore } from '../../server/shoot/store'
import type { ShootActor } from '../../shared/types/shoot'

const HOST: ShootActor = { role: 'host', id: 'user:1', name: 'Host' }
const RUN_ORDER = [{ id: 'segment-1', title: 'Lentil stew', stepIds: ['11', '12'] }]
let path = ''
let sequelize: Sequelize
const opened: ShootStore[] = []

const rowOf = (id: number) => new Promise<{ seq: number; stateSeq: number; last: number }>((resolve, reject) => {
  const db = new sqlite3.Database(path, sqlite3.OPEN_READONLY)
  db.get(`SELECT seq, json_extract(state, '$.seq') AS stateSeq, (SELECT MAX(seq) FROM shoot_events WHERE shoot_id = ?) AS last FROM shoots WHERE id = ?`,
    [id, id], (err, row) => db.close(() => (err ? reject(err) : resolve(row as never))))
})

beforeAll(async () => {
  path = join(mkdtempSync(join(tmpdir(), 'hobline-store-')), 'hobline.sqlite')
  sequelize = await openDatabase(path)
  initModels(sequelize)
  await migrate(sequelize)
  await sequelize.query(`INSERT INTO studios (id, name, slug, created_at, updated_at) VALUES (1, 'Test kitchen', 'test-kitchen', datetime('now'), datetime('now'))`)
})

afterAll(async () => {
  for (const s of opened) await s.close()
  await sequelize.close()
})

describe('shoot store with patches in the event log', () => {
  it('writes the whole state only every CHECKPOINT_EVERY commands, and a store that was never closed reads every acknowledged one', async () => {
    const first = openShootStore(path)
    let clock = Date.UTC(2026, 11, 3, 9)
    const engine = createShootEngine({ store: first, broadcast: () => {}, now: () => clock })
    const { id } = await engine.create({ studioId: 1, episodeId: null, title: 'Soak', mode: 'rehearsal', createdBy: null, runOrder: RUN_ORDER })
    expect(await engine.apply(id, { type: 'shoot.start' }, HOST)).toMatchObject({ ok: true, seq: 1 })
    const count = CHECKPOINT_EVERY + 10
    for (let n = 0; n < count; n++) {
      clock += 1000
      expect((await engine.apply(id, { type: 'marker.add', kind: 'note', text: `Marker ${n}` }, HOST)).ok).toBe(true)
    }
    const last = 1 + count
    const row = await rowOf(id)
    expect(row.last).toBe(last)
    // The row is behind the log, never ahead of it, and its state is the state at its own seq.
    expect(row.seq).toBeLessThan(last)
    expect(row.seq).toBeGreaterThan(last - CHECKPOINT_EVERY - 1)
    expect(row.stateSeq).toBe(row.seq)
    const live = (await first.read(id))!
    expect(live.seq).toBe(last)
    expect(live.state.markers.filter((m) => m.kind === 'note')).toHaveLength(count)

    // `first` is left open and unflushed, as a killed process leaves the file.
    opened.push(first)
    const second = openShootStore(path)
    opened.push(second)
    const rebuilt = (await second.read(id))!
    expect(rebuilt.seq).toBe(last)
    expect(rebuilt.state).toEqual(JSON.parse(JSON.stringify(live.state)))
    // The restarted server's first SQL read (the ticker's live shoots) writes the rows up to their logs.
    const shoots = await second.live()
    expect(shoots.find((s) => s.id === id)!.state).toEqual(rebuilt.state)
    const caught = await rowOf(id)
    expect([caught.seq, caught.stateSeq]).toEqual([last, last])
  })

  it('a list read (summaries) counts the markers of the commands since the last whole state', async () => {
    const store = openShootStore(path)
    opened.push(store)
    const engine = createShootEngine({ store, broadcast: () => {} })
    const { id } = await engine.create({ studioId: 1, episodeId: null, title: 'Counts', mode: 'rehearsal', createdBy: null, runOrder: RUN_ORDER })
    await engine.apply(id, { type: 'shoot.start' }, HOST)
    for (let n = 0; n < 5; n++) await engine.apply(id, { type: 'marker.add', kind: 'good' }, HOST)
    expect((await rowOf(id)).seq).toBeLessThan(6)
    const [summary] = (await store.summaries({ studioId: 1 })).filter((s) => s.id === id)
    expect(summary!.markerCounts).toEqual({ good: 5 })
  })

  it('an ended shoot has its whole state in its row', async () => {
    const store = openShootStore(path)
    opened.push(store)
    const engine = createShootEngine({ store, broadcast: () => {} })
    const { id } = await engine.create({ studioId: 1, episodeId: null, title: 'Ends', mode: 'rehearsal', createdBy: null, runOrder: RUN_ORDER })
    await engine.apply(id, { type: 'shoot.start' }, HOST)
    await engine.apply(id, { type: 'marker.add', kind: 'good' }, HOST)
    expect((await engine.apply(id, { type: 'shoot.end' }, { ...HOST, role: 'producer' })).ok).toBe(true)
    const row = await rowOf(id)
    expect([row.seq, row.stateSeq]).toEqual([3, 3])
  })
})
