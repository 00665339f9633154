// Who is on each shoot: every screen that joined says its role and whether it rings aloud while
// the camera rolls (quiet on set), so no due timer is left silent on every device. Plain memory,
// keyed by connection; the socket mount tells it when a connection goes away.
import type { ShootPresence } from '../../shared/types/socket-events'

type Screen = ShootPresence['screens'][number]

export type Presence = ReturnType<typeof createPresence>

export function createPresence() {
  const shoots = new Map<number, Map<string, Screen>>()

  return {
    /** A connection joins a shoot (again): its alarm setting is kept across a re-join. */
    enter(shootId: number, connectionId: string, role: string) {
      const screens = shoots.get(shootId) ?? new Map<string, Screen>()
      shoots.set(shootId, screens)
      screens.set(connectionId, { role, audibleWhileRolling: screens.get(connectionId)?.audibleWhileRolling ?? false })
    },
    /** Whether the connection is on the shoot: only such screens may set their alarm. */
    has(shootId: number, connectionId: string) {
      return !!shoots.get(shootId)?.has(connectionId)
    },
    setAudible(shootId: number, connectionId: string, audibleWhileRolling: boolean) {
      const screen = shoots.get(shootId)?.get(connectionId)
      if (screen) screen.audibleWhileRolling = audibleWhileRolling
      return !!screen
    },
    leave(shootId: number, connectionId: string) {
      const screens = shoots.get(shootId)
      const had = !!screens?.delete(connectionId)
      if (screens && !screens.size) shoots.delete(shootId)
      return had
    },
    /** Every shoot the connection was on, now left (a disconnect). */
    leaveAll(connectionId: string): number[] {
      const left: number[] = []
      for (const [shootId, screens] of shoots) if (screens.has(connectionId)) left.push(shootId)
      for (const shootId of left) this.leave(shootId, connectionId)
      return left
    },
    /** The shoots with at least one screen on them now. */
    open(): number[] {
      return [...shoots.keys()]
    },
    /** Each connection on the shoot with its screen (the shared presence, presence-redis.ts, writes them out). */
    entries(shootId: number): Array<[string, Screen]> {
      return [...(shoots.get(shootId)?.entries() ?? [])].map(([id, s]) => [id, { ...s }])
    },
    of(shootId: number): ShootPresence {
      return { screens: [...(shoots.get(shootId)?.values() ?? [])].map((s) => ({ ...s })) }
    },
  }
}
