// The soak's two baselines, measured in the same run as the app (bench/soak.ts): a bare socket.io
// server broadcasting messages of the app's size to the same clients in rooms of the same size at
// the same rate, and a bare SQLite insert loop (sqlite3, WAL, synchronous=NORMAL, one transaction
// per insert, as the shoot store commits one command).
import { createServer } from 'node:http'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { Server } from 'socket.io'
import { getRandomPort } from 'get-port-please'
import sqlite3 from 'sqlite3'
import { openSocket, paced, type SoakShape } from './soak-clients'

/** Fan-out latencies (ms) of a bare socket.io server: a client's emit → every other client of its room received the broadcast. */
export async function bareBroadcast(shape: SoakShape, bytes: number, seconds: number): Promise<{ latencies: number[]; missing: number }> {
  const port = await getRandomPort('127.0.0.1')
  const http = createServer()
  const io = new Server(http)
  const payload = 'x'.repeat(Math.max(0, bytes - 40))
  io.on('connection', (socket) => {
    socket.on('join', async (room: string, cb: () => void) => {
      await socket.join(room)
      cb()
    })
    socket.on('cast', ({ room, n }: { room: string; n: number }, cb: () => void) => {
      io.to(room).emit('cast', { room, n, payload })
      cb()
    })
  })
  await new Promise<void>((r) => http.listen(port, '127.0.0.1', r))
  const url = `http://127.0.0.1:${port}`
  const rooms: Awaited<ReturnType<typeof openSocket>>[][] = []
  const arrivals = new Map<string, { sent: number; left: number; last: number }>()
  const latencies: number[] = []
  for (let g = 0; g < shape.shoots; g++) {
    const group = await Promise.all(Array.from({ length: shape.screens }, () => openSocket(url)))
    await Promise.all(group.map((c) => new Promise<void>((r) => c.emit('join', `room-${g}`, r))))
    group.forEach((c, i) => c.on('cast', (m: { room: string; n: number }) => {
      if (i === 0) return // the sender, as in the app's figure
      const entry = arrivals.get(`${m.room}:${m.n}`)
      if (!entry) return
      entry.last = performance.now()
      if (--entry.left === 0) latencies.push(entry.last - entry.sent)
    }))
    rooms.push(group)
  }
  await paced(shape, seconds, async (g, n) => {
    const room = `room-${g}`
    arrivals.set(`${room}:${n}`, { sent: performance.now(), left: shape.screens - 1, last: 0 })
    await new Promise<void>((r) => rooms[g]![0]!.emit('cast', { room, n }, r))
  })
  await new Promise((r) => setTimeout(r, 1000))
  const missing = [...arrivals.values()].filter((e) => e.left > 0).length
  rooms.flat().forEach((c) => c.disconnect())
  io.close()
  return { latencies, missing }
}

/** Inserts a second into a bare table like shoot_events, one BEGIN IMMEDIATE … COMMIT each, for `seconds`. */
export async function bareInserts(seconds: number, commandBytes: number): Promise<number> {
  const dir = mkdtempSync(join(tmpdir(), 'hobline-soak-sqlite-'))
  const db = new sqlite3.Database(join(dir, 'bare.sqlite'))
  const run = (sql: string, params: unknown[] = []) => new Promise<void>((resolve, reject) => db.run(sql, params, (e) => (e ? reject(e) : resolve())))
  await run('PRAGMA journal_mode = WAL')
  await run('PRAGMA synchronous = NORMAL')
  await run('CREATE TABLE events (id INTEGER PRIMARY KEY, shoot_id INTEGER, seq INTEGER, type TEXT, command TEXT, actor TEXT, server_ms INTEGER, created_at TEXT)')
  const command = JSON.stringify({ type: 'marker.add', kind: 'note', text: 'x'.repeat(Math.max(0, commandBytes - 40)) })
  const end = performance.now() + seconds * 1000
  let n = 0
  while (performance.now() < end) {
    await run('BEGIN IMMEDIATE')
    await run('INSERT INTO events (shoot_id, seq, type, command, actor, server_ms, created_at) VALUES (?, ?, ?, ?, ?, ?, ?)',
      [n % 50, n, 'marker.add', command, '{"role":"producer","id":"user:1"}', Date.now(), new Date().toISOString()])
    await run('COMMIT')
    n++
  }
  await new Promise<void>((r) => db.close(() => r()))
  rmSync(dir, { recursive: true, force: true })
  return n / seconds
}
