// socket.io inside Nitro (the pattern of socket.io's "How to use with Nuxt" guide): one engine.io
// server bound to the live shoot's socket.io server (server/utils/shoot.ts), mounted at /socket.io/
// for HTTP long-polling and websockets. Every event goes to the shoot handlers
// (server/shoot/handlers.ts); this file only carries them.
// `engine.prepare` and `engine.onWebSocket` are private engine.io APIs: they stay in this one file
// (versions pinned in package.json; tests/server/shoot-sockets.test.ts covers both transports).
import { Server as Engine } from 'engine.io'
import type { ShootConnection } from '../shoot/handlers'
import { startTicker } from '../shoot/ticker'

export default defineNitroPlugin((nitroApp) => {
  const { io, handlers, store, scriptsMayHaveChanged } = useShoot()
  const engine = new Engine({ pingInterval: 10_000, pingTimeout: 8_000, maxHttpBufferSize: 64 * 1024 })
  io.bind(engine)

  // A handshake from another site's page is refused (the rule of the HTTP middleware,
  // server/utils/same-origin.ts): the client's connect_error carries the refusal as `data`.
  io.use((socket, next) => {
    const siteUrl = String(useRuntimeConfig().public.siteUrl || '')
    const reason = crossSiteReason(requestOrigin(socket.request.headers), siteUrl, 'handshake')
    if (!reason) return next()
    const refused = crossSiteError(reason, 'connection')
    next(Object.assign(new Error(refused.message), { data: refused.body() }))
  })

  // The handshake reads the session once; every event is checked again through the guard.
  io.use(async (socket, next) => {
    socket.data.session = await sessionFromCookieHeader(socket.request.headers.cookie)
    next()
  })

  const limit = socketCommandLimit()

  io.on('connection', (socket) => {
    // Every message spends from the socket's bucket; over the limit an acknowledged event is
    // answered with the 'too-many' refusal and nothing runs, an unacknowledged one is dropped.
    const bucket = createCommandBucket(limit)
    socket.use((packet, next) => {
      // On the monotonic clock: a step of the wall clock (NTP) neither locks a screen out nor lifts the limit.
      const refused = bucket.take(performance.now())
      if (!refused) return next()
      const ack = packet.at(-1)
      if (typeof ack === 'function') ack(refused)
    })
    const conn: ShootConnection = {
      id: socket.id,
      session: socket.data.session,
      rooms: { join: (shootId) => socket.join(shootRoom(shootId)), leave: (shootId) => socket.leave(shootRoom(shootId)) },
    }
    // Events with an answer: the handler's result is the acknowledgement.
    const answered = {
      'shoot:join': handlers.join, 'shoot:snapshot': handlers.snapshot, 'shoot:command': handlers.command, 'clock:ping': handlers.ping,
    } as const
    for (const [name, handle] of Object.entries(answered)) {
      socket.on(name as keyof typeof answered, async (payload: unknown, ack: unknown) => {
        if (typeof ack === 'function') ack(await handle(conn, payload))
      })
    }
    // Events without one.
    socket.on('shoot:leave', (payload) => void handlers.leave(conn, payload))
    socket.on('screen:alarm', (payload) => void handlers.alarm(conn, payload))
    socket.on('disconnect', () => handlers.disconnect(conn))
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

  const ticker = startTicker(handlers.engine)

  // A write that may change what a shoot's screens read (prices, recipes, episodes, studio settings,
  // crew paces) sends the open shoots their new script (useShoot's scriptsMayHaveChanged).
  nitroApp.hooks.hook('afterResponse', (event) => {
    const method = event.method
    if (method === 'GET' || method === 'HEAD' || method === 'OPTIONS') return
    if (getResponseStatus(event) >= 400) return
    if (/^\/api\/(recipes|episodes|studios)\//.test(event.path)) scriptsMayHaveChanged()
  })

  nitroApp.hooks.hook('close', async () => {
    ticker.stop()
    io.close()
    engine.close()
    await store.close()
  })
})
