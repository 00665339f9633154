// npm run soak — the live shoot under a studio's worth of load, on loopback, bounded in count and
// time: 500 socket.io screens over 50 shoots (producer, host, camera and 7 viewers each) and 200
// commands a second spread over them, beside a bare socket.io broadcast and a bare SQLite insert
// loop measured in the same run. Prints each figure with its ratio to its baseline and PASS/FAIL
// against the bounds; exits 1 on FAIL. Options: --quick (20 s), --seconds N, --shoots N,
// --screens N, --rate N, --burst N (or HOBLINE_SOAK_SECONDS, _SHOOTS, _SCREENS, _RATE, _BURST).
import { monitorEventLoopDelay } from 'node:perf_hooks'
import { isDeepStrictEqual, parseArgs } from 'node:util'
import type { Socket } from 'socket.io-client'
import sqlite3 from 'sqlite3'
import type { ShootState } from '../shared/types/shoot'
import type { ShootEventMessage, ShootSnapshot } from '../shared/types/socket-events'
import { applyShootMessage } from '../shared/utils/shoot-wire'
import { DEMO_PASSWORD } from '../server/db/demo'
import { signIn, startBuiltApp } from './server'
import { bareBroadcast, bareInserts } from './soak-baselines'
import { openSocket, paced, sampleProcess, type SoakShape } from './soak-clients'
import { percentile } from './types'

const { values: args } = parseArgs({
  options: {
    quick: { type: 'boolean' }, seconds: { type: 'string' }, shoots: { type: 'string' }, screens: { type: 'string' },
    rate: { type: 'string' }, burst: { type: 'string' },
  },
})
const option = (name: string, fallback: number) => {
  const n = Number(args[name as keyof typeof args] ?? process.env[`HOBLINE_SOAK_${name.toUpperCase()}`])
  return Number.isFinite(n) && n > 0 ? n : fallback
}
const shape: SoakShape = {
  shoots: option('shoots', 50), screens: Math.max(4, option('screens', 10)), rate: option('rate', 200), seconds: option('seconds', args.quick ? 20 : 150),
}
const burstSeconds = option('burst', args.quick ? 2 : 5)
const BOUNDS = { p99Ms: 50, rssMb: 300 }
const ACK_TIMEOUT_MS = 5000
const log = (m: string) => console.error(`[soak] ${new Date().toISOString().slice(11, 19)} ${m}`)

// Screen 0 is the producer, 1 the host, 2 the camera, the rest viewers.
const PRODUCER = 0, HOST = 1, CAMERA = 2
/** Screens of a shoot that build its state from the patches (see the shoot:event listener). */
const BUILDERS = 4
/** One shoot's commands in turn: markers, steps, a timer started, paused, resumed and cancelled, roll and cut, pause and resume. */
function commandAt(g: number, n: number): { by: number; command: Record<string, unknown> } {
  const k = Math.floor(n / 12)
  const timerId = `soak-${g}-${k}`
  const cycle: Array<[number, Record<string, unknown>]> = [
    [CAMERA, { type: 'marker.add', kind: 'good' }],
    [HOST, { type: 'step.next' }],
    [HOST, { type: 'timer.start', timerId, label: 'Stock on the back burner', durationMs: 20 * 60_000 }],
    [CAMERA, { type: 'rolling.set', rolling: true }],
    [PRODUCER, { type: 'marker.add', kind: 'note', text: `Take ${k}: keep the steam in frame` }],
    [HOST, { type: 'timer.pause', timerId }],
    [HOST, { type: 'step.previous' }],
    [HOST, { type: 'timer.resume', timerId }],
    [CAMERA, { type: 'rolling.set', rolling: false }],
    [HOST, { type: 'timer.cancel', timerId }],
    [HOST, { type: 'shoot.pause' }],
    [HOST, { type: 'shoot.resume' }],
  ]
  const [by, command] = cycle[n % cycle.length]!
  return { by, command }
}

interface Screen { socket: Socket; state: ShootState | null; seq: number }
type Reply = { ok: true; seq: number } | { ok: false; error: { code: string; message: string } }

const errors = { refused: 0, timedOut: 0, disconnected: 0, missing: 0, gaps: 0, diverged: 0, unsent: 0 }
const refusals = new Map<string, number>()

async function main() {
  log(`${shape.shoots} shoots × ${shape.screens} screens, ${shape.rate} commands/s for ${shape.seconds} s, then ${burstSeconds} s flat out`)
  const app = await startBuiltApp()
  const cookies = await Promise.all(['producer', 'host', 'camera', 'viewer'].map((r) => signIn(app.url, `${r}@brackenford.test`, DEMO_PASSWORD)))
  const cookieOf = (screen: number) => cookies[Math.min(screen, 3)]!
  const shootIds: number[] = []
  for (let g = 0; g < shape.shoots; g++) {
    const res = await fetch(`${app.url}/api/episodes/1/shoots`, {
      method: 'POST', headers: { cookie: cookies[0]!, origin: app.url, 'content-type': 'application/json' }, body: JSON.stringify({ mode: 'rehearsal' }),
    })
    if (!res.ok) throw new Error(`a shoot could not be made: ${res.status} ${await res.text()}`)
    shootIds.push(((await res.json()) as { shoot: { id: number } }).shoot.id)
  }

  // Fan-out: when each screen received each (shoot, seq), and each answered command's moment of sending;
  // matched at the end (a broadcast may land before its answer; the server's timer.due has no command).
  const arrivals = new Map<string, Float64Array>()
  const timed: Array<{ key: string; sent: number; by: number }> = []
  let sizeSum = 0, sizeCount = 0
  let running = true
  const shoots: Screen[][] = []
  for (let g = 0; g < shape.shoots; g += 10) {
    await Promise.all(shootIds.slice(g, g + 10).map(async (shootId, dg) => {
      const screens: Screen[] = []
      for (let i = 0; i < shape.screens; i++) {
        const socket = await openSocket(app.url, cookieOf(i))
        const reply = await socket.timeout(ACK_TIMEOUT_MS).emitWithAck('shoot:join', { shootId }) as { ok: boolean } & ShootSnapshot
        if (!reply.ok) throw new Error(`screen ${i} could not join shoot ${shootId}`)
        const screen: Screen = { socket, state: reply.state, seq: reply.state.seq }
        socket.on('shoot:event', (m: ShootEventMessage) => {
          const at = performance.now()
          if (m.seq !== screen.seq + 1) errors.gaps++
          // A build from before the patch wire (DEVELOPERS.md, "The shoot wire") sends the whole state.
          // The producer, host, camera and one viewer of each shoot build the state from the patches; the
          // other viewers check the sequence only, so the soak's one process holds 4 states a shoot, not 10.
          if (i < BUILDERS) {
            const next = (m as { state?: ShootState }).state ?? applyShootMessage(screen.state, m)
            if (next) screen.state = next
            else errors.gaps++
          }
          screen.seq = m.seq
          if (i === 3 && m.seq % 10 === 0) { sizeSum += JSON.stringify(m).length; sizeCount++ }
          const key = `${m.shootId}:${m.seq}`
          let times = arrivals.get(key)
          if (!times) arrivals.set(key, times = new Float64Array(shape.screens).fill(NaN))
          times[i] = at
        })
        socket.on('disconnect', () => { if (running) errors.disconnected++ })
        screens.push(screen)
      }
      shoots[g + dg] = screens
    }))
  }
  log(`${shape.shoots * shape.screens} screens joined`)

  let acknowledged = 0
  const send = async (g: number, by: number, command: Record<string, unknown>, timing: boolean) => {
    const shootId = shootIds[g]!
    const sent = performance.now()
    try {
      const reply = await shoots[g]![by]!.socket.timeout(ACK_TIMEOUT_MS).emitWithAck('shoot:command', { shootId, ...command }) as Reply
      if (reply.ok) {
        acknowledged++
        if (timing) timed.push({ key: `${shootId}:${reply.seq}`, sent, by })
      } else {
        errors.refused++
        const key = `${command.type}: ${reply.error.code}`
        refusals.set(key, (refusals.get(key) ?? 0) + 1)
      }
    } catch {
      errors.timedOut++
    }
  }
  await Promise.all(shootIds.map((_, g) => send(g, HOST, { type: 'shoot.start' }, false)))
  const starts = acknowledged

  const usage = sampleProcess(app.pid)
  const ownCpu = process.cpuUsage()
  // The soak's own event loop: a late callback here adds to the fan-out it times.
  const ownDelay = monitorEventLoopDelay({ resolution: 10 })
  ownDelay.enable()
  const started = performance.now()
  let lastReport = started
  const { sent, planned } = await paced(shape, shape.seconds, async (g, n) => {
    const { by, command } = commandAt(g, n)
    await send(g, by, command, true)
    if (performance.now() - lastReport > 15_000) {
      lastReport = performance.now()
      log(`${acknowledged - starts} commands answered`)
    }
  })
  const soakSeconds = (performance.now() - started) / 1000
  errors.unsent = planned - sent
  await new Promise((r) => setTimeout(r, 1000)) // the last broadcasts land
  const soakAcknowledged = acknowledged - starts
  const soakUsage = usage.stop()
  ownDelay.disable()
  const ownCpuSeconds = (process.cpuUsage(ownCpu).user + process.cpuUsage(ownCpu).system) / 1e6
  const latencies: number[] = []
  /** p99 by 10 s of the run: a tail that is one moment (a pause, a checkpoint) or all along. */
  const windows: number[][] = []
  for (const { key, sent: at, by } of timed) {
    const others = [...(arrivals.get(key) ?? [])].filter((_, i) => i !== by)
    if (others.length !== shape.screens - 1 || others.some(Number.isNaN)) errors.missing++
    else {
      latencies.push(Math.max(...others) - at)
      ;(windows[Math.floor((at - started) / 10_000)] ??= []).push(Math.max(...others) - at)
    }
  }
  arrivals.clear()
  log(`soak done: ${sent} sent, ${soakAcknowledged} answered in ${soakSeconds.toFixed(1)} s; flat out for ${burstSeconds} s`)

  // Flat out: every shoot's producer adds markers back to back, for the most the app persists a second.
  const burstStart = performance.now()
  const beforeBurst = acknowledged
  await Promise.all(shootIds.map(async (_, g) => {
    while (performance.now() - burstStart < burstSeconds * 1000) await send(g, PRODUCER, { type: 'marker.add', kind: 'flub' }, false)
  }))
  const burstRate = (acknowledged - beforeBurst) / ((performance.now() - burstStart) / 1000)
  await new Promise((r) => setTimeout(r, 1000))

  // Every screen's copy of the state, built from the broadcasts, is the server's.
  for (const [g, screens] of shoots.entries()) {
    const reply = await screens[0]!.socket.timeout(ACK_TIMEOUT_MS).emitWithAck('shoot:snapshot', { shootId: shootIds[g] }) as { ok: boolean } & ShootSnapshot
    errors.diverged += screens.slice(0, BUILDERS).filter((s) => !isDeepStrictEqual(s.state, reply.state)).length
  }
  running = false
  shoots.flat().forEach((s) => s.socket.disconnect())
  await app.stop()

  // Every acknowledged command is in the event log, and each shoot's stored state is at its last event.
  const db = new sqlite3.Database(app.databasePath, sqlite3.OPEN_READONLY)
  const get = <T>(sql: string, params: unknown[]) => new Promise<T>((r, j) => db.get(sql, params, (e, row) => (e ? j(e) : r(row as T))))
  const list = JSON.stringify(shootIds)
  const logged = (await get<{ n: number }>('SELECT COUNT(*) AS n FROM shoot_events WHERE shoot_id IN (SELECT value FROM json_each(?)) AND type != ?', [list, 'timer.due'])).n
  const behind = (await get<{ n: number }>(`SELECT COUNT(*) AS n FROM shoots s WHERE s.id IN (SELECT value FROM json_each(?))
    AND (s.seq != (SELECT MAX(seq) FROM shoot_events e WHERE e.shoot_id = s.id) OR json_extract(s.state, '$.seq') != s.seq)`, [list])).n
  const integrity = (await get<{ integrity_check: string }>('PRAGMA integrity_check', [])).integrity_check
  db.close()

  log(`baselines: bare socket.io for ${Math.min(30, shape.seconds)} s, bare SQLite inserts for 5 s`)
  const bytes = sizeCount ? Math.round(sizeSum / sizeCount) : 1000
  const bare = await bareBroadcast(shape, bytes, Math.min(30, shape.seconds))
  const bareRate = await bareInserts(5, 120)

  const p50 = percentile(latencies, 50), p99 = percentile(latencies, 99)
  const bareP50 = percentile(bare.latencies, 50), bareP99 = percentile(bare.latencies, 99)
  const persistedRate = soakAcknowledged / soakSeconds
  const errorCount = Object.values(errors).reduce((a, b) => a + b, 0)
  const everyPersisted = logged === acknowledged && behind === 0 && integrity === 'ok'
  const rows = [
    { figure: 'fan-out p50 (command sent → every other screen of its shoot)', hobline: `${p50.toFixed(2)} ms`, baseline: `${bareP50.toFixed(2)} ms`, ratio: `${(p50 / bareP50).toFixed(2)}×`, bound: '—', result: '' },
    { figure: 'fan-out p99', hobline: `${p99.toFixed(2)} ms`, baseline: `${bareP99.toFixed(2)} ms`, ratio: `${(p99 / bareP99).toFixed(2)}×`, bound: `≤ ${BOUNDS.p99Ms} ms`, result: p99 <= BOUNDS.p99Ms ? 'pass' : 'FAIL' },
    { figure: 'commands persisted a second (soak, offered rate)', hobline: persistedRate.toFixed(1), baseline: `${bareRate.toFixed(0)} inserts/s`, ratio: `${(persistedRate / bareRate).toFixed(3)}×`, bound: `${shape.rate} offered`, result: '' },
    { figure: 'commands persisted a second (flat out, markers)', hobline: burstRate.toFixed(1), baseline: `${bareRate.toFixed(0)} inserts/s`, ratio: `${(burstRate / bareRate).toFixed(3)}×`, bound: '—', result: '' },
    { figure: 'every acknowledged command persisted', hobline: `${logged} logged / ${acknowledged} acknowledged, ${behind} shoots behind, integrity ${integrity}`, baseline: '—', ratio: '—',
      bound: 'equal, 0 behind, ok', result: everyPersisted ? 'pass' : 'FAIL' },
    { figure: 'server RSS, peak', hobline: `${soakUsage.peakRssMb.toFixed(1)} MB`, baseline: '—', ratio: '—', bound: `≤ ${BOUNDS.rssMb} MB`, result: soakUsage.peakRssMb <= BOUNDS.rssMb ? 'pass' : 'FAIL' },
    { figure: 'server CPU, mean / peak (1 = one core)', hobline: `${soakUsage.meanCpu.toFixed(2)} / ${soakUsage.peakCpu.toFixed(2)}`, baseline: '—', ratio: '—', bound: '—', result: '' },
    { figure: 'errors', hobline: JSON.stringify(errors), baseline: `bare missing ${bare.missing}`, ratio: '—', bound: '0', result: errorCount === 0 ? 'pass' : 'FAIL' },
  ]
  console.table(rows)
  console.log(`broadcast size ≈ ${bytes} bytes; ${sent} commands sent in ${soakSeconds.toFixed(1)} s (${(soakAcknowledged / soakSeconds).toFixed(1)}/s answered); `
    + `${latencies.length} fan-outs timed; the soak's own clients used ${(ownCpuSeconds / soakSeconds).toFixed(2)} of a core, `
    + `their event loop's delay p99 ${(ownDelay.percentile(99) / 1e6).toFixed(1)} ms, max ${(ownDelay.max / 1e6).toFixed(1)} ms`)
  console.log(`fan-out p99 by 10 s: ${windows.map((w) => percentile(w, 99).toFixed(0)).join(' ')} ms`)
  if (refusals.size) console.log('refusals:', Object.fromEntries(refusals))
  console.log(`database: ${app.databasePath}`)
  const pass = rows.every((r) => r.result !== 'FAIL')
  console.log(pass ? 'PASS' : 'FAIL')
  process.exit(pass ? 0 : 1)
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
