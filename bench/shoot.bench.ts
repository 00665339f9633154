// Live shoot fan-out: 50 socket.io clients over 10 shoots on the built app, beside a bare
// socket.io broadcast server measured in the same run with the same clients and payload size.
// Latency is wall clock (performance.timeOrigin + now) from the server handing a message to
// socket.io to its arrival at a client, and from a command's emit to its arrival at all clients.
import { createServer } from 'node:http'
import { Server } from 'socket.io'
import { io as connect, type Socket } from 'socket.io-client'
import { getRandomPort } from 'get-port-please'
import sqlite3 from 'sqlite3'
import { DEMO_PASSWORD } from '../server/db/demo'
import { signIn, startBuiltApp } from './server'
import { percentile, type Benchmark, type BenchResult } from './types'

const SHOOTS = 10
const PER_SHOOT = 5
const ROUNDS = 100
const wall = () => performance.timeOrigin + performance.now()

function open(url: string, cookie?: string): Promise<Socket> {
  const socket = connect(url, { transports: ['websocket'], extraHeaders: cookie ? { cookie } : {}, forceNew: true, reconnection: false })
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket))
    socket.once('connect_error', reject)
  })
}
const ack = <T>(s: Socket, event: string, payload: unknown) => new Promise<T>((r) => s.emit(event, payload, r))

interface Setup { url: string; cookie: string; shootIds: number[]; clients: Socket[][]; stop: () => Promise<void>; databasePath: string }
let shared: Promise<Setup> | undefined

async function setup(): Promise<Setup> {
  const log = (m: string) => process.env.HOBLINE_BENCH_DEBUG && console.error(`[bench] ${m}`)
  const app = await startBuiltApp()
  log(`app at ${app.url}`)
  const cookie = await signIn(app.url, 'producer@brackenford.test', DEMO_PASSWORD)
  const shootIds: number[] = []
  for (let i = 0; i < SHOOTS; i++) {
    const res = await fetch(`${app.url}/api/episodes/1/shoots`, { method: 'POST', headers: { cookie, origin: app.url, 'content-type': 'application/json' }, body: JSON.stringify({ mode: 'rehearsal' }) })
    shootIds.push(((await res.json()) as { shoot: { id: number } }).shoot.id)
  }
  log(`shoots ${shootIds.join(',')}`)
  const clients: Socket[][] = []
  for (const shootId of shootIds) {
    const group = await Promise.all(Array.from({ length: PER_SHOOT }, () => open(app.url, cookie)))
    for (const s of group) await ack(s, 'shoot:join', { shootId })
    clients.push(group)
  }
  log('clients joined')
  await Promise.all(shootIds.map((shootId, i) => ack(clients[i]![0]!, 'shoot:command', { shootId, type: 'shoot.start' })))
  log('shoots started')
  return { ...app, cookie, shootIds, clients }
}

/** One round: every shoot gets one command at once (a marker unless told); resolves with per-client delivery and round-trip times. */
async function round(s: Setup, n: number, command: (n: number) => object = (k) => ({ type: 'marker.add', kind: 'note', text: `round ${k}` })) {
  const delivery: number[] = []
  const roundTrip: number[] = []
  let size = 0
  await Promise.all(s.shootIds.map((shootId, i) => new Promise<void>((done) => {
    const group = s.clients[i]!
    let left = group.length
    const sent = wall()
    for (const c of group) {
      c.once('shoot:event', (m: { sentAt: number }) => {
        const now = wall()
        delivery.push(now - m.sentAt)
        roundTrip.push(now - sent)
        size = JSON.stringify(m).length
        if (--left === 0) done()
      })
    }
    group[0]!.emit('shoot:command', { shootId, ...command(n) }, (r: { ok: boolean; error?: { message: string } }) => {
      if (!r.ok) throw new Error(`the benchmark's command was refused: ${r.error?.message}`)
    })
  })))
  return { delivery, roundTrip, size }
}

/** A bare socket.io server with the same rooms and clients; `cast` broadcasts one payload to a room. */
async function bareServer() {
  const port = await getRandomPort('127.0.0.1')
  const http = createServer()
  const io = new Server(http)
  io.on('connection', (socket) => {
    socket.on('join', async (room: string, cb: () => void) => {
      await socket.join(room)
      cb()
    })
    socket.on('cast', ({ room, payload }: { room: string; payload: string }) => io.to(room).emit('cast', { payload, sentAt: wall() }))
  })
  await new Promise<void>((r) => http.listen(port, '127.0.0.1', r))
  const url = `http://127.0.0.1:${port}`
  const groups: Socket[][] = []
  for (let g = 0; g < SHOOTS; g++) {
    const group = await Promise.all(Array.from({ length: PER_SHOOT }, () => open(url)))
    for (const c of group) await new Promise<void>((r) => c.emit('join', `room-${g}`, r))
    groups.push(group)
  }
  const round = (payload: string) => {
    const delivery: number[] = []
    return Promise.all(groups.map((group, g) => new Promise<void>((done) => {
      let left = group.length
      for (const c of group) c.once('cast', (m: { sentAt: number }) => { delivery.push(wall() - m.sentAt); if (--left === 0) done() })
      group[0]!.emit('cast', { room: `room-${g}`, payload })
    }))).then(() => delivery)
  }
  const close = () => {
    groups.flat().forEach((c) => c.disconnect())
    io.close()
  }
  return { round, close }
}

let measured: Promise<{ delivery: number[]; roundTrip: number[]; bare: number[] }> | undefined
// The app's rounds and the bare server's rounds alternate, so load on the machine falls on both alike.
function measure() {
  measured ??= (async () => {
    const s = await (shared ??= setup())
    const bare = await bareServer()
    let payload = ''
    for (let n = 0; n < 5; n++) {
      const r = await round(s, -n) // warm-up, and the size of a real message
      payload = 'x'.repeat(r.size)
      await bare.round(payload)
    }
    const delivery: number[] = []
    const roundTrip: number[] = []
    const bareDelivery: number[] = []
    for (let n = 0; n < ROUNDS; n++) {
      const r = await round(s, n)
      delivery.push(...r.delivery)
      roundTrip.push(...r.roundTrip)
      bareDelivery.push(...(await bare.round(payload)))
    }
    bare.close()
    return { delivery, roundTrip, bare: bareDelivery }
  })()
  return measured
}

const fanOut: Benchmark = {
  name: 'shoot: fan-out to 50 clients over 10 shoots, p99',
  async run(): Promise<BenchResult> {
    const { delivery, bare } = await measure()
    return { figure: percentile(delivery, 99), baseline: percentile(bare, 99), unit: 'ms', bound: 15, ratioBound: 1.3, note: `p50 ${percentile(delivery, 50).toFixed(2)} ms (bare ${percentile(bare, 50).toFixed(2)} ms); server hand-off → client` }
  },
}

const commandToAll: Benchmark = {
  name: 'shoot: command → every screen of its shoot, p99',
  async run(): Promise<BenchResult> {
    const { roundTrip } = await measure()
    return { figure: percentile(roundTrip, 99), unit: 'ms', note: `p50 ${percentile(roundTrip, 50).toFixed(2)} ms; 10 commands at once, each checked, applied in a SQLite transaction, logged, broadcast (no bound set: a figure to watch)` }
  },
}

// A step forward or back makes the server compute the rest of the cook plan again (16 steps of the
// demo episode, waits running) before it answers; a marker does not. Alternating the two on the same
// shoots and clients gives the cost of re-planning in the round trip, with the marker as the baseline.
const replanToAll: Benchmark = {
  name: 'shoot: command that re-plans → every screen of its shoot, p99',
  async run(): Promise<BenchResult> {
    const s = await (shared ??= setup())
    await measure()
    const step = (n: number) => ({ type: n % 2 === 0 ? 'step.next' : 'step.previous' })
    const replans: number[] = []
    const markers: number[] = []
    for (let n = 0; n < 4; n++) await round(s, n, step) // warm-up: the first waits start their timers
    for (let n = 0; n < ROUNDS; n++) {
      replans.push(...(await round(s, n, step)).roundTrip)
      markers.push(...(await round(s, 1000 + n)).roundTrip)
    }
    return {
      figure: percentile(replans, 99), baseline: percentile(markers, 99), unit: 'ms',
      note: `p50 ${percentile(replans, 50).toFixed(2)} ms (marker p50 ${percentile(markers, 50).toFixed(2)} ms); 10 shoots at once, each command re-planning the demo episode (no bound set)`,
    }
  },
}

const JOINERS = 20
const JOIN_ROUNDS = 10

// Twenty screens opening one shoot at the same moment (a crew arriving on set, or every screen
// reconnecting after the Wi-Fi comes back): emit → snapshot acknowledgement, beside a clock ping
// on the same sockets at the same moment, which does no work at all.
const join: Benchmark = {
  name: 'shoot: 20 screens join one shoot at once, join → snapshot p99',
  async run(): Promise<BenchResult> {
    const s = await (shared ??= setup())
    await measure()
    const shootId = s.shootIds[0]!
    const screens = await Promise.all(Array.from({ length: JOINERS }, () => open(s.url, s.cookie)))
    const joins: number[] = []
    const pings: number[] = []
    const timed = (socket: Socket, event: string, payload: unknown, into: number[]) => {
      const sent = wall()
      return ack<{ ok?: boolean; error?: { message: string } }>(socket, event, payload).then((r) => {
        if (r.ok === false) throw new Error(`the benchmark's ${event} was refused: ${r.error?.message}`)
        into.push(wall() - sent)
      })
    }
    for (let n = 0; n < JOIN_ROUNDS; n++) {
      await Promise.all(screens.map((c) => timed(c, 'shoot:join', { shootId }, joins)))
      await Promise.all(screens.map((c) => timed(c, 'clock:ping', { t1: Date.now() }, pings)))
      for (const c of screens) c.emit('shoot:leave', { shootId })
    }
    screens.forEach((c) => c.disconnect())
    return {
      figure: percentile(joins, 99), baseline: percentile(pings, 99), unit: 'ms',
      note: `p50 ${percentile(joins, 50).toFixed(1)} ms (ping p50 ${percentile(pings, 50).toFixed(1)} ms); ${JOINERS} × ${JOIN_ROUNDS} joins of the demo episode's shoot (no bound set: compare before and after a change)`,
    }
  },
}

const throughput: Benchmark = {
  name: 'shoot: commands per second, every one persisted',
  async run(): Promise<BenchResult> {
    const s = await (shared ??= setup())
    await measure()
    const seconds = 3
    const end = Date.now() + seconds * 1000
    let accepted = 0
    await Promise.all(s.shootIds.map(async (shootId, i) => {
      const sender = s.clients[i]![1]!
      while (Date.now() < end) {
        const r = await ack<{ ok: boolean }>(sender, 'shoot:command', { shootId, type: 'marker.add', kind: 'good' })
        if (r.ok) accepted++
      }
    }))
    // Every accepted command is a row in the event log.
    const db = new sqlite3.Database(s.databasePath)
    const logged = await new Promise<number>((r) => db.get('SELECT COUNT(*) AS n FROM shoot_events WHERE type = ?', ['marker.add'], (_e, row: { n: number }) => r(row.n)))
    db.close()
    s.clients.flat().forEach((c) => c.disconnect())
    await s.stop()
    const rate = accepted / seconds
    const expectedMarkers = accepted + (2 * ROUNDS + 5) * SHOOTS
    if (logged !== expectedMarkers) throw new Error(`${logged} marker commands logged, ${expectedMarkers} accepted`)
    return { figure: rate, unit: 'cmd/s', note: `${accepted} accepted over ${SHOOTS} shoots in ${seconds} s, ${logged} marker commands in the event log (no bound set)` }
  },
}

export const shootBenchmarks: Benchmark[] = [fanOut, commandToAll, replanToAll, join, throughput]
