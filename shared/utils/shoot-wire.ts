// A shoot:event message carries the change, not the whole state: a JSON Patch (RFC 6902) from the
// state at `baseSeq` to the state at `seq`, made on the server by fast-json-patch's compare (which
// writes only add, remove and replace). A screen applies it here when it holds exactly the state at
// `baseSeq`, and otherwise asks for a snapshot. The apply is this small one rather than the
// package's so the prompter stays within its bundle (DEVELOPERS.md, "The prompter's bundle");
// tests/unit/shoot-wire.test.ts checks it against fast-json-patch's applyPatch.
import type { ShootState } from '../types/shoot'
import type { ShootEventMessage } from '../types/socket-events'

/** One operation of RFC 6902 §4.1–4.3 (add, remove, replace); `path` is a JSON Pointer (RFC 6901). */
export type ShootPatchOperation =
  | { op: 'add' | 'replace'; path: string; value: unknown }
  | { op: 'remove'; path: string }

type Node = Record<string, unknown> | unknown[]

const isIndex = (token: string) => /^(0|[1-9]\d*)$/.test(token)

/** The value at `keys` under `node` with `op` done there, copying only the objects on the way (the old state is left as it was). */
function change(node: unknown, keys: string[], op: ShootPatchOperation): unknown {
  if (!node || typeof node !== 'object') throw new Error('no such path')
  const [key, ...rest] = keys as [string, ...string[]]
  const copy: Node = Array.isArray(node) ? node.slice() : { ...(node as Record<string, unknown>) }
  if (Array.isArray(copy)) {
    const at = key === '-' && op.op === 'add' && !rest.length ? copy.length : isIndex(key) ? Number(key) : -1
    const limit = op.op === 'add' && !rest.length ? copy.length : copy.length - 1
    if (at < 0 || at > limit) throw new Error('no such index')
    if (rest.length) copy[at] = change(copy[at], rest, op)
    else if (op.op === 'add') copy.splice(at, 0, op.value)
    else if (op.op === 'remove') copy.splice(at, 1)
    else copy[at] = op.value
    return copy
  }
  if (key === '__proto__') throw new Error('not a member of the state')
  const has = Object.prototype.hasOwnProperty.call(copy, key)
  if (!has && (rest.length || op.op !== 'add')) throw new Error('no such member')
  if (rest.length) copy[key] = change(copy[key], rest, op)
  else if (op.op !== 'remove') copy[key] = op.value
  else return Object.fromEntries(Object.entries(copy).filter(([k]) => k !== key))
  return copy
}

/** `state` with `patch` applied, a new object sharing what did not change; throws on an operation it cannot apply. */
export function applyShootPatch<T>(state: T, patch: readonly ShootPatchOperation[]): T {
  let next: unknown = state
  for (const op of patch) {
    if (op.op !== 'add' && op.op !== 'remove' && op.op !== 'replace') throw new Error('unknown operation')
    if (op.path === '') {
      if (op.op === 'remove') throw new Error('cannot remove the whole state')
      next = op.value
      continue
    }
    if (!op.path.startsWith('/')) throw new Error('not a JSON Pointer')
    next = change(next, op.path.slice(1).split('/').map((t) => t.replace(/~1/g, '/').replace(/~0/g, '~')), op)
  }
  return next as T
}

/** The state after `message` for a screen holding `held`, or null when it must ask for a snapshot (a gap, or a patch that does not apply). */
export function applyShootMessage(held: ShootState | null, message: Pick<ShootEventMessage, 'baseSeq' | 'seq' | 'patch'>): ShootState | null {
  if (!held || held.seq !== message.baseSeq) return null
  try {
    const next = applyShootPatch(held, message.patch)
    return next.seq === message.seq ? next : null
  } catch {
    return null
  }
}
