// socket.io inside Nitro (the pattern of socket.io's "How to use with Nuxt" guide): one engine.io
// server and one socket.io server, mounted at /socket.io/ for HTTP long-polling and websockets.
// `engine.prepare` and `engine.onWebSocket` are private engine.io APIs: they stay in this one file
// (versions pinned in package.json; tests/server/shoot-sockets.test.ts covers both transports).
import { Server as Engine } from 'engine.io'
import { Server } from 'socket.io'
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/types/socket-events'
import { GuardError, authorizeSession } from '../utils/guard'

const TICK_MS = 250

export default defineNitroPlugin((nitroApp) => {
  const engine = new Engine({ pingInterval: 10_000, pingTimeout: 8_000, maxHttpBufferSize: 64 * 1024 })
  const io = new Server<ClientToServerEvents, ServerToClientEvents>({ serveClient: false })
  io.bind(engine)
  const room = (shootId: number) => `shoot:${shootId}`
  // `sentAt` (wall clock, sub-millisecond) lets a screen and the benchmark see how long delivery took.
  // Who is on each shoot: every screen in a room says its role and whether it rings aloud while the
  // camera rolls (quiet on set), so no due timer is left silent on every device.
  type Screen = { role: string; audibleWhileRolling: boolean }
  const screenOf = (socketId: string, shootId: number): Screen | undefined =>
    (io.sockets.sockets.get(socketId)?.data.screens as Map<number, Screen> | undefined)?.get(shootId)
  const presence = (shootId: number) => ({
    screens: [...(io.sockets.adapter.rooms.get(room(shootId)) ?? [])].map((id) => screenOf(id, shootId)).filter((x): x is Screen => !!x),
  })
  const announce = (shootId: number) => io.to(room(shootId)).emit('shoot:presence', { shootId, ...presence(shootId) })
  setShootBroadcast((shootId, message) => io.to(room(shootId)).emit('shoot:event', { ...message, sentAt: performance.timeOrigin + performance.now() }), presence)

  // The handshake: read the session once; every event re-checks it through the guard.
  io.use(async (socket, next) => {
    socket.data.session = await sessionFromCookieHeader(socket.request.headers.cookie)
    next()
  })

  const refuse = (error: unknown) => {
    if (error instanceof GuardError) return { ok: false as const, error: { code: error.statusCode === 401 ? 'signed-out' : error.statusCode === 404 ? 'not-found' : 'forbidden', message: error.message } }
    const status = (error as { statusCode?: number }).statusCode
    if (status && status < 500) return { ok: false as const, error: { code: 'refused', message: (error as { statusMessage?: string }).statusMessage ?? 'Refused.' } }
    console.error('[hobline] socket event failed:', error)
    return { ok: false as const, error: { code: 'server', message: 'The server could not do that; nothing changed. Try again.' } }
  }
  const shootIdOf = (payload: unknown) => {
    const id = Number((payload as { shootId?: unknown } | null)?.shootId)
    return Number.isSafeInteger(id) && id > 0 ? id : null
  }
  const badShoot = { ok: false as const, error: { code: 'invalid', message: 'shootId: send the number of the shoot.', field: 'shootId' } }

  io.on('connection', (socket) => {
    const screens = new Map<number, Screen>()
    socket.data.screens = screens
    socket.on('clock:ping', (payload, ack) => {
      const t2 = Date.now()
      if (typeof ack !== 'function') return
      ack({ t1: Number(payload?.t1) || 0, t2, t3: Date.now() })
    })

    const snapshot = async (payload: unknown, ack: unknown, join: boolean) => {
      if (typeof ack !== 'function') return
      const shootId = shootIdOf(payload)
      if (!shootId) return ack(badShoot)
      try {
        const caller = await authorizeSession(socket.data.session, { shootId }, 'shoot.read')
        if (join) {
          await socket.join(room(shootId))
          screens.set(shootId, { role: caller.role, audibleWhileRolling: screens.get(shootId)?.audibleWhileRolling ?? false })
        }
        ack({ ok: true, ...(await shootSnapshot(shootId, caller)) })
        if (join) announce(shootId)
      } catch (error) {
        ack(refuse(error))
      }
    }
    socket.on('shoot:join', (payload, ack) => snapshot(payload, ack, true))
    socket.on('shoot:snapshot', (payload, ack) => snapshot(payload, ack, false))
    socket.on('shoot:leave', (payload) => {
      const shootId = shootIdOf(payload)
      if (!shootId) return
      screens.delete(shootId)
      void Promise.resolve(socket.leave(room(shootId))).then(() => announce(shootId))
    })
    socket.on('screen:alarm', async (payload) => {
      const shootId = shootIdOf(payload)
      const screen = shootId ? screens.get(shootId) : undefined
      if (!shootId || !screen || typeof payload?.audibleWhileRolling !== 'boolean') return
      try {
        await authorizeSession(socket.data.session, { shootId }, 'shoot.read')
      } catch {
        return
      }
      screen.audibleWhileRolling = payload.audibleWhileRolling
      announce(shootId)
    })
    socket.on('disconnect', () => {
      for (const shootId of screens.keys()) announce(shootId)
      screens.clear()
    })

    socket.on('shoot:command', async (payload, ack) => {
      if (typeof ack !== 'function') return
      const shootId = shootIdOf(payload)
      if (!shootId) return ack(badShoot)
      const { shootId: _id, ...command } = payload as { shootId: number; type: string }
      try {
        const caller = await authorizeSession(socket.data.session, { shootId }, commandAction(String(command.type)))
        ack(await runShootCommand(shootId, command, caller))
      } catch (error) {
        ack(refuse(error))
      }
    })
  })

  nitroApp.router.use('/socket.io/', defineEventHandler({
    handler(event) {
      engine.handleRequest(event.node.req as never, event.node.res as never)
      event._handled = true
    },
    websocket: {
      open(peer) {
        const internal = (peer as unknown as { _internal: { nodeReq: { socket: unknown } } })._internal
        // @ts-expect-error private engine.io API (see the file comment)
        engine.prepare(internal.nodeReq)
        // @ts-expect-error private engine.io API (see the file comment)
        engine.onWebSocket(internal.nodeReq, internal.nodeReq.socket, (peer as unknown as { websocket: unknown }).websocket)
      },
    },
  }))

  // Timers are deadlines; this tick only notices the ones that have passed, including those that
  // fell due while the server was down (loaded first).
  let ticking = false
  const timer = setInterval(async () => {
    if (ticking) return
    ticking = true
    try {
      await tickDueTimers()
    } catch (error) {
      console.error('[hobline] due-timer tick failed:', error)
    } finally {
      ticking = false
    }
  }, TICK_MS)
  useDb().then(loadLiveShoots).then(() => tickDueTimers()).catch((error) => console.error('[hobline] could not load live shoots:', error))

  nitroApp.hooks.hook('close', async () => {
    clearInterval(timer)
    io.close()
    engine.close()
    await closeShootDb()
  })
})
