// The Redis that app processes share when there are several of them (NUXT_REDIS_URL; DEVELOPERS.md,
// "Running on more than one machine"): socket.io's rooms across processes (@socket.io/redis-adapter),
// the attempt limits (throttle.ts) and who is on each shoot (server/shoot/presence-redis.ts). Unset,
// every process keeps them in its own memory, as one process needs. One connection for commands,
// made on first use; subscribers take a duplicate each (a subscribed connection runs no commands).
import { Redis } from 'ioredis'

let client: Redis | undefined

export function redisUrl(): string {
  return String(useRuntimeConfig().redisUrl || '').trim()
}

/** The shared command connection, or null when no Redis is configured. */
export function useRedis(): Redis | null {
  const url = redisUrl()
  if (!url) return null
  if (!client) {
    client = new Redis(url, { maxRetriesPerRequest: 3, enableOfflineQueue: true })
    client.on('error', (error) => console.error('[hobline] redis:', error.message))
  }
  return client
}

/** A new connection to the same Redis, for a subscriber. */
export function duplicateRedis(): Redis {
  const copy = useRedis()!.duplicate()
  copy.on('error', (error) => console.error('[hobline] redis subscriber:', error.message))
  return copy
}

export async function closeRedis() {
  const c = client
  client = undefined
  await c?.quit().catch(() => {})
}
