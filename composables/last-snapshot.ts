// The last shoot state a screen had, kept in this device's localStorage, so a prompter or cue
// screen reopened while the laptop is unreachable (an installed screen started again, or a reload
// served by the service worker) shows where the shoot was, under the "reconnecting" banner, until
// the server's own snapshot replaces it. Kept per shoot and per who this screen is; written at most
// once a second.
import type { ShootSnapshot } from '~~/shared/types/socket-events'

const PREFIX = 'hobline.lastShoot.'
const WRITE_EVERY_MS = 1000

export interface StoredSnapshot {
  snapshot: ShootSnapshot
  /** Local Date.now() when this screen last heard from the server. */
  heardAt: number
}

export function readLastSnapshot(shootId: number, actorId: string | undefined): StoredSnapshot | null {
  try {
    const raw = localStorage.getItem(PREFIX + shootId)
    const stored = raw ? (JSON.parse(raw) as StoredSnapshot) : null
    if (!stored?.snapshot?.state || stored.snapshot.shoot?.id !== shootId) return null
    if (actorId !== undefined && stored.snapshot.you?.actorId !== actorId) return null
    return stored
  } catch {
    return null
  }
}

let timer: ReturnType<typeof setTimeout> | undefined
let latest: StoredSnapshot | null = null

/** Keeps the snapshot (the write waits up to a second, so a busy shoot writes once a second). */
export function keepLastSnapshot(snapshot: ShootSnapshot, heardAt: number) {
  latest = { snapshot, heardAt }
  if (timer) return
  timer = setTimeout(() => {
    timer = undefined
    if (!latest) return
    try {
      localStorage.setItem(PREFIX + latest.snapshot.shoot.id, JSON.stringify(latest))
    } catch {
      // Storage full or refused (private mode): the screen still works, it only forgets on reload.
    }
  }, WRITE_EVERY_MS)
}

/** Forgets every kept shoot state on this device (on signing out). */
export function forgetLastSnapshots() {
  latest = null
  try {
    for (const key of Object.keys(localStorage)) if (key.startsWith(PREFIX)) localStorage.removeItem(key)
  } catch {
    // Storage refused: nothing was kept.
  }
}
