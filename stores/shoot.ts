// The live shoot on a screen. Every socket listener is bound here, once (bind); components read the
// state and call the actions. The server is authoritative: the store applies each `shoot:event`'s
// JSON Patch in sequence (shared/utils/shoot-wire.ts), asks for a snapshot when it sees a gap, a
// patch that does not apply or (re)connects, and shows a
// command's effect early only by applying the same reducer to a copy until the server answers.
// Times: `offset` turns this device's clock into the server clock (RFC 5905 samples through
// shared/utils/clock.ts); every countdown is drawn from deadline − (local now + offset).
import { defineStore } from 'pinia'
import type { ShootSocket } from '~/plugins/socket.client'
import type { ShootCommand, ShootCommandType, ShootRole, ShootState } from '~~/shared/types/shoot'
import type { ShootEventMessage, ShootPresence, ShootSnapshot } from '~~/shared/types/socket-events'
import { clockFilterAdd, clockFilterBest, ntpSample, serverNow, type ClockSample } from '~~/shared/utils/clock'
import { shootCommandAllowed } from '~~/shared/utils/shoot-commands'
import { shootCursorMoved, shootCursorRef, shootStepRefAt } from '~~/shared/utils/shoot'
import { applyKnownShootCommand } from '~~/shared/utils/shoot-apply'
import { refusal, type Refusal } from '~~/shared/utils/domain-error'
import { keepLastSnapshot, readLastSnapshot } from '~/composables/last-snapshot'

export type ShootConnection = 'connecting' | 'online' | 'offline'

export const SHOOT_OFFLINE_MESSAGE = 'Offline: this was not sent. Wait for the connection to come back.'
export const SHOOT_NO_ANSWER_MESSAGE = 'The server did not answer within 5 seconds, so this may not have been applied. Check the screen before sending it again.'
const ACK_TIMEOUT_MS = 5000
const PING_TIMEOUT_MS = 2000
/** Pings per sampling round: the size of the RFC 5905 §10 clock filter. */
const CLOCK_SAMPLES = 8
const CLOCK_RESAMPLE_MS = 30_000
/** A local clock that moved this much more (or less) than the monotonic clock was set by hand. */
const CLOCK_JUMP_MS = 1000
const CLOCK_CHECK_MS = 5000
const LOG_SIZE = 50

/** A command sent and not yet settled: shown through the reducer until the server's state has it. */
export interface ShootPendingCommand {
  key: number
  command: ShootCommand
  atServerMs: number
  /** The sequence number the server gave it; the entry goes once the store's seq reaches it. */
  ackedSeq: number | null
}

/** One applied message, without its state: what happened, for screens that react (alarms, toasts). */
export interface ShootLogEntry {
  seq: number
  type: string
  by: ShootEventMessage['by']
  events: ShootEventMessage['events']
  atServerMs: number
}

/** A command's answer: the sequence number it was given, or the server's refusal (one shape everywhere). */
export type ShootCommandReply = { ok: true; seq: number } | Refusal

/** A random id for a new timer or marker (the schema allows 1–64 of [A-Za-z0-9_-]); getRandomValues
 * works on a plain-HTTP address on the studio network, where randomUUID does not. */
function newItemId(): string {
  return Array.from(crypto.getRandomValues(new Uint8Array(8)), (b) => b.toString(16).padStart(2, '0')).join('')
}

/** The command with the ids the server would otherwise make, so the early copy and the real one match. */
function withIds(cmd: ShootCommand): ShootCommand {
  if (cmd.type === 'timer.start' && !cmd.timerId) return { ...cmd, timerId: newItemId() }
  if (cmd.type === 'marker.add' && !cmd.markerId) return { ...cmd, markerId: newItemId() }
  if (cmd.type === 'camera.set' && !cmd.cameraId) return { ...cmd, cameraId: newItemId() }
  return cmd
}

/** The patch apply (shared/utils/shoot-wire.ts) loads with the first event, outside the prompter's
 * first bundle; until it has loaded (or when it cannot), an event brings a snapshot instead. */
let applyMessage: typeof import('~~/shared/utils/shoot-wire').applyShootMessage | null = null
let loadingWire: Promise<unknown> | null = null
function loadWire() {
  loadingWire ??= import('~~/shared/utils/shoot-wire').then((m) => (applyMessage = m.applyShootMessage), () => (loadingWire = null))
}

export const useShootStore = defineStore('shoot', () => {
  const shootId = ref<number | null>(null)
  /** The server's latest state with the shoot, its steps and who this screen is. */
  const snapshot = shallowRef<ShootSnapshot | null>(null)
  /** Sequence number of the server state held (snapshot.state.seq). */
  const seq = ref(0)
  const connection = ref<ShootConnection>('connecting')
  /** What the browser says about the network (navigator.onLine). */
  const browserOnline = ref(true)
  /** Add to Date.now() to read the server clock, in ms. */
  const offset = ref(0)
  /** Round-trip delay of the sample the offset comes from (ms); null before the first sample. */
  const clockDelay = ref<number | null>(null)
  /** Local Date.now() of the last sampling round. */
  const clockSampledAt = ref<number | null>(null)
  /** The last message to show: a refusal, an offline refusal, a failed join. */
  const error = ref<string | null>(null)
  const errorCode = ref<string | null>(null)
  const pending = shallowRef<ShootPendingCommand[]>([])
  const log = shallowRef<ShootLogEntry[]>([])
  const bound = ref(false)
  /** The screens on this shoot and which ring aloud while the camera rolls (quiet on set). */
  const presence = shallowRef<ShootPresence>({ screens: [] })
  /** This screen's own alarm setting, told to the server on every join. */
  const audibleWhileRolling = ref(false)
  /** Local Date.now() when the state held last came from the server (null: not yet). */
  const heardAt = ref<number | null>(null)
  /** The state held was read back from this device's storage, not yet confirmed by the server. */
  const fromStorage = ref(false)

  let socket: ShootSocket | null = null
  let nextKey = 1
  let highestSeen = 0
  let resyncing: Promise<void> | null = null
  let sampling: Promise<void> | null = null
  let lastCheck = { wall: 0, mono: 0 }

  // ---- getters -------------------------------------------------------------------------------

  const online = computed(() => connection.value === 'online' && browserOnline.value)
  const you = computed(() => snapshot.value?.you ?? null)
  const role = computed(() => snapshot.value?.you.role ?? null)
  const steps = computed(() => snapshot.value?.steps ?? {})
  const serverState = computed(() => snapshot.value?.state ?? null)

  /** What the screen draws: the server state with the commands still in flight applied on top. */
  const state = computed<ShootState | null>(() => {
    const base = snapshot.value?.state
    if (!base) return null
    if (!pending.value.length) return base
    const actor = { role: (you.value?.role ?? 'viewer') as ShootRole, id: you.value?.actorId ?? 'me' }
    return pending.value.reduce<ShootState>((s, p) => {
      const r = applyKnownShootCommand(s, p.command, { nowServerMs: p.atServerMs, actor })
      return r.ok ? { ...r.state, seq: s.seq } : s
    }, base)
  })

  const cursorRef = computed(() => (state.value ? shootCursorRef(state.value) : null))
  const currentSegment = computed(() => (state.value && cursorRef.value ? state.value.runOrder[cursorRef.value.segment] ?? null : null))
  const currentStep = computed(() => (cursorRef.value?.stepId ? steps.value[cursorRef.value.stepId] ?? null : null))
  const nextRef = computed(() => {
    const s = state.value
    const moved = s ? shootCursorMoved(s.runOrder, s.cursor, 1) : null
    return s && moved ? shootStepRefAt(s.runOrder, moved) : null
  })
  const nextStep = computed(() => (nextRef.value?.stepId ? steps.value[nextRef.value.stepId] ?? null : null))
  /** The episode as a show (null for a shoot without one), and the show segment the cursor is on. */
  const show = computed(() => snapshot.value?.show ?? null)
  const currentShowSegment = computed(() => (currentSegment.value ? show.value?.segments[currentSegment.value.id] ?? null : null))

  /** Whether this screen's role may send a command type (the server decides again). */
  function can(type: ShootCommandType): boolean {
    return !!role.value && shootCommandAllowed(role.value, type)
  }

  /** The server clock now, as this device reads it. */
  function serverNowMs(): number {
    return serverNow(Date.now(), offset.value)
  }

  // ---- taking the server's state ---------------------------------------------------------------

  function setError(e: { code: string; message: string } | null) {
    error.value = e?.message ?? null
    errorCode.value = e?.code ?? null
  }
  function clearError() {
    setError(null)
  }

  function settlePending() {
    const left = pending.value.filter((p) => p.ackedSeq === null || p.ackedSeq > seq.value)
    if (left.length !== pending.value.length) pending.value = left
  }

  /** Takes a snapshot unless the store already holds a later state of the same shoot. */
  function adopt(next: ShootSnapshot, guessOffset: boolean) {
    if (next.shoot.id !== shootId.value) return
    // A state read back from storage gives way to whatever the server says (its database may be new).
    if (snapshot.value && next.state.seq < seq.value && !fromStorage.value) return
    fromStorage.value = false
    snapshot.value = next
    // A snapshot that came with the page may be a kept page's (the service worker's, offline): its server time says how old.
    heard(guessOffset ? Date.now() : Math.min(Date.now(), next.serverNow))
    if (next.presence) presence.value = next.presence
    seq.value = next.state.seq
    highestSeen = Math.max(highestSeen, next.state.seq)
    settlePending()
    // Until the first ping round: the time the server stamped, late by the trip here.
    if (guessOffset && clockDelay.value === null) offset.value = next.serverNow - Date.now()
  }

  /** Notes the moment the server was heard, and keeps the state on the device (composables/last-snapshot.ts). */
  function heard(at = Date.now()) {
    if (!import.meta.client || !snapshot.value) return
    heardAt.value = at
    keepLastSnapshot(snapshot.value, heardAt.value)
  }

  /** A later state this device kept of the shoot, drawn until the server answers. */
  function restore(id: number) {
    const stored = readLastSnapshot(id, snapshot.value?.you.actorId)
    if (!stored || (snapshot.value && stored.snapshot.state.seq <= seq.value)) return
    snapshot.value = stored.snapshot
    seq.value = stored.snapshot.state.seq
    heardAt.value = stored.heardAt
    fromStorage.value = true
  }

  function onEvent(message: ShootEventMessage) {
    if (message.shootId !== shootId.value || !snapshot.value) return // a join in flight brings it
    highestSeen = Math.max(highestSeen, message.seq)
    if (message.seq <= seq.value) return
    // A state read back from storage may be another database's: the server's snapshot comes first.
    if (!applyMessage) loadWire()
    const next = applyMessage && !fromStorage.value ? applyMessage(snapshot.value.state, message) : null
    if (!next) {
      void resync()
      return
    }
    snapshot.value = { ...snapshot.value, state: next, serverNow: message.serverNow }
    seq.value = message.seq
    heard()
    const { seq: s, type, by, events, serverNow: atServerMs } = message
    log.value = [...log.value.slice(1 - LOG_SIZE), { seq: s, type, by, events, atServerMs }]
    settlePending()
  }

  /** Asks the server for the whole state (after a gap in sequence numbers or a lost answer). */
  function resync(): Promise<void> {
    if (resyncing) return resyncing
    const id = shootId.value
    if (!socket?.connected || id === null) return Promise.resolve()
    const s = socket
    resyncing = (async () => {
      try {
        const reply = await s.timeout(ACK_TIMEOUT_MS).emitWithAck('shoot:snapshot', { shootId: id })
        if (reply.ok) {
          const { ok: _ok, ...snap } = reply
          adopt(snap, true)
        } else setError(reply.error)
      } catch {
        // No answer: the next event or the next reconnect asks again.
      } finally {
        resyncing = null
      }
      if (seq.value < highestSeen && shootId.value === id) void resync()
    })()
    return resyncing
  }

  /** Joins the shoot's room and takes the snapshot the server answers with. */
  async function join(): Promise<void> {
    const id = shootId.value
    if (!socket?.connected || id === null) return
    try {
      const reply = await socket.timeout(ACK_TIMEOUT_MS).emitWithAck('shoot:join', { shootId: id })
      if (id !== shootId.value) return
      if (reply.ok) {
        const { ok: _ok, ...snap } = reply
        adopt(snap, true)
        socket.emit('screen:alarm', { shootId: id, audibleWhileRolling: audibleWhileRolling.value })
        if (errorCode.value === 'join') setError(null)
      } else setError(reply.error)
    } catch {
      setError({ code: 'join', message: 'The server did not answer when this screen joined the shoot; it tries again when the connection comes back.' })
    }
  }

  // ---- the clock -------------------------------------------------------------------------------

  /** One round of pings; the lowest-delay sample gives the offset (RFC 5905 §8 and §10). */
  function sampleClock(count = CLOCK_SAMPLES): Promise<void> {
    if (sampling) return sampling
    if (!socket?.connected) return Promise.resolve()
    const s = socket
    sampling = (async () => {
      let samples: ClockSample[] = []
      try {
        for (let i = 0; i < count && s.connected; i++) {
          const t1 = Date.now()
          const reply = await s.timeout(PING_TIMEOUT_MS).emitWithAck('clock:ping', { t1 })
          const t4 = Date.now()
          try {
            samples = clockFilterAdd(samples, ntpSample(t1, reply.t2, reply.t3, t4), CLOCK_SAMPLES)
          } catch {
            // Times that cannot be (the local clock stepped back mid-ping): the sample is left out.
          }
        }
      } catch {
        // A ping went unanswered: keep what this round has.
      } finally {
        const best = clockFilterBest(samples)
        if (best) {
          offset.value = best.offset
          clockDelay.value = best.delay
          clockSampledAt.value = Date.now()
        }
        sampling = null
      }
    })()
    return sampling
  }

  /** Every few seconds: re-sample when the last round is old or the local clock was set by hand. */
  function checkClock() {
    const wall = Date.now()
    const mono = performance.now()
    const jumped = lastCheck.mono > 0 && Math.abs((wall - lastCheck.wall) - (mono - lastCheck.mono)) > CLOCK_JUMP_MS
    lastCheck = { wall, mono }
    if (!socket?.connected || shootId.value === null || document.visibilityState !== 'visible') return
    if (jumped || clockSampledAt.value === null || wall - clockSampledAt.value >= CLOCK_RESAMPLE_MS) void sampleClock()
  }

  // ---- binding ---------------------------------------------------------------------------------

  function onConnect() {
    connection.value = 'online'
    if (shootId.value === null) return
    void join().then(() => sampleClock())
  }

  /** Registers every socket and page listener, once for the life of the app. */
  function bind() {
    if (bound.value || !import.meta.client) return
    const s: ShootSocket = useNuxtApp().$socket
    socket = s
    bound.value = true
    browserOnline.value = navigator.onLine
    s.on('connect', onConnect)
    s.on('disconnect', (reason) => {
      connection.value = 'offline'
      // The server closed this socket on purpose; socket.io does not retry that by itself.
      if (reason === 'io server disconnect' && shootId.value !== null) s.connect()
    })
    s.on('connect_error', () => {
      connection.value = 'offline'
    })
    s.on('shoot:event', onEvent)
    s.on('shoot:presence', (message) => {
      if (message.shootId === shootId.value) presence.value = { screens: message.screens }
    })
    // A price, a recipe or the episode changed: the new script, live fields written again.
    s.on('shoot:script', ({ shootId: id, ...script }) => {
      if (id === shootId.value && snapshot.value) snapshot.value = { ...snapshot.value, ...script }
    })
    window.addEventListener('offline', () => {
      browserOnline.value = false
      // The network is gone: drop the transport now rather than after the heartbeat times out, so
      // the screen says so at once; socket.io then retries until the network is back.
      if (s.connected) s.io.engine?.close()
    })
    window.addEventListener('online', () => {
      browserOnline.value = true
      if (shootId.value !== null && !s.connected) s.connect()
    })
    document.addEventListener('visibilitychange', () => {
      if (document.visibilityState !== 'visible' || shootId.value === null) return
      void resync()
      checkClock()
    })
    window.setInterval(checkClock, CLOCK_CHECK_MS)
  }

  // ---- actions for screens ---------------------------------------------------------------------

  /** Says whether this screen rings aloud while the camera rolls. */
  function setAudibleWhileRolling(audible: boolean) {
    audibleWhileRolling.value = audible
    if (socket?.connected && shootId.value !== null) socket.emit('screen:alarm', { shootId: shootId.value, audibleWhileRolling: audible })
  }

  /** Holds a snapshot fetched with the page, so the screen draws on the server and on its first
   * frame before the socket is up; open() then joins the shoot live. */
  function prime(id: number, initial: ShootSnapshot) {
    if (shootId.value !== null && shootId.value !== id) return
    shootId.value = id
    adopt(initial, false)
  }

  /** Opens a shoot on this screen: joins its room and loads its snapshot (a snapshot fetched over
   * HTTP can be passed to draw at once). */
  async function open(id: number, initial?: ShootSnapshot | null): Promise<void> {
    bind()
    if (shootId.value !== null && shootId.value !== id) leave()
    shootId.value = id
    if (initial) adopt(initial, false)
    restore(id)
    if (!socket) return
    if (socket.connected) {
      connection.value = 'online'
      await join()
      await sampleClock()
    } else {
      connection.value = browserOnline.value ? 'connecting' : 'offline'
      socket.connect()
    }
  }

  /** Leaves the shoot's room and forgets it; the socket closes until a shoot is opened again. */
  function leave() {
    const id = shootId.value
    if (id !== null && socket?.connected) socket.emit('shoot:leave', { shootId: id })
    shootId.value = null
    snapshot.value = null
    seq.value = 0
    highestSeen = 0
    pending.value = []
    log.value = []
    presence.value = { screens: [] }
    heardAt.value = null
    fromStorage.value = false
    setError(null)
    socket?.disconnect()
    connection.value = 'connecting'
  }

  /**
   * Sends a command. Offline it is refused at once and not kept for later: the crew must see that
   * nothing happened. Online its effect shows straight away; a refusal rolls it back and keeps the
   * server's message in `error`.
   */
  async function command(cmd: ShootCommand): Promise<ShootCommandReply> {
    const id = shootId.value
    const refuse = (code: string, message: string): ShootCommandReply => {
      setError({ code, message })
      return refusal({ code, message })
    }
    if (id === null || !snapshot.value) return refuse('no-shoot', 'No shoot is open on this screen.')
    if (!online.value || !socket?.connected) return refuse('offline', SHOOT_OFFLINE_MESSAGE)
    const sent = withIds(cmd)
    setError(null)
    const key = nextKey++
    pending.value = [...pending.value, { key, command: sent, atServerMs: serverNowMs(), ackedSeq: null }]
    const drop = () => {
      pending.value = pending.value.filter((p) => p.key !== key)
    }
    try {
      const reply = await socket.timeout(ACK_TIMEOUT_MS).emitWithAck('shoot:command', { shootId: id, ...sent })
      if (!reply.ok) {
        drop()
        return refuse(reply.error.code, reply.error.message)
      }
      if (reply.seq <= seq.value) drop()
      else {
        // The answer came before the event (this screen was not in the room yet): fetch the state.
        pending.value = pending.value.map((p) => (p.key === key ? { ...p, ackedSeq: reply.seq } : p))
        highestSeen = Math.max(highestSeen, reply.seq)
        void resync()
      }
      return { ok: true, seq: reply.seq }
    } catch {
      drop()
      void resync()
      return refuse('no-answer', SHOOT_NO_ANSWER_MESSAGE)
    }
  }

  return {
    shootId, snapshot, seq, connection, browserOnline, offset, clockDelay, clockSampledAt, error, errorCode, pending, log, bound,
    presence, audibleWhileRolling, setAudibleWhileRolling, heardAt, fromStorage, online, you, role, steps, serverState, state,
    cursorRef, currentSegment, currentStep, nextRef, nextStep, show, currentShowSegment,
    can, serverNowMs, clearError, bind, prime, open, leave, command, resync, sampleClock,
  }
})
