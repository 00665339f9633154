// The live shoot engine over real socket.io connections of different roles.
import { startServer, url, useTestContext } from '@nuxt/test-utils/e2e'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ntpSample, countdownMs, clockFilterBest, clockFilterAdd, type ClockSample } from '../../shared/utils/clock'
import { timerRemainingMs } from '../../shared/utils/shoot-timers'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn } from '../support/client'
import { connect, emitAck, waitFor, type TestSocket } from '../support/sockets'
import { queryFile } from '../support/sqlite'

describe('live shoot engine', async () => {
  const { databasePath } = await useBuiltApp()
  let producer: Client
  let shootId: number
  const sockets: TestSocket[] = []
  const open = async (client: Client | null, transport: 'websocket' | 'polling' = 'websocket') => {
    const s = await connect(client, transport)
    sockets.push(s)
    return s
  }
  afterAll(() => sockets.forEach((s) => s.disconnect()))

  async function device(role: 'host' | 'camera') {
    const code = (await producer.post(`/api/shoots/${shootId}/join-codes`, { role })).body.code
    const c = new Client()
    await c.post('/api/join', { code })
    return c
  }

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    const episodes = (await producer.get('/api/studios/1/episodes')).body.episodes
    const started = await producer.post(`/api/episodes/${episodes[0].id}/shoots`, { mode: 'rehearsal' })
    expect(started.status).toBe(201)
    shootId = started.body.shoot.id
  })

  it('starts a shoot from an episode with its run order, and joins give the snapshot', async () => {
    const s = await open(producer)
    const snap = await emitAck<{ ok: boolean } & ShootSnapshot>(s, 'shoot:join', { shootId })
    expect(snap.ok).toBe(true)
    expect(snap.state.status).toBe('ready')
    // The demo kitchen cooks the recipes side by side: one cooking segment in the plan's order
    // (shoot-plan.test.ts), after the intro; the sponsor read and the sign-off follow it.
    expect(snap.state.runOrder.map((r) => r.title)).toEqual([
      'Welcome', 'Smoky butter bean and tomato stew, Pan flatbreads with mint yoghurt and Roast squash with lentils and tahini',
      'A word from Kettlebrook Pans', 'Sign-off',
    ])
    expect(snap.state.runOrder.map((r) => r.stepIds.length)).toEqual([0, 16, 0, 0])
    // The show: the intro's script with its live fields written from the data.
    expect(snap.show!.segments['segment-intro']!.script.text).toContain('each for 4, each under £1.50 a serving')
    expect(Object.keys(snap.steps)).toHaveLength(16)
    expect(snap.you).toMatchObject({ kind: 'member', role: 'producer' })
    expect(Math.abs(snap.serverNow - Date.now())).toBeLessThan(1000)
  })

  it('fans commands out to every role in order, with consecutive sequence numbers', async () => {
    const clients = [producer, await signedIn(demo.host), await device('camera'), await signedIn(demo.viewer)]
    const [p, h, c, v] = await Promise.all(clients.map((cl, i) => open(cl, i === 3 ? 'polling' : 'websocket')))
    for (const s of [p!, h!, c!, v!]) expect((await emitAck(s, 'shoot:join', { shootId })).ok).toBe(true)
    const before = (await emitAck<ShootSnapshot>(p!, 'shoot:snapshot', { shootId })).state.seq
    const acks = []
    acks.push(await emitAck(p!, 'shoot:command', { shootId, type: 'shoot.start' }))
    acks.push(await emitAck(h!, 'shoot:command', { shootId, type: 'step.next' }))
    acks.push(await emitAck(c!, 'shoot:command', { shootId, type: 'rolling.set', rolling: true }))
    acks.push(await emitAck(h!, 'shoot:command', { shootId, type: 'timer.start', label: 'Stew simmer', durationMs: 20 * 60_000 }))
    expect(acks.map((a) => a.ok)).toEqual([true, true, true, true])
    expect(acks.map((a) => a.seq)).toEqual([before + 1, before + 2, before + 3, before + 4])
    for (const s of [p!, h!, c!, v!]) {
      await waitFor(() => s.received.filter((m) => m.seq > before).length >= 4)
      const seqs = s.received.filter((m) => m.seq > before).map((m) => m.seq)
      expect(seqs).toEqual([before + 1, before + 2, before + 3, before + 4])
      expect(s.received.at(-1)!.state.timers.filter((t) => t.origin === 'free').map((t) => t.label)).toEqual(['Stew simmer'])
    }
    expect(v!.received.at(-1)!.by).toMatchObject({ role: 'host' })
  })

  it('refuses what a role may not do, on the server, and changes nothing', async () => {
    const camera = await open(await device('camera'))
    const viewer = await open(await signedIn(demo.viewer))
    const stranger = await open(null)
    for (const s of [camera, viewer]) await emitAck(s, 'shoot:join', { shootId })
    const seq = (await emitAck<ShootSnapshot>(camera, 'shoot:snapshot', { shootId })).state.seq
    const cameraNext = await emitAck(camera, 'shoot:command', { shootId, type: 'step.next' })
    expect(cameraNext).toMatchObject({ ok: false, error: { code: 'forbidden' } })
    expect((await emitAck(viewer, 'shoot:command', { shootId, type: 'marker.add', kind: 'flub' })).ok).toBe(false)
    expect((await emitAck(viewer, 'shoot:command', { shootId, type: 'rolling.set', rolling: false })).ok).toBe(false)
    expect(await emitAck(stranger, 'shoot:join', { shootId })).toMatchObject({ ok: false, error: { code: 'signed-out' } })
    expect((await emitAck(stranger, 'shoot:command', { shootId, type: 'shoot.pause' })).ok).toBe(false)
    // The camera may mark a take; bad input is refused naming the field.
    expect((await emitAck(camera, 'shoot:command', { shootId, type: 'marker.add', kind: 'good' })).ok).toBe(true)
    const bad = await emitAck(camera, 'shoot:command', { shootId, type: 'marker.add', kind: 'brilliant' })
    expect(bad).toMatchObject({ ok: false, error: { field: 'kind' } })
    expect((await emitAck<ShootSnapshot>(camera, 'shoot:snapshot', { shootId })).state.seq).toBe(seq + 1)
  })

  it('the same refusal reads the same over HTTP and over the socket: one code, one message, the field', async () => {
    const host = await signedIn(demo.host)
    const socket = await open(host)
    const cases = [
      { type: 'shoot.end' }, // the host drives but does not end a shoot (the role table)
      { type: 'timer.cancel', timerId: 'no-such-timer' }, // the state refuses it
      { type: 'marker.add', kind: 'brilliant' }, // bad input, with its field
      { type: 'make.coffee' }, // no such command
    ]
    for (const command of cases) {
      const overSocket = await emitAck<Record<string, never>>(socket, 'shoot:command', { shootId, ...command })
      const overHttp = await host.post(`/api/shoots/${shootId}/commands`, command)
      expect(overSocket.ok).toBe(false)
      const error = (overSocket as unknown as { error: { code: string; message: string; field?: string } }).error
      expect(overHttp.body.data).toEqual(error)
      expect(overHttp.body.message).toBe(error.message)
      expect(overHttp.status).toBe({ 'forbidden': 403, 'invalid': 400 }[error.code] ?? 409)
    }
    // A stranger and an unknown shoot too.
    const stranger = await open(null)
    const socketStranger = await emitAck<Record<string, never>>(stranger, 'shoot:command', { shootId, type: 'shoot.pause' })
    const httpStranger = await new Client().post(`/api/shoots/${shootId}/commands`, { type: 'shoot.pause' })
    expect(httpStranger.status).toBe(401)
    expect(httpStranger.body.data).toEqual((socketStranger as unknown as { error: object }).error)
    const socketUnknown = await emitAck<Record<string, never>>(socket, 'shoot:join', { shootId: 999_999 })
    const httpUnknown = await host.get('/api/shoots/999999')
    expect(httpUnknown.status).toBe(404)
    expect(httpUnknown.body.data).toEqual((socketUnknown as unknown as { error: object }).error)
  })

  it('a client whose clock is ten minutes off shows the same remaining time (within 50 ms)', async () => {
    const h = await open(await signedIn(demo.host))
    const snap = await emitAck<ShootSnapshot>(h, 'shoot:join', { shootId })
    const timer = snap.state.timers.find((t) => t.label === 'Stew simmer')!
    const SKEW = 10 * 60_000
    // RFC 5905 §8 samples, keeping the lowest-delay one (§10).
    const sample = async (skew: number) => {
      let samples: ClockSample[] = []
      for (let i = 0; i < 8; i++) {
        const t1 = Date.now() + skew
        const { t2, t3 } = await emitAck(h, 'clock:ping', { t1 })
        samples = clockFilterAdd(samples, ntpSample(t1, t2, t3, Date.now() + skew))
      }
      return clockFilterBest(samples)!.offset
    }
    const offsetTrue = await sample(0)
    const offsetSkewed = await sample(SKEW)
    expect(offsetSkewed).toBeGreaterThan(-SKEW - 50)
    expect(offsetSkewed).toBeLessThan(-SKEW + 50)
    const now = Date.now()
    const onTrueClock = countdownMs(timer.deadlineServerMs!, now, offsetTrue)
    const onSkewedClock = countdownMs(timer.deadlineServerMs!, now + SKEW, offsetSkewed)
    expect(Math.abs(onTrueClock - onSkewedClock)).toBeLessThan(50)
  })

  it('a dropped client that reconnects gets a snapshot with what it missed', async () => {
    const h = await open(await signedIn(demo.host))
    await emitAck(h, 'shoot:join', { shootId })
    h.disconnect()
    const p = await open(producer)
    await emitAck(p, 'shoot:join', { shootId })
    const missed = await emitAck(p, 'shoot:command', { shootId, type: 'step.next' })
    expect(missed.ok).toBe(true)
    h.connect()
    await new Promise<void>((r) => h.once('connect', () => r()))
    const snap = await emitAck<ShootSnapshot>(h, 'shoot:join', { shootId })
    expect(snap.state.seq).toBe(missed.seq)
    expect(snap.state.cursor).toEqual({ segment: 1, step: 1 })
  })

  it('survives SIGKILL: clients resync, timers keep their deadlines, a timer that fell due while down fires, no accepted command is lost', async () => {
    const p = await open(producer)
    await emitAck(p, 'shoot:join', { shootId })
    const short = await emitAck(p, 'shoot:command', { shootId, type: 'timer.start', label: 'Flatbread rest', durationMs: 1500 })
    expect(short.ok).toBe(true)
    const before = await emitAck<ShootSnapshot>(p, 'shoot:snapshot', { shootId })
    const stew = before.state.timers.find((t) => t.label === 'Stew simmer')!

    useTestContext().serverProcess!.kill('SIGKILL')
    await new Promise((r) => setTimeout(r, 1500))
    await startServer()
    for (let i = 0; i < 100 && (await fetch(url('/api/health')).then((r) => r.json()).catch(() => null))?.status !== 'ok'; i++) await new Promise((r) => setTimeout(r, 50))

    const again = await signedIn(demo.producer)
    const s = await open(again)
    const snap = await emitAck<{ ok: boolean } & ShootSnapshot>(s, 'shoot:join', { shootId })
    expect(snap.ok).toBe(true)
    const stewAfter = snap.state.timers.find((t) => t.label === 'Stew simmer')!
    expect(stewAfter.deadlineServerMs).toBe(stew.deadlineServerMs)
    expect(timerRemainingMs(stewAfter, Date.now())).toBeGreaterThan(0)
    // The rest timer fell due while the server was down: the restarted server marks it due.
    const flat = await waitFor(() => s.received.find((m) => m.type === 'timer.due') ?? (snap.state.timers.find((t) => t.label === 'Flatbread rest')?.state === 'due' ? snap : undefined), 3000)
    expect(flat).toBeTruthy()
    const latest = await emitAck<ShootSnapshot>(s, 'shoot:snapshot', { shootId })
    expect(latest.state.timers.find((t) => t.label === 'Flatbread rest')!.state).toBe('due')
    // Every accepted command is in the log, one row per sequence number.
    const rows = await queryFile<{ seq: number }>(databasePath, `SELECT seq FROM shoot_events WHERE shoot_id = ${shootId} ORDER BY seq`)
    expect(rows.map((r) => r.seq)).toEqual(Array.from({ length: latest.state.seq }, (_, i) => i + 1))
    expect(latest.state.seq).toBeGreaterThan(before.state.seq)
  })
})
