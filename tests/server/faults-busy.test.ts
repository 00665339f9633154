// Fault: the database file held busy by another program (here, a connection of the test process
// holding `BEGIN EXCLUSIVE`, as a backup tool or a sqlite3 shell left open would). The server waits
// for the lock up to its busy timeout (BUSY_TIMEOUT_MS, server/db/connection.ts; SQLite's busy
// handler: https://www.sqlite.org/c3ref/busy_timeout.html), so a short hold only delays a command;
// past it, SQLite answers SQLITE_BUSY (https://www.sqlite.org/rescode.html#busy) and the screen gets
// the one refusal shape saying the database is busy and to try again; nothing is half-written, and
// once the lock is let go commands work again. PRAGMA integrity_check answers "ok" after it
// (https://www.sqlite.org/pragma.html#pragma_integrity_check).
import { afterAll, describe, expect, it } from 'vitest'
import { BUSY_TIMEOUT_MS } from '../../server/db/connection'
import { DATABASE_BUSY_MESSAGE } from '../../server/db/db-errors'
import { tempDatabasePath } from '../support/app'
import { joinedSocket, shootOnFile, startFaultApp, startShoot, type FaultCrew } from '../support/fault-shoot'
import { emitAck, type TestSocket } from '../support/sockets'
import type { SpawnedApp } from '../support/spawned'
import { holdWriteLock, integrityCheck, queryFile } from '../support/sqlite'

type Ack = { ok: true; seq: number } | { ok: false; error: { code: string; message: string } }

describe('the database file held busy by another program', () => {
  const databasePath = tempDatabasePath('fault-busy')
  let app: SpawnedApp
  let crew: FaultCrew
  let desk: TestSocket
  afterAll(async () => {
    desk?.disconnect()
    await app?.stop()
  })

  const timed = async <T>(work: Promise<T>) => {
    const start = performance.now()
    const value = await work
    return { value, ms: performance.now() - start }
  }

  it('waits out a hold shorter than the busy timeout, and the command is applied once', async () => {
    app = await startFaultApp(databasePath)
    crew = await startShoot(app.base)
    desk = await joinedSocket(crew.producer, crew.shootId)
    const before = (await shootOnFile(databasePath, crew.shootId)).logSeq
    const lock = await holdWriteLock(databasePath)
    setTimeout(() => void lock.release(), 1500)
    const { value, ms } = await timed(emitAck<Ack>(desk, 'shoot:command', { shootId: crew.shootId, type: 'marker.add', markerId: 'short-hold', kind: 'good' }))
    console.log(`[faults] command under a 1.5 s hold answered after ${Math.round(ms)} ms`)
    expect(value).toEqual({ ok: true, seq: before + 1 })
    expect(ms).toBeGreaterThan(1000)
    expect(ms).toBeLessThan(BUSY_TIMEOUT_MS)
    const after = await shootOnFile(databasePath, crew.shootId)
    expect(after.events.filter((e) => e.command.markerId === 'short-hold')).toHaveLength(1)
  })

  it('refuses a write held past the busy timeout in the one error shape, keeps reading, and writes again once let go', async () => {
    const { shootId, producer } = crew
    const before = await shootOnFile(databasePath, shootId)
    const episodesBefore = await queryFile<{ n: number }>(databasePath, 'SELECT COUNT(*) AS n FROM episodes')
    const lock = await holdWriteLock(databasePath)
    let refusals: Array<{ ms: number }> = []
    try {
      // A screen's command over the socket, the same over HTTP, and a plain route's write (Sequelize).
      const [socket, http, route, read] = await Promise.all([
        timed(emitAck<Ack>(desk, 'shoot:command', { shootId, type: 'marker.add', markerId: 'long-hold', kind: 'note', text: 'held' })),
        timed(producer.post(`/api/shoots/${shootId}/commands`, { type: 'marker.add', markerId: 'long-hold-http', kind: 'good' })),
        timed(producer.post('/api/studios/1/episodes', { title: 'Written while the file was held' })),
        // Readers go on while another program writes (WAL: https://www.sqlite.org/wal.html).
        timed(producer.get('/api/studios/1/episodes')),
      ])
      refusals = [socket, http, route]
      console.log(`[faults] under a long hold: socket refused after ${Math.round(socket.ms)} ms, HTTP command after ${Math.round(http.ms)} ms, `
        + `episode route after ${Math.round(route.ms)} ms; a read answered in ${Math.round(read.ms)} ms`)
      expect(socket.value).toEqual({ ok: false, error: { code: 'busy', message: DATABASE_BUSY_MESSAGE } })
      for (const reply of [http.value, route.value]) {
        expect(reply.status).toBe(503)
        expect(reply.body).toMatchObject({ statusCode: 503, message: DATABASE_BUSY_MESSAGE, data: { code: 'busy', message: DATABASE_BUSY_MESSAGE } })
      }
      // The route says when to try again (HTTP Retry-After, RFC 9110 §10.2.3).
      expect(route.value.headers.get('retry-after')).toBe('2')
      // Each waited the busy timeout before giving up (SQLite retried meanwhile).
      for (const r of refusals) expect(r.ms).toBeGreaterThanOrEqual(BUSY_TIMEOUT_MS - 200)
      expect(read.value.status).toBe(200)
      expect(read.ms).toBeLessThan(BUSY_TIMEOUT_MS / 2)
    } finally {
      await lock.release()
    }
    // Nothing half-written: the log, the state and the episodes are as they were.
    const after = await shootOnFile(databasePath, shootId)
    expect([after.rowSeq, after.logSeq]).toEqual([before.rowSeq, before.logSeq])
    expect(after.events).toEqual(before.events)
    expect(after.state.markers.map((m) => m.id)).toEqual(before.state.markers.map((m) => m.id))
    expect(await queryFile(databasePath, 'SELECT COUNT(*) AS n FROM episodes')).toEqual(episodesBefore)
    // Let go: the same commands work again.
    expect(await emitAck(desk, 'shoot:command', { shootId, type: 'marker.add', markerId: 'long-hold', kind: 'note', text: 'held' }))
      .toEqual({ ok: true, seq: before.logSeq + 1 })
    expect((await producer.post('/api/studios/1/episodes', { title: 'Written once the file was free' })).status).toBe(201)
    await app.stop()
    expect(await integrityCheck(databasePath)).toBe('ok')
  })
})
