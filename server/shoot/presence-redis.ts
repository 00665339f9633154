// Who is on each shoot, across app processes (NUXT_REDIS_URL set): the same Presence as presence.ts
// (the handlers call it the same way, without waiting), with the screens of the other processes kept
// in a mirror here. Each process writes its own screens to the hash `hobline:presence:<shoot>`
// (field `<process>|<connection>`) and says so on the channel `hobline:presence`; every process reads
// the hash again when told, and every few seconds. A process that stops beating (its key
// `hobline:process:<id>` expires) is taken off the lists by the others, screens and all.
import { randomUUID } from 'node:crypto'
import type { Redis } from 'ioredis'
import type { ShootPresence } from '../../shared/types/socket-events'
import { createPresence, type Presence } from './presence'

type Screen = ShootPresence['screens'][number]

const CHANNEL = 'hobline:presence'
const hashOf = (shootId: number) => `hobline:presence:${shootId}`
const beatOf = (processId: string) => `hobline:process:${processId}`

export interface SharedPresenceOptions {
  redis: Redis
  subscriber: Redis
  /** A shoot's screens changed on another process (to tell this process's screens). */
  changed?: (shootId: number) => void
  beatMs?: number
}

export function createSharedPresence({ redis, subscriber, changed, beatMs = 5000 }: SharedPresenceOptions): Presence & { stop: () => Promise<void> } {
  const processId = randomUUID().slice(0, 12)
  const local = createPresence()
  const remote = new Map<number, Screen[]>()
  const report = (error: Error) => console.error('[hobline] shared presence:', error.message)

  // The fields this process has written for each shoot (so a screen that left is deleted).
  const mine = new Map<number, string[]>()
  /** Writes this process's screens on a shoot and tells the others (one MULTI, in order on one connection). */
  const publish = (shootId: number) => {
    const fields = Object.fromEntries(local.entries(shootId).map(([id, screen]) => [`${processId}|${id}`, JSON.stringify(screen)]))
    const stale = (mine.get(shootId) ?? []).filter((field) => !(field in fields))
    const batch = redis.multi()
    if (stale.length) batch.hdel(hashOf(shootId), ...stale)
    if (Object.keys(fields).length) batch.hset(hashOf(shootId), fields)
    batch.publish(CHANNEL, JSON.stringify({ shootId, from: processId }))
    void batch.exec().catch(report)
    if (Object.keys(fields).length) mine.set(shootId, Object.keys(fields))
    else mine.delete(shootId)
  }

  /** Reads a shoot's hash again: the other processes' screens, without those of processes that stopped. */
  async function refresh(shootId: number) {
    const all = await redis.hgetall(hashOf(shootId))
    const others = Object.entries(all).filter(([field]) => !field.startsWith(`${processId}|`))
    const processes = [...new Set(others.map(([field]) => field.split('|')[0]!))]
    const alive = processes.length ? await redis.mget(...processes.map(beatOf)) : []
    const gone = new Set(processes.filter((_, n) => alive[n] === null))
    const dead = others.filter(([field]) => gone.has(field.split('|')[0]!)).map(([field]) => field)
    if (dead.length) await redis.hdel(hashOf(shootId), ...dead)
    const screens = others.filter(([field]) => !gone.has(field.split('|')[0]!)).map(([, value]) => JSON.parse(value) as Screen)
    const before = JSON.stringify(remote.get(shootId) ?? [])
    if (screens.length) remote.set(shootId, screens)
    else remote.delete(shootId)
    if (JSON.stringify(screens) !== before) changed?.(shootId)
  }

  const beat = () => redis.set(beatOf(processId), '1', 'PX', beatMs * 3).catch(report)
  void beat()
  const timer = setInterval(() => {
    void beat()
    for (const shootId of new Set([...remote.keys(), ...local.open()])) void refresh(shootId).catch(report)
  }, beatMs)
  timer.unref()
  void subscriber.subscribe(CHANNEL).catch(report)
  subscriber.on('message', (channel: string, text: string) => {
    if (channel !== CHANNEL) return
    const { shootId, from } = JSON.parse(text) as { shootId: number; from: string }
    if (from !== processId) void refresh(shootId).catch(report)
  })

  return {
    enter(shootId, connectionId, role) {
      local.enter(shootId, connectionId, role)
      publish(shootId)
    },
    has: (shootId, connectionId) => local.has(shootId, connectionId),
    setAudible(shootId, connectionId, audible) {
      const had = local.setAudible(shootId, connectionId, audible)
      if (had) publish(shootId)
      return had
    },
    leave(shootId, connectionId) {
      const had = local.leave(shootId, connectionId)
      if (had) publish(shootId)
      return had
    },
    leaveAll(connectionId) {
      const left = local.leaveAll(connectionId)
      for (const shootId of left) publish(shootId)
      return left
    },
    open: () => [...new Set([...local.open(), ...remote.keys()])],
    entries: (shootId) => local.entries(shootId),
    of: (shootId) => ({ screens: [...local.of(shootId).screens, ...(remote.get(shootId) ?? []).map((s) => ({ ...s }))] }),
    async stop() {
      clearInterval(timer)
      for (const [shootId, fields] of mine) await redis.hdel(hashOf(shootId), ...fields).catch(report)
      await redis.del(beatOf(processId)).catch(report)
      await subscriber.quit().catch(() => {})
    },
  }
}
