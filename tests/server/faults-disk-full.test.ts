// Fault: the disk fills while the server writes. Made deterministic and unprivileged: the built
// server is started under a file-size limit (RLIMIT_FSIZE through util-linux's prlimit; Node ignores
// SIGXFSZ, so a write past the limit fails with EFBIG, as a write to a full disk fails with ENOSPC).
// SQLite answers such a write with SQLITE_FULL or SQLITE_IOERR (https://www.sqlite.org/rescode.html);
// the server must refuse the command in the one error shape with a message a person can act on
// (not a 500, not a crash), keep serving reads, and lose nothing it had saved. PRAGMA
// integrity_check answers "ok" after it (https://www.sqlite.org/pragma.html#pragma_integrity_check).
import { statSync } from 'node:fs'
import { afterAll, describe, expect, it } from 'vitest'
import { DISK_FULL_MESSAGE, DISK_WRITE_MESSAGE } from '../../server/db/db-errors'
import { SHOOT_MARKER_TEXT_MAX } from '../../shared/types/shoot'
import { tempDatabasePath } from '../support/app'
import { joinedSocket, shootOnFile, startFaultApp, startShoot } from '../support/fault-shoot'
import { emitAck, type TestSocket } from '../support/sockets'
import type { SpawnedApp } from '../support/spawned'
import { integrityCheck } from '../support/sqlite'

type Ack = { ok: true; seq: number } | { ok: false; error: { code: string; message: string } }

/** Bytes any file of the server may reach: the write-ahead log can hold a few commands, then no more. */
const FILE_SIZE_LIMIT = 128 * 1024

describe('the disk full while the server writes', () => {
  const databasePath = tempDatabasePath('fault-full')
  const apps: SpawnedApp[] = []
  const sockets: TestSocket[] = []
  afterAll(async () => {
    sockets.forEach((s) => s.disconnect())
    for (const app of apps) await app.stop()
  })

  it('refuses a write that cannot be stored, keeps serving reads and loses nothing saved', async () => {
    // The shoot is made and saved on a free disk; a clean stop folds the log into the file.
    const seeded = await startFaultApp(databasePath)
    apps.push(seeded)
    const crew = await startShoot(seeded.base)
    const { shootId, producer } = crew
    const port = Number(new URL(seeded.base).port)
    await seeded.stop()
    const saved = await shootOnFile(databasePath, shootId)
    expect(statSync(databasePath).size).toBeGreaterThan(FILE_SIZE_LIMIT)

    // Started again under the limit, on the same port (the crew's cookies still hold).
    const full = await startFaultApp(databasePath, {}, { port, wrap: ['prlimit', `--fsize=${FILE_SIZE_LIMIT}`, '--'] })
    apps.push(full)
    const desk = await joinedSocket(producer, shootId)
    sockets.push(desk)
    const acked: Array<{ seq: number; markerId: string }> = []
    let refused: Ack | null = null
    const text = 'Sauce split; take it again from the whisk. '.repeat(20).slice(0, SHOOT_MARKER_TEXT_MAX)
    for (let i = 0; i < 400 && !refused; i++) {
      const markerId = `full-${i}`
      const ack = await emitAck<Ack>(desk, 'shoot:command', { shootId, type: 'marker.add', markerId, kind: 'note', text })
      if (ack.ok) acked.push({ seq: ack.seq, markerId })
      else refused = ack
    }
    console.log(`[faults] under a ${FILE_SIZE_LIMIT / 1024} KiB file-size limit: ${acked.length} commands stored, then ${JSON.stringify(refused)}`)
    expect(refused).not.toBeNull()
    expect(refused!.ok).toBe(false)
    const error = (refused as { error: { code: string; message: string } }).error
    expect(error.code).toBe('storage')
    expect([DISK_FULL_MESSAGE, DISK_WRITE_MESSAGE]).toContain(error.message)

    // Refused again, not crashed; a plain route's write gets the same shape over HTTP (507).
    expect(await emitAck(desk, 'shoot:command', { shootId, type: 'marker.add', kind: 'good' })).toMatchObject({ ok: false, error: { code: 'storage' } })
    // A small write may still fit in the last bytes (as on a real disk): episodes are written until one does not.
    const episodes: number[] = []
    let route = await producer.post('/api/studios/1/episodes', { title: 'Written to a full disk 0' })
    for (let i = 1; route.status === 201 && i < 200; i++) {
      episodes.push(route.body.episode?.id ?? route.body.id)
      route = await producer.post('/api/studios/1/episodes', { title: `Written to a full disk ${i}` })
    }
    console.log(`[faults] then ${episodes.length} small episode writes fitted before ${route.status} ${route.body.message}`)
    expect(route.status).toBe(507)
    expect(route.body).toMatchObject({ statusCode: 507, data: { code: 'storage' } })
    expect([DISK_FULL_MESSAGE, DISK_WRITE_MESSAGE]).toContain(route.body.message)
    // Reads go on: the shoot as last stored, the studio's episodes.
    const served = await producer.get(`/api/shoots/${shootId}`)
    expect(served.status).toBe(200)
    const lastAcked = acked.at(-1)?.seq ?? saved.rowSeq
    expect(served.body.state.seq).toBe(lastAcked)
    expect((await producer.get('/api/studios/1/episodes')).status).toBe(200)
    expect(full.log()).not.toMatch(/SIGXFSZ|core dumped/)
    await full.stop()
    expect(await integrityCheck(databasePath)).toBe('ok')

    // Space again: everything saved is there, in one unbroken log, and the shoot goes on.
    const freed = await startFaultApp(databasePath, {}, { port })
    apps.push(freed)
    const after = await shootOnFile(databasePath, shootId)
    expect(after.events.map((e) => e.seq)).toEqual(Array.from({ length: lastAcked }, (_, i) => i + 1))
    expect(after.rowSeq).toBe(lastAcked)
    expect(after.state.seq).toBe(lastAcked)
    expect(after.events.slice(0, saved.events.length)).toEqual(saved.events)
    for (const a of acked) expect(after.events[a.seq - 1]!.command.markerId).toBe(a.markerId)
    expect(after.state.markers.map((m) => m.id)).toEqual(acked.map((a) => a.markerId))
    const again = await joinedSocket(producer, shootId)
    sockets.push(again)
    expect(await emitAck(again, 'shoot:command', { shootId, type: 'marker.add', kind: 'good' })).toEqual({ ok: true, seq: lastAcked + 1 })
    const kept = await producer.get('/api/studios/1/episodes')
    const keptIds = (kept.body.episodes as Array<{ id: number }>).map((e) => e.id)
    for (const id of episodes) expect(keptIds).toContain(id)
    expect((await producer.post('/api/studios/1/episodes', { title: 'Written once there was space' })).status).toBe(201)
    await freed.stop()
    expect(await integrityCheck(databasePath)).toBe('ok')
  })
})
