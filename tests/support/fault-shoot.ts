// A live shoot on a built server the fault tests start themselves (spawned.ts), so they can kill it,
// hold its database file, limit its file size or step its clock: the demo crew signed in (producer
// and host as members, a camera phone by join code), a new rehearsal started, screens joined on
// sockets, and the shoot's rows read straight from the file (sqlite.ts).
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { Client, demo, signedIn } from './client'
import { connect, emitAck, type TestSocket } from './sockets'
import { spawnBuiltApp, waitForHealth, type SpawnedApp, type SpawnOptions } from './spawned'
import { queryFile } from './sqlite'

/** The built server on `databasePath`, answering healthy (seeded with the demo studio unless told). */
export async function startFaultApp(databasePath: string, env: Record<string, string> = {}, options: SpawnOptions = {}): Promise<SpawnedApp> {
  const app = await spawnBuiltApp({
    NUXT_DATABASE_PATH: databasePath,
    // The fault tests measure the server, not the per-socket command limit (socket-session.ts).
    HOBLINE_SOCKET_COMMANDS_PER_SECOND: '10000',
    HOBLINE_SOCKET_COMMAND_BURST: '10000',
    ...env,
  }, options)
  await Promise.race([
    waitForHealth(app, (_status, body) => body.status === 'ok'),
    app.exited.then((code) => {
      throw new Error(`the server exited (${code}) before it was healthy:\n${app.log()}`)
    }),
  ])
  return app
}

export interface FaultCrew {
  producer: Client
  host: Client
  camera: Client
  shootId: number
}

/** The demo producer starts a rehearsal of the first episode and runs it; the host signs in; a camera joins by code. */
export async function startShoot(base: string): Promise<FaultCrew> {
  const producer = await signedIn(demo.producer, undefined, base)
  const host = await signedIn(demo.host, undefined, base)
  const episodes = (await producer.get('/api/studios/1/episodes')).body.episodes
  const made = await producer.post(`/api/episodes/${episodes[0].id}/shoots`, { mode: 'rehearsal' })
  if (made.status !== 201) throw new Error(`could not start a shoot: ${made.status} ${JSON.stringify(made.body)}`)
  const shootId: number = made.body.shoot.id
  const started = await producer.post(`/api/shoots/${shootId}/commands`, { type: 'shoot.start' })
  if (started.status !== 200) throw new Error(`could not start the shoot: ${JSON.stringify(started.body)}`)
  const code = (await producer.post(`/api/shoots/${shootId}/join-codes`, { role: 'camera' })).body.code
  const camera = new Client(base)
  await camera.post('/api/join', { code })
  return { producer, host, camera, shootId }
}

/** A socket of `client` joined to the shoot. */
export async function joinedSocket(client: Client, shootId: number): Promise<TestSocket> {
  const socket = await connect(client)
  const joined = await emitAck<{ ok: boolean } & ShootSnapshot>(socket, 'shoot:join', { shootId })
  if (!joined.ok) throw new Error(`could not join the shoot: ${JSON.stringify(joined)}`)
  return socket
}

export interface LoggedEvent {
  seq: number
  type: string
  command: Record<string, unknown>
}

/**
 * The shoot's event log and its stored row (both seq columns and the state), read from the file.
 * `logSeq` is the shoot's seq: its last event's. The row takes the whole state only every few
 * commands (server/shoot/store.ts, CHECKPOINT_EVERY), so while the server runs `rowSeq` may be behind.
 */
export async function shootOnFile(databasePath: string, shootId: number) {
  const events = (await queryFile<{ seq: number; type: string; command: string }>(databasePath,
    `SELECT seq, type, command FROM shoot_events WHERE shoot_id = ${shootId} ORDER BY seq`))
    .map((e) => ({ seq: e.seq, type: e.type, command: JSON.parse(e.command) as Record<string, unknown> }))
  const [row] = await queryFile<{ seq: number; state: string }>(databasePath, `SELECT seq, state FROM shoots WHERE id = ${shootId}`)
  const state = JSON.parse(row!.state) as ShootSnapshot['state']
  return { events, rowSeq: row!.seq, logSeq: events.at(-1)?.seq ?? row!.seq, state }
}
