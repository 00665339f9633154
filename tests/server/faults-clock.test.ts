// Fault: the server machine's clock steps by a minute while timers run (an NTP correction, or a
// clock set by hand). libfaketime (Debian's faketime package) is loaded into the built server with
// FAKETIME_TIMESTAMP_FILE, re-read on every call (FAKETIME_NO_CACHE=1), so the test can step the
// wall clock while the monotonic clock runs on (FAKETIME_DONT_FAKE_MONOTONIC=1); see libfaketime's
// README, https://github.com/wolfcw/libfaketime#readme.
// The right behaviour: a kitchen timer neither gains nor loses the minute. A timer of 8 s rings 8 s
// (real, measured here on the monotonic clock) after it was started, whether the wall clock stepped
// forward or back meanwhile; and the server clock the screens sync to (RFC 5905 samples over
// clock:ping, shared/utils/clock.ts) does not jump, so a screen's countdown stays right.
// Before the server clock moved on the monotonic clock (shared/utils/steady-clock.ts), deadlines
// were wall-clock ms: the +60 s step rang the first timer at once, 60 s early, and the -60 s step
// held the second a minute late.
import { existsSync, readdirSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { clockFilterAdd, clockFilterBest, ntpSample, type ClockSample } from '../../shared/utils/clock'
import { timerRemainingMs } from '../../shared/utils/shoot-timers'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { tempDatabasePath } from '../support/app'
import { joinedSocket, shootOnFile, startFaultApp, startShoot } from '../support/fault-shoot'
import { emitAck, waitFor, type TestSocket } from '../support/sockets'
import type { SpawnedApp } from '../support/spawned'
import { integrityCheck } from '../support/sqlite'

/** Debian's libfaketime for threaded programs, under the machine's multiarch folder (x86_64-linux-gnu, aarch64-linux-gnu, …). */
const LIBFAKETIME = readdirSync('/usr/lib').map((d) => join('/usr/lib', d, 'faketime/libfaketimeMT.so.1')).find((f) => existsSync(f))
const TIMER_MS = 8000
const MIN = 60_000

/** The offset of the server clock from this process's clock, from 8 pings (RFC 5905 §8, lowest delay §10). */
async function serverOffset(socket: TestSocket): Promise<ClockSample> {
  let samples: ClockSample[] = []
  for (let i = 0; i < 8; i++) {
    const t1 = Date.now()
    const reply = await emitAck<{ t2: number; t3: number }>(socket, 'clock:ping', { t1 })
    if (!Number.isFinite(reply.t2)) throw new Error(`clock:ping was not answered with times: ${JSON.stringify(reply)}`)
    const { t2, t3 } = reply
    samples = clockFilterAdd(samples, ntpSample(t1, t2, t3, Date.now()))
  }
  return clockFilterBest(samples)!
}

describe('the server clock stepping by a minute while timers run', () => {
  if (!LIBFAKETIME) throw new Error('libfaketime is needed: /usr/lib/<arch>/faketime/libfaketimeMT.so.1 (apt-get install faketime; .ci/run installs it)')
  const databasePath = tempDatabasePath('fault-clock')
  const stepFile = join(dirname(databasePath), 'clock-step')
  let app: SpawnedApp
  let host: TestSocket
  afterAll(async () => {
    host?.disconnect()
    await app?.stop()
  })

  /** The server's own wall clock minus this process's, from the HTTP Date header (whole seconds). */
  const wallStep = async () => {
    const res = await fetch(`${app.base}/api/health`)
    return new Date(res.headers.get('date')!).getTime() - Date.now()
  }

  it('rings each timer at its true duration, and the screens\' server clock does not jump', async () => {
    writeFileSync(stepFile, '+0\n')
    app = await startFaultApp(databasePath, {
      LD_PRELOAD: LIBFAKETIME, FAKETIME_TIMESTAMP_FILE: stepFile, FAKETIME_NO_CACHE: '1', FAKETIME_DONT_FAKE_MONOTONIC: '1',
    })
    const crew = await startShoot(app.base)
    const { shootId } = crew
    host = await joinedSocket(crew.host, shootId)
    const offsetBefore = await serverOffset(host)
    expect(Math.abs(await wallStep())).toBeLessThan(1500)

    const dueAt = new Map<string, number>()
    host.on('shoot:event', (m) => {
      for (const e of m.events) if (e.type === 'timer.due') dueAt.set(e.timerId, performance.now())
    })
    /** Starts a timer: when it was sent and when the server's answer came (the server's start lies between). */
    const start = async (timerId: string, label: string) => {
      const sent = performance.now()
      const ack = await emitAck<{ ok: boolean }>(host, 'shoot:command', { shootId, type: 'timer.start', timerId, label, durationMs: TIMER_MS })
      expect(ack.ok).toBe(true)
      return { sent, acked: performance.now() }
    }
    const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

    // Timer A runs; 2 s in, the wall clock steps 60 s forward.
    const startedA = await start('caramel', 'Caramel')
    await sleep(2000)
    writeFileSync(stepFile, '+60\n')
    const forward = await wallStep()
    const offsetForward = await serverOffset(host)
    // The screen's countdown of A, read from its server clock, still has about 6 s to go.
    const snapForward = await emitAck<ShootSnapshot>(host, 'shoot:snapshot', { shootId })
    const leftA = timerRemainingMs(snapForward.state.timers.find((t) => t.id === 'caramel')!, Date.now() + offsetForward.offset)
    const elapsedA = performance.now() - startedA.sent

    // Timer B starts after the step; 2 s in, the wall clock steps 60 s back.
    const startedB = await start('custard', 'Custard')
    await sleep(2000)
    writeFileSync(stepFile, '+0\n')
    const back = await wallStep()
    const offsetBack = await serverOffset(host)

    await waitFor(() => dueAt.has('caramel') && dueAt.has('custard'), 3 * TIMER_MS)
    const ringA = dueAt.get('caramel')! - startedA.acked
    const ringB = dueAt.get('custard')! - startedB.acked
    console.log(`[faults] wall clock stepped ${Math.round(forward / 1000)} s then ${Math.round((back - forward) / 1000)} s; `
      + `server clock offset ${Math.round(offsetBefore.offset)} → ${Math.round(offsetForward.offset)} → ${Math.round(offsetBack.offset)} ms; `
      + `8 s timers rang after ${Math.round(ringA)} ms (step +60 s) and ${Math.round(ringB)} ms (step −60 s); A showed ${Math.round(leftA)} ms left after ${Math.round(elapsedA)} ms`)

    // The wall clock of the server really stepped (HTTP Date has whole seconds).
    expect(Math.abs(forward - MIN)).toBeLessThan(2000)
    expect(Math.abs(back)).toBeLessThan(2000)
    // The server clock the screens sync to did not move with it.
    expect(Math.abs(offsetForward.offset - offsetBefore.offset)).toBeLessThan(250)
    expect(Math.abs(offsetBack.offset - offsetBefore.offset)).toBeLessThan(250)
    expect(Math.abs(leftA - (TIMER_MS - elapsedA))).toBeLessThan(500)
    // Each timer rang at its duration: never before it had run since it was sent, and late only by
    // the ticker's quarter second and the trip.
    for (const [startedAt, ring] of [[startedA, ringA], [startedB, ringB]] as const) {
      expect(ring + startedAt.acked - startedAt.sent).toBeGreaterThanOrEqual(TIMER_MS)
      expect(ring).toBeLessThan(TIMER_MS + 1000)
    }
    // As stored: due exactly its duration after its start, on the server clock. Read once the server
    // has stopped: while it runs the row takes the whole state only every few commands (store.ts,
    // CHECKPOINT_EVERY), and closing brings it up to the event log.
    await app.stop()
    const { state, rowSeq, logSeq } = await shootOnFile(databasePath, shootId)
    expect(rowSeq).toBe(logSeq)
    for (const id of ['caramel', 'custard']) {
      const t = state.timers.find((x) => x.id === id)!
      expect(t.state).toBe('due')
      expect(t.dueAtServerMs! - t.startedAtServerMs!).toBe(TIMER_MS)
    }
    expect(await integrityCheck(databasePath)).toBe('ok')
  })
})
