// Fault: the server killed with SIGKILL in the middle of a burst of commands from three screens
// (the producer's desk, the host's tablet, a camera phone). SIGKILL gives the process no clean-up,
// as a power cut or the out-of-memory killer would not. After a restart on the same file the event
// log must hold every command a screen was told was accepted (ack with its seq), in one unbroken
// sequence 1..N; the stored state must agree with the log (its seq is the last event's, and its
// markers are exactly those the log added); a command never acknowledged is either wholly there
// (event and effect) or wholly absent. The file passes SQLite's own check
// (PRAGMA integrity_check answers "ok": https://www.sqlite.org/pragma.html#pragma_integrity_check).
import { afterAll, describe, expect, it } from 'vitest'
import { tempDatabasePath } from '../support/app'
import { signedIn, demo } from '../support/client'
import { joinedSocket, shootOnFile, startFaultApp, startShoot } from '../support/fault-shoot'
import { emitAck, type TestSocket } from '../support/sockets'
import type { SpawnedApp } from '../support/spawned'
import { integrityCheck } from '../support/sqlite'

type Ack = { ok: true; seq: number } | { ok: false; error: { code: string; message: string } }
interface Sent { screen: string; command: Record<string, unknown>; ack?: Ack }

describe('SIGKILL during a burst of commands', () => {
  const databasePath = tempDatabasePath('fault-kill')
  const apps: SpawnedApp[] = []
  const sockets: TestSocket[] = []
  afterAll(async () => {
    sockets.forEach((s) => s.disconnect())
    for (const app of apps) await app.stop()
  })

  it('keeps every acknowledged command, in order, and half of none', async () => {
    const first = await startFaultApp(databasePath)
    apps.push(first)
    const crew = await startShoot(first.base)
    const { shootId } = crew
    const screens = {
      desk: await joinedSocket(crew.producer, shootId),
      tablet: await joinedSocket(crew.host, shootId),
      phone: await joinedSocket(crew.camera, shootId),
    }
    sockets.push(...Object.values(screens))

    // Each screen keeps four commands in flight until the server is gone: markers with their own
    // ids from all three, and the host moving the cursor between them.
    const sent: Sent[] = []
    let killed = false
    const acked = () => sent.filter((s) => s.ack?.ok).length
    const pump = async (screen: keyof typeof screens) => {
      const inFlight = new Set<Promise<void>>()
      for (let i = 0; !killed; i++) {
        const command: Record<string, unknown> = screen === 'tablet' && i % 2
          ? { type: i % 4 === 1 ? 'step.next' : 'step.previous' }
          : { type: 'marker.add', markerId: `${screen}-${i}`, kind: i % 3 ? 'good' : 'note', text: `${screen} burst ${i}` }
        const entry: Sent = { screen, command }
        sent.push(entry)
        const p = emitAck<Ack>(screens[screen], 'shoot:command', { shootId, ...command }).then((ack) => {
          entry.ack = ack
          inFlight.delete(p)
        })
        inFlight.add(p)
        while (inFlight.size >= 4 && !killed) await Promise.race([...inFlight, new Promise((r) => setTimeout(r, 20))])
      }
    }
    const pumps = (['desk', 'tablet', 'phone'] as const).map(pump)
    // Kill mid-burst, once a good number of commands has been accepted.
    const start = Date.now()
    while (acked() < 150 && Date.now() - start < 20_000) await new Promise((r) => setTimeout(r, 5))
    await first.kill('SIGKILL')
    killed = true
    await Promise.all(pumps)
    sockets.forEach((s) => s.disconnect())
    const accepted = sent.filter((s) => s.ack?.ok).map((s) => ({ ...s, seq: (s.ack as { seq: number }).seq }))
    const unanswered = sent.filter((s) => !s.ack)
    console.log(`[faults] SIGKILL after ${Date.now() - start} ms of burst: ${sent.length} sent, ${accepted.length} acknowledged, `
      + `${sent.filter((s) => s.ack && !s.ack.ok).length} refused, ${unanswered.length} unanswered`)
    expect(accepted.length).toBeGreaterThanOrEqual(150)
    expect(unanswered.length).toBeGreaterThan(0)

    // The file as the killed process left it.
    expect(await integrityCheck(databasePath)).toBe('ok')

    // Restarted on the same file.
    const second = await startFaultApp(databasePath)
    apps.push(second)
    const { events, rowSeq, state } = await shootOnFile(databasePath, shootId)
    const last = events.at(-1)!.seq
    // One unbroken sequence from 1, and the state row at the last event: no command half-applied.
    expect(events.map((e) => e.seq)).toEqual(Array.from({ length: last }, (_, i) => i + 1))
    expect(rowSeq).toBe(last)
    expect(state.seq).toBe(last)
    // Every acknowledged command is in the log at the seq it was given, as it was sent.
    const bySeq = new Map(events.map((e) => [e.seq, e]))
    for (const a of accepted) {
      const e = bySeq.get(a.seq)
      expect(e, `acknowledged seq ${a.seq} is in the log`).toBeDefined()
      expect(e!.type).toBe(a.command.type)
      if (a.command.type === 'marker.add') expect(e!.command).toMatchObject({ markerId: a.command.markerId, text: a.command.text })
    }
    expect(last).toBeGreaterThanOrEqual(Math.max(...accepted.map((a) => a.seq)))
    // The state's markers are exactly the log's marker.add commands (state and log agree).
    const loggedMarkers = events.filter((e) => e.type === 'marker.add').map((e) => String(e.command.markerId)).sort()
    expect(state.markers.map((m) => m.id).sort()).toEqual(loggedMarkers)
    expect(new Set(loggedMarkers).size).toBe(loggedMarkers.length)
    // A command never answered: wholly there (one event and its marker) or wholly absent.
    let landed = 0
    for (const u of unanswered.filter((s) => s.command.type === 'marker.add')) {
      const inLog = loggedMarkers.filter((id) => id === u.command.markerId).length
      const inState = state.markers.filter((m) => m.id === u.command.markerId).length
      expect([inLog, inState]).toSatisfy(([l, s]: number[]) => (l === 0 && s === 0) || (l === 1 && s === 1))
      landed += inLog
    }
    console.log(`[faults] after restart: log 1..${last}, ${accepted.length} acknowledged all present, `
      + `${landed} of ${unanswered.length} unanswered commands committed before the kill`)

    // The restarted server serves the same state and goes on from the next seq.
    const producer = await signedIn(demo.producer, undefined, second.base)
    const served = await producer.get(`/api/shoots/${shootId}`)
    expect(served.status).toBe(200)
    expect(served.body.state.seq).toBe(last)
    const desk = await joinedSocket(producer, shootId)
    sockets.push(desk)
    expect(await emitAck(desk, 'shoot:command', { shootId, type: 'marker.add', kind: 'good' })).toEqual({ ok: true, seq: last + 1 })
    await second.stop()
    expect(await integrityCheck(databasePath)).toBe('ok')
  })
})
