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

/** Throws: the operation cannot apply (RFC 6902 §5: the whole patch fails). */
const refuse = (): never => {
  throw new Error('patch')
}

/** The value at `keys` under `node` with `op` done there, copying only the objects on the way (the old state is left as it was). */
function change(node: unknown, keys: string[], op: ShootPatchOperation): unknown {
  if (!node || typeof node !== 'object') refuse()
  const [key, ...rest] = keys as [string, ...string[]]
  const add = op.op === 'add' && !rest.length
  if (Array.isArray(node)) {
    const copy = node.slice()
    // An index (no leading zero), or "-" past the end (RFC 6901 §4, RFC 6902 §4.1), only where an add may insert.
    const at = key === '-' ? copy.length : /^(0|[1-9]\d*)$/.test(key) ? Number(key) : -1
    if (at < 0 || at > copy.length - (add ? 0 : 1)) refuse()
    if (rest.length) copy[at] = change(copy[at], rest, op)
    else copy.splice(at, add ? 0 : 1, ...(op.op === 'remove' ? [] : [op.value]))
    return copy
  }
  if (key === '__proto__' || (!add && !Object.prototype.hasOwnProperty.call(node, key))) refuse()
  const { [key]: old, ...others } = node as Record<string, unknown>
  if (op.op === 'remove' && !rest.length) return others
  return { ...(node as Record<string, unknown>), [key]: rest.length ? change(old, rest, op) : (op as { value: unknown }).value }
}

/** `state` with `patch` applied, a new object sharing what did not change; throws on an operation it cannot apply. */
export function applyShootPatch<T>(state: T, patch: readonly ShootPatchOperation[]): T {
  let next: unknown = state
  for (const op of patch) {
    if (!['add', 'remove', 'replace'].includes(op.op) || (op.path && op.path[0] !== '/') || (!op.path && op.op === 'remove')) refuse()
    next = op.path ? change(next, op.path.slice(1).split('/').map((t) => t.replace(/~1/g, '/').replace(/~0/g, '~')), op) : (op as { value: unknown }).value
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
