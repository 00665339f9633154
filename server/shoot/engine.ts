// The live shoot's engine: one command is authorised (the role table in shoot-commands.ts, through
// applyShootCommand), reduced, persisted with its sequence number in one transaction, and
// broadcast to the shoot's room as a JSON Patch (RFC 6902, state-diff.ts, walking only what changed) from the
// state before to the state after, with both sequence numbers (shared/utils/shoot-wire.ts). The latest state of each shoot that has not ended is kept in
// memory for the ticker; the database is what counts (a restart reloads it, and timers that fell
// due while the server was down fire at once).
import { randomUUID } from 'node:crypto'
import type { ShootActor, ShootMode, ShootPlan, ShootSegment, ShootState } from '../../shared/types/shoot'
import type { ShootEventMessage } from '../../shared/types/socket-events'
import { DomainError, type DomainErrorBody } from '../../shared/utils/domain-error'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { markDueTimers } from '../../shared/utils/shoot-timers'
import { diffStates } from './state-diff'
import type { ShootRow, ShootStore } from './store'

export type CommandOutcome = { ok: true; seq: number } | { ok: false; error: DomainErrorBody }

export interface ShootEngineOptions {
  store: ShootStore
  /** Hands an accepted change to every screen on the shoot. */
  broadcast: (shootId: number, message: ShootEventMessage) => void
  now?: () => number
  newId?: () => string
}

export interface NewShootInput {
  studioId: number
  episodeId: number | null
  title: string
  mode: ShootMode
  createdBy: number | null
  runOrder: ShootSegment[]
  plan?: ShootPlan | null
}

export type ShootEngine = ReturnType<typeof createShootEngine>

export function createShootEngine({ store, broadcast, now = Date.now, newId = () => randomUUID().slice(0, 12) }: ShootEngineOptions) {
  const live = new Map<number, ShootState>()

  const remember = (shootId: number, state: ShootState) => {
    if (state.status === 'ended') live.delete(shootId)
    else live.set(shootId, state)
  }
  const send = (change: { message: ShootEventMessage; state: ShootState } | null) => {
    if (!change) return
    remember(change.message.shootId, change.state)
    broadcast(change.message.shootId, change.message)
  }
  /** The change from `before` to `after` as the screens get it. */
  const patchOf = (before: ShootState, after: ShootState) => ({ baseSeq: before.seq, patch: diffStates(before, after) })
  const stateOf = (row: ShootRow | null, shootId: number): ShootState => {
    if (!row) throw new DomainError('not-found', 'There is no such shoot.')
    remember(shootId, row.state)
    return row.state
  }

  return {
    async create(input: NewShootInput): Promise<ShootRow> {
      if (!input.runOrder.length) throw new DomainError('invalid', 'The episode has no segments yet. Add a recipe to it before shooting.')
      const { mode, runOrder, plan } = input
      const row = await store.create({ ...input, state: (id) => createShootState({ id: String(id), mode, runOrder, plan }) })
      remember(row.id, row.state)
      return row
    },

    /** The shoot as stored; a DomainError 'not-found' when there is none. */
    async read(shootId: number): Promise<ShootRow> {
      const row = await store.read(shootId)
      stateOf(row, shootId)
      return row!
    },

    /** Applies one command from `actor` (a member or device already let into the shoot). */
    async apply(shootId: number, command: unknown, actor: ShootActor): Promise<CommandOutcome> {
      let sent: { message: ShootEventMessage; state: ShootState } | null = null
      const outcome = await store.transaction(async (tx): Promise<CommandOutcome> => {
        const state = stateOf(await tx.read(shootId), shootId)
        const at = now()
        const result = applyShootCommand(state, command, { nowServerMs: at, actor, newId })
        if (!result.ok) return { ok: false, error: result.error }
        const type = (command as { type: string }).type
        const change = patchOf(state, result.state)
        await tx.write(shootId, result.state, { type, command, actor, serverMs: at, patch: change.patch })
        const message = { shootId, seq: result.state.seq, type, by: actor, events: result.events, ...change, serverNow: at }
        sent = { message, state: result.state }
        return { ok: true, seq: result.state.seq }
      })
      send(sent)
      return outcome
    },

    /** Marks due every timer whose deadline has passed on a live shoot, persists and broadcasts it. */
    async tick(): Promise<number> {
      const at = now()
      const candidates = [...live.entries()]
        .filter(([, s]) => s.timers.some((t) => t.state === 'running' && t.deadlineServerMs !== null && t.deadlineServerMs <= at))
      for (const [shootId] of candidates) {
        let change: { message: ShootEventMessage; state: ShootState } | null = null
        await store.transaction(async (tx) => {
          const row = await tx.read(shootId)
          if (!row) return live.delete(shootId)
          const t = now()
          const { state: next, due } = markDueTimers(row.state, t)
          if (!due.length) return
          const patch = patchOf(row.state, next)
          await tx.write(shootId, next, { type: 'timer.due', command: { type: 'timer.due', timerIds: due.map((d) => d.id) }, actor: null, serverMs: t, patch: patch.patch })
          const message = {
            shootId, seq: next.seq, type: 'timer.due', by: null, serverNow: t, ...patch,
            events: due.map((d) => ({ type: 'timer.due' as const, timerId: d.id, label: d.label, slot: d.slot, sound: d.sound, dueAtServerMs: d.dueAtServerMs ?? t })),
          }
          change = { message, state: next }
        })
        send(change)
      }
      return candidates.length
    },

    /**
     * Loads every shoot that has not ended, so the ticker watches their timers (at start-up, and
     * again every few seconds with several app processes: live-watch.ts); one ended elsewhere is dropped.
     */
    async loadLive(): Promise<number> {
      const rows = await store.live()
      const ids = new Set(rows.map((r) => r.id))
      for (const id of live.keys()) if (!ids.has(id)) live.delete(id)
      // A state this process has just written is kept over an older one read before it was committed.
      for (const r of rows) if ((live.get(r.id)?.seq ?? -1) <= r.state.seq) remember(r.id, r.state)
      return rows.length
    },
  }
}
