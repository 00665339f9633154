// The live shoot's handlers, driven directly through their factory on a real SQLite file made by
// the app's own migrations: no build, no socket.io, no HTTP. What a screen sends and what it gets
// back, what reaches the room, what the event log keeps.
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openDatabase } from '../../server/db/connection'
import { migrate } from '../../server/db/migrator'
import { initModels } from '../../server/db/models'
import { createShootHandlers, type ShootCaller, type ShootConnection } from '../../server/shoot/handlers'
import { createPresence } from '../../server/shoot/presence'
import { createScriptCache, type ShootScript } from '../../server/shoot/script'
import { openShootStore, type ShootStore } from '../../server/shoot/store'
import type { ShootEventMessage, ShootPresence, ShootSnapshot } from '../../shared/types/socket-events'
import type { ShootState } from '../../shared/types/shoot'
import { DomainError } from '../../shared/utils/domain-error'
import { applyShootMessage } from '../../shared/utils/shoot-wire'
import type { StudioRole } from '../../shared/utils/roles'

const STUDIO = 1
const RUN_ORDER = [
  { id: 'segment-1', title: 'Lentil stew', stepIds: ['11', '12'] },
  { id: 'segment-2', title: 'Flatbreads', stepIds: ['21'] },
]
const EMPTY_SCRIPT: ShootScript = { steps: {}, units: 'metric', makespanMs: null, show: null }

/** Sessions as the guard would read them: a member of studio 1 in a role, or nobody. */
const session = (role: StudioRole | null, id = 1) =>
  (role ? { id: `s-${role}`, user: { id, name: `The ${role}`, role } } : { id: '' }) as never
const authorize = async (s: { user?: { id: number; name: string; role: StudioRole } }, shootId: number): Promise<ShootCaller> => {
  if (!s.user) throw new DomainError('signed-out', 'Sign in first.')
  if (shootId !== shoot) throw new DomainError('not-found', 'There is no such shoot.')
  return { kind: 'member', user: s.user, studioId: STUDIO, role: s.user.role }
}

let sequelize: Sequelize
let store: ShootStore
let shoot = 0
/** The host screen's state: the join's snapshot, then the patches broadcast. */
let held: ShootState
let clock = Date.UTC(2026, 11, 2, 9, 0, 0)
const events: ShootEventMessage[] = []
const presences: Array<{ shootId: number } & ShootPresence> = []
let scriptCalls = 0
let handlers: ReturnType<typeof createShootHandlers>

function screen(id: string, role: StudioRole | null): ShootConnection & { rooms: { joined: Set<number>; join(n: number): void; leave(n: number): void } } {
  const joined = new Set<number>()
  return { id, session: session(role), rooms: { joined, join: (n) => joined.add(n), leave: (n) => joined.delete(n) } }
}

beforeAll(async () => {
  const path = join(mkdtempSync(join(tmpdir(), 'hobline-handlers-')), 'hobline.sqlite')
  sequelize = await openDatabase(path)
  initModels(sequelize)
  await migrate(sequelize)
  await sequelize.query(`INSERT INTO studios (id, name, slug, created_at, updated_at) VALUES (${STUDIO}, 'Test kitchen', 'test-kitchen', datetime('now'), datetime('now'))`)
  store = openShootStore(path)
  handlers = createShootHandlers({
    store,
    authorize: authorize as never,
    presence: createPresence(),
    broadcast: { event: (_id, m) => events.push(m), presence: (shootId, p) => presences.push({ shootId, ...p }) },
    script: async () => {
      scriptCalls++
      return EMPTY_SCRIPT
    },
    now: () => clock,
  })
  const row = await handlers.engine.create({ studioId: STUDIO, episodeId: null, title: 'Thursday rehearsal', mode: 'rehearsal', createdBy: null, runOrder: RUN_ORDER })
  shoot = row.id
})

afterAll(async () => {
  await store.close()
  await sequelize.close()
})

describe('shoot handlers', () => {
  const host = screen('socket-host', 'host')
  const producer = screen('socket-producer', 'producer')
  const camera = screen('socket-camera', 'camera')

  it('a join answers with the snapshot, puts the screen in the room and tells the room who is on', async () => {
    const reply = await handlers.join(host, { shootId: shoot })
    expect(reply.ok).toBe(true)
    const snapshot = reply as { ok: true } & ShootSnapshot
    expect(snapshot.shoot).toEqual({ id: shoot, studioId: STUDIO, episodeId: null, title: 'Thursday rehearsal', mode: 'rehearsal' })
    expect(snapshot.state.runOrder).toEqual(RUN_ORDER)
    expect(snapshot.state.seq).toBe(0)
    held = snapshot.state
    expect(snapshot.you).toEqual({ kind: 'member', role: 'host', actorId: 'user:1' })
    expect(snapshot.serverNow).toBe(clock)
    expect(host.rooms.joined.has(shoot)).toBe(true)
    expect(presences.at(-1)).toEqual({ shootId: shoot, screens: [{ role: 'host', audibleWhileRolling: false }] })
    await handlers.join(producer, { shootId: shoot })
    await handlers.join(camera, { shootId: shoot })
    expect(presences.at(-1)!.screens.map((s) => s.role)).toEqual(['host', 'producer', 'camera'])
  })

  it('a command is applied, logged with the next sequence number and broadcast once', async () => {
    const before = events.length
    await expect(handlers.command(producer, { shootId: shoot, type: 'shoot.start' })).resolves.toEqual({ ok: true, seq: 1 })
    clock += 5_000
    await expect(handlers.command(host, { shootId: shoot, type: 'step.next' })).resolves.toEqual({ ok: true, seq: 2 })
    expect(events.slice(before).map((e) => [e.seq, e.type, e.by?.role])).toEqual([[1, 'shoot.start', 'producer'], [2, 'step.next', 'host']])
    // The screen follows from the patches broadcast (RFC 6902, shared/utils/shoot-wire.ts) alone.
    held = events.slice(before).reduce<ShootState>((s, m) => applyShootMessage(s, m)!, held)
    expect(held.cursor).toEqual({ segment: 0, step: 1 })
    expect(held).toEqual((await store.read(shoot))!.state)
    const log = await store.events(shoot)
    expect(log.map((e) => [e.seq, e.type])).toEqual([[1, 'shoot.start'], [2, 'step.next']])
    expect(log[1]!.command).toEqual({ type: 'step.next' })
    expect(log[1]!.actor).toMatchObject({ role: 'host', id: 'user:1' })
  })

  it('refuses by the one role table, with a message for people, and changes nothing', async () => {
    const seqBefore = (await store.read(shoot))!.seq
    // The host drives the shoot but does not end it; the camera marks takes but does not drive.
    await expect(handlers.command(host, { shootId: shoot, type: 'shoot.end' })).resolves.toEqual({
      ok: false, error: { code: 'forbidden', message: 'The host may not end the shoot; the producer may.' },
    })
    await expect(handlers.command(camera, { shootId: shoot, type: 'step.next' })).resolves.toMatchObject({ ok: false, error: { code: 'forbidden' } })
    await expect(handlers.command(camera, { shootId: shoot, type: 'marker.add', kind: 'flub' })).resolves.toMatchObject({ ok: true })
    expect((await store.read(shoot))!.seq).toBe(seqBefore + 1)
  })

  it('refuses bad input, strangers and unknown shoots in the same shape', async () => {
    await expect(handlers.command(host, { type: 'step.next' })).resolves.toEqual({
      ok: false, error: { code: 'invalid', message: 'This screen did not say which shoot it is on; reload the page, or open the shoot again from its episode.', field: 'shootId' },
    })
    await expect(handlers.command(host, { shootId: shoot, type: 'timer.start', label: 'Rest', durationMs: 'ten' }))
      .resolves.toMatchObject({ ok: false, error: { code: 'invalid', field: 'durationMs' } })
    await expect(handlers.command(screen('anon', null), { shootId: shoot, type: 'step.next' }))
      .resolves.toEqual({ ok: false, error: { code: 'signed-out', message: 'Sign in first.' } })
    await expect(handlers.join(host, { shootId: shoot + 100 })).resolves.toEqual({ ok: false, error: { code: 'not-found', message: 'There is no such shoot.' } })
    await expect(handlers.command(producer, { shootId: shoot, type: 'step.jump', to: { segment: 9, step: 0 } }))
      .resolves.toMatchObject({ ok: false, error: { code: expect.any(String), message: expect.any(String) } })
  })

  it('a screen that missed events (a gap in sequence numbers) catches up from one snapshot', async () => {
    const seen = events.at(-1)!.seq
    const behind = (await store.read(shoot))!.state
    await handlers.command(host, { shootId: shoot, type: 'step.next' })
    await handlers.command(host, { shootId: shoot, type: 'step.previous' })
    // This screen heard only the last one: seq jumped by two, so it asks for the whole picture.
    expect(events.at(-1)!.seq).toBe(seen + 2)
    const reply = (await handlers.snapshot(camera, { shootId: shoot })) as { ok: true } & ShootSnapshot
    expect(reply.state.seq).toBe(seen + 2)
    // The last patch does not apply to the state it heard before the gap; both in order give the snapshot.
    expect(applyShootMessage(behind, events.at(-1)!)).toBeNull()
    expect(events.slice(-2).reduce<ShootState>((s, m) => applyShootMessage(s, m)!, behind)).toEqual(reply.state)
    expect(reply.state).toEqual((await store.read(shoot))!.state)
  })

  it('the ticker marks a timer due on the server clock, once, and the room hears it', async () => {
    await handlers.command(host, { shootId: shoot, type: 'timer.start', label: 'Dough rest', durationMs: 60_000 })
    clock += 59_000
    await handlers.engine.tick()
    expect(events.at(-1)!.type).toBe('timer.start')
    clock += 1_000
    await handlers.engine.tick()
    const due = events.at(-1)!
    expect(due.type).toBe('timer.due')
    expect(due.by).toBeNull()
    expect(due.events).toEqual([expect.objectContaining({ type: 'timer.due', label: 'Dough rest', dueAtServerMs: clock })])
    await handlers.engine.tick()
    expect(events.at(-1)).toBe(due)
  })

  it('a screen sets its alarm only once it has joined; leaving and disconnecting update who is on', async () => {
    const stranger = screen('socket-stranger', 'viewer')
    await expect(handlers.alarm(stranger, { shootId: shoot, audibleWhileRolling: true })).resolves.toMatchObject({ ok: false, error: { code: 'conflict' } })
    await expect(handlers.alarm(producer, { shootId: shoot, audibleWhileRolling: 'yes' })).resolves.toMatchObject({ ok: false, error: { field: 'audibleWhileRolling' } })
    await expect(handlers.alarm(producer, { shootId: shoot, audibleWhileRolling: true })).resolves.toEqual({ ok: true })
    expect(presences.at(-1)!.screens).toContainEqual({ role: 'producer', audibleWhileRolling: true })
    await handlers.leave(camera, { shootId: shoot })
    expect(camera.rooms.joined.has(shoot)).toBe(false)
    handlers.disconnect(producer)
    expect(presences.at(-1)).toEqual({ shootId: shoot, screens: [{ role: 'host', audibleWhileRolling: false }] })
  })

  it('answers a clock ping with the server times around it (RFC 5905 T2 and T3)', async () => {
    await expect(handlers.ping(host, { t1: 123 })).resolves.toEqual({ t1: 123, t2: clock, t3: clock })
  })

  it('over HTTP (a connection without rooms) a join is a snapshot and touches no presence', async () => {
    const before = presences.length
    const reply = await handlers.join({ id: 'http', session: session('viewer', 2) }, { shootId: shoot })
    expect(reply).toMatchObject({ ok: true, you: { role: 'viewer', actorId: 'user:2' } })
    expect(presences.length).toBe(before)
    expect(scriptCalls).toBeGreaterThan(0)
  })
})

describe('the script cache', () => {
  const row = (id: number) => ({ id, studioId: 1, episodeId: 1, title: 'T', mode: 'rehearsal' as const, status: 'ready', seq: 0, state: {} as never, createdBy: null })

  it('builds a shoot\'s script once for twenty screens joining at once, and again after a change', async () => {
    let version = 'v1'
    let builds = 0
    const cache = createScriptCache({
      version: async () => version,
      build: async () => {
        builds++
        await new Promise((r) => setTimeout(r, 20))
        return { ...EMPTY_SCRIPT, makespanMs: builds }
      },
    })
    const scripts = await Promise.all(Array.from({ length: 20 }, () => cache(row(7))))
    expect(builds).toBe(1)
    expect(new Set(scripts).size).toBe(1)
    await cache(row(7))
    expect(builds).toBe(1)
    version = 'v2'
    expect((await cache(row(7))).makespanMs).toBe(2)
    expect(cache.stats.builds).toBe(2)
    // Another shoot has its own entry.
    await cache(row(8))
    expect(builds).toBe(3)
  })
})
