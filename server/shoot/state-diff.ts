// The JSON Patch (RFC 6902) from one shoot state to the next. The reducer shares every part of the
// state a command did not touch (the next state reuses the objects of the one before), so a part
// that is the same object is the same JSON and is not walked: a command costs what it changed, not
// the size of the shoot (markers and visits pile up over a day). fast-json-patch's compare walks
// both trees whole, every time; tests/unit/state-diff.test.ts checks this one against it.
// Writes only add, remove and replace, as shoot-wire.ts applies them on the screens.
import type { ShootPatchOperation } from '../../shared/utils/shoot-wire'

/** A JSON Pointer reference token (RFC 6901 §3: "~" as "~0", "/" as "~1"). */
const token = (key: string) => key.replace(/~/g, '~0').replace(/\//g, '~1')
const isNode = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object'
/** A member of the object itself ("valueOf" of {} is not one). */
const own = (node: Record<string, unknown>, key: string) => (Object.prototype.hasOwnProperty.call(node, key) ? node[key] : undefined)

export function diffStates(before: unknown, after: unknown, path = '', ops: ShootPatchOperation[] = []): ShootPatchOperation[] {
  if (before === after) return ops
  if (!isNode(before) || !isNode(after) || Array.isArray(before) !== Array.isArray(after)) {
    // Numbers, strings and the like differ by value; JSON has no -0 (it is written 0).
    if (!isNode(before) && !isNode(after) && Object.is(before === 0 ? 0 : before, after === 0 ? 0 : after)) return ops
    ops.push({ op: 'replace', path, value: after })
    return ops
  }
  if (Array.isArray(before) && Array.isArray(after)) {
    const shared = Math.min(before.length, after.length)
    for (let i = 0; i < shared; i++) diffStates(before[i], after[i], `${path}/${i}`, ops)
    for (let i = shared; i < after.length; i++) ops.push({ op: 'add', path: `${path}/${i}`, value: after[i] })
    // From the end, so each index still names the element it meant.
    for (let i = before.length - 1; i >= after.length; i--) ops.push({ op: 'remove', path: `${path}/${i}` })
    return ops
  }
  // A key whose value is undefined is not in the JSON at all.
  for (const key of Object.keys(before)) {
    if (before[key] === undefined) continue
    if (own(after, key) === undefined) ops.push({ op: 'remove', path: `${path}/${token(key)}` })
    else diffStates(before[key], after[key], `${path}/${token(key)}`, ops)
  }
  for (const key of Object.keys(after)) {
    if (after[key] !== undefined && own(before, key) === undefined) ops.push({ op: 'add', path: `${path}/${token(key)}`, value: after[key] })
  }
  return ops
}
