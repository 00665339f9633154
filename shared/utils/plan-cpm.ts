// Critical path method on the cook plan's network, ignoring capacity: earliest starts by a forward pass,
// latest starts by a backward pass against the shortest possible length, slack = latest − earliest
// (Hillier & Lieberman, Introduction to Operations Research, "Project management with PERT/CPM").
// Finish-together ties make small cycles of exact offsets; inside each such group the passes relax
// until stable (Bellman–Ford), and a group whose links add up to more than nothing around a circle
// cannot be met at all.
import { planDurationText, type PlanNet } from './plan-network'
import { PlanError } from './plan-types'

export interface PlanTimes {
  /** Earliest start of each node, ms. */
  es: Float64Array
  /** Latest start of each node that still allows the shortest length, ms. */
  ls: Float64Array
  /** Shortest length ignoring capacity, ms. */
  length: number
}

/** Edge indices with both ends in component c. */
export function planInnerEdges(net: PlanNet, c: number): number[] {
  const inner: number[] = []
  for (const v of net.comps[c]!) {
    for (let k = net.outOff[v]!; k < net.outOff[v + 1]!; k++) {
      const e = net.outEdges[k]!
      if (net.comp[net.eTo[e]!] === c) inner.push(e)
    }
  }
  return inner
}

/** `floor`, when given, is the earliest start of each node before any link (a re-plan: the present, or a fixed start). */
export function planCriticalTimes(net: PlanNet, floor?: ArrayLike<number>): PlanTimes {
  const { n, comps, comp, eFrom, eTo, eW, inOff, inEdges, outOff, outEdges, dur } = net
  const es = floor ? Float64Array.from(floor) : new Float64Array(n)
  const inner: number[][] = comps.map((_, c) => (comps[c]!.length > 1 ? planInnerEdges(net, c) : []))
  for (let c = 0; c < comps.length; c++) {
    for (const v of comps[c]!) {
      for (let k = inOff[v]!; k < inOff[v + 1]!; k++) {
        const e = inEdges[k]!
        if (comp[eFrom[e]!] !== c) es[v] = Math.max(es[v]!, es[eFrom[e]!]! + eW[e]!)
      }
    }
    if (comps[c]!.length > 1) relaxEarliest(net, c, inner[c]!, es)
  }
  let length = 0
  for (let v = 0; v < n; v++) length = Math.max(length, es[v]! + dur[v]!)
  const ls = new Float64Array(n)
  for (let v = 0; v < n; v++) ls[v] = length - dur[v]!
  for (let c = comps.length - 1; c >= 0; c--) {
    for (const v of comps[c]!) {
      for (let k = outOff[v]!; k < outOff[v + 1]!; k++) {
        const e = outEdges[k]!
        if (comp[eTo[e]!] !== c) ls[v] = Math.min(ls[v]!, ls[eTo[e]!]! - eW[e]!)
      }
    }
    // No circle gains time (checked on the way forward), so this settles within |group| rounds.
    for (let changed = comps[c]!.length > 1; changed; ) {
      changed = false
      for (const e of inner[c]!) {
        const bound = ls[eTo[e]!]! - eW[e]!
        if (bound < ls[eFrom[e]!]!) {
          ls[eFrom[e]!] = bound
          changed = true
        }
      }
    }
  }
  return { es, ls, length }
}

/** Bellman–Ford inside one group; throws when a circle of links asks a step to start after itself. */
function relaxEarliest(net: PlanNet, c: number, inner: number[], es: Float64Array) {
  const members = net.comps[c]!
  const pred = new Map<number, number>()
  let last = -1
  for (let round = 0; round < members.length; round++) {
    last = -1
    for (const e of inner) {
      const to = net.eTo[e]!
      const bound = es[net.eFrom[e]!]! + net.eW[e]!
      if (bound > es[to]!) {
        es[to] = bound
        pred.set(to, e)
        last = to
      }
    }
    if (last < 0) return
  }
  // Still improving after |group| rounds: walk back |group| edges to land on the circle, then go round it.
  let v = last
  for (let i = 0; i < members.length && v >= 0; i++) v = pred.has(v) ? net.eFrom[pred.get(v)!]! : -1
  let circle: number[] = []
  let gain = 0
  let closed = false
  for (let u = v, guard = 0; v >= 0 && guard <= members.length && !closed; guard++) {
    const e = pred.get(u)
    if (e === undefined) break
    circle.push(u)
    gain += net.eW[e]!
    u = net.eFrom[e]!
    closed = u === v
  }
  // Should the walk not close (in theory it always does), name the whole group.
  if (!closed || gain <= 0) {
    circle = [...members]
    gain = 0
  } else circle.reverse()
  const steps = circle.filter((u) => u < net.stepCount)
  const names = steps.map((u) => `“${net.labels[u]}”`).join(', ')
  const oneRecipe = circle.some((u) => u >= net.stepCount)
  throw new PlanError(
    'impossible-lag',
    `The links between ${names} cannot all be met` + (gain > 0 ? `: followed round, they ask “${net.labels[steps[0]!]}” to start ${planDurationText(gain)} after itself.` : '.') +
      (oneRecipe ? ' This kitchen cooks one recipe at a time, and a finish-together link joins two recipes; let two recipes cook at once, or change the link.' : ' Shorten a lag or a lead, or remove a link.'),
    steps.map((u) => net.ids[u]!),
  )
}

/** One chain of critical steps through tight links, from a step that starts the cook to one that ends it. */
export function planCriticalChain(net: PlanNet, times: PlanTimes): number[] {
  const { es, ls, length } = times
  const critical = (v: number) => ls[v] === es[v]
  let v = -1
  for (let u = 0; u < net.stepCount && v < 0; u++) if (critical(u) && es[u]! + net.dur[u]! === length) v = u
  if (v < 0) return []
  const chain: number[] = []
  const seen = new Set<number>()
  while (v >= 0 && !seen.has(v)) {
    seen.add(v)
    chain.push(v)
    let next = -1
    for (let k = net.inOff[v]!; k < net.inOff[v + 1]!; k++) {
      const e = net.inEdges[k]!
      const u = net.eFrom[e]!
      if (net.ePlain[e] && critical(u) && es[u]! + net.eW[e]! === es[v] && (next < 0 || u < next)) next = u
    }
    v = next
  }
  return chain.reverse().filter((u) => u < net.stepCount)
}
