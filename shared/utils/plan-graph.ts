// Graph work for the cook plan's network (plan-network.ts): adjacency lists, a topological order of the
// links, the refusal of a circle of links, the order of recipes in a kitchen that cooks one at a time,
// the strongly connected components (groups of tied steps), and the network turned round in time.
import type { PlanNet } from './plan-network'
import { PlanError } from './plan-types'

/**
 * "start(to) ≥ start(from) + w", ms; `plain` for an edge from a link, false for the back edge of a finish-together link;
 * `finish` when w counts the duration of `from` (it waits for the end of `from`), so a re-plan can put in the real duration.
 */
export interface PlanEdge { from: number; to: number; w: number; plain: boolean; finish?: boolean }

/** Adjacency in compressed rows: offsets per node, then edge indices grouped by `key` node. */
export function planCsr(n: number, key: Int32Array): [Int32Array, Int32Array] {
  const off = new Int32Array(n + 1)
  for (const k of key) off[k + 1]!++
  for (let i = 0; i < n; i++) off[i + 1]! += off[i]!
  const fill = off.slice(0, n)
  const list = new Int32Array(key.length)
  key.forEach((k, e) => (list[fill[k]!++] = e))
  return [off, list]
}

/** Rank of each node in a topological order of the plain edges (ties by index); null when they hold a cycle. */
export function planTopoRanks(n: number, from: Int32Array, to: Int32Array, plain: Uint8Array): Int32Array | null {
  const indeg = new Int32Array(n)
  const out: number[][] = Array.from({ length: n }, () => [])
  for (let e = 0; e < from.length; e++) {
    if (!plain[e]) continue
    indeg[to[e]!]!++
    out[from[e]!]!.push(to[e]!)
  }
  // A binary heap keeps ties in input order, so the order is the same for the same input.
  const heap: number[] = []
  const push = (x: number) => {
    heap.push(x)
    for (let i = heap.length - 1; i > 0; ) {
      const p = (i - 1) >> 1
      if (heap[p]! <= x) break
      ;[heap[p], heap[i]] = [x, heap[p]!]
      i = p
    }
  }
  const pop = () => {
    const top = heap[0]!
    const last = heap.pop()!
    if (heap.length) {
      heap[0] = last
      for (let i = 0; ; ) {
        const l = 2 * i + 1
        const r = l + 1
        let m = i
        if (l < heap.length && heap[l]! < heap[m]!) m = l
        if (r < heap.length && heap[r]! < heap[m]!) m = r
        if (m === i) break
        ;[heap[m], heap[i]] = [heap[i]!, heap[m]!]
        i = m
      }
    }
    return top
  }
  for (let i = 0; i < n; i++) if (!indeg[i]) push(i)
  const rank = new Int32Array(n).fill(-1)
  let next = 0
  while (heap.length) {
    const u = pop()
    rank[u] = next++
    for (const v of out[u]!) if (!--indeg[v]!) push(v)
  }
  return next === n ? rank : null
}

/** Throws a 'cycle' PlanError naming the steps of one circle of links, if there is one. */
export function planCheckAcyclic(n: number, edges: PlanEdge[], labels: string[], ids: string[], stepCount: number) {
  // Kahn's algorithm: whatever it cannot take in order lies on a circle or behind one.
  const indeg = new Int32Array(n)
  const out: number[][] = Array.from({ length: n }, () => [])
  const preds: number[][] = Array.from({ length: n }, () => [])
  for (const e of edges) {
    if (!e.plain) continue
    indeg[e.to]!++
    out[e.from]!.push(e.to)
    preds[e.to]!.push(e.from)
  }
  const queue: number[] = []
  for (let i = 0; i < n; i++) if (!indeg[i]) queue.push(i)
  for (let q = 0; q < queue.length; q++) for (const v of out[queue[q]!]!) if (!--indeg[v]!) queue.push(v)
  if (queue.length === n) return
  const left = new Uint8Array(n).fill(1)
  for (const u of queue) left[u] = 0
  // Every node left waits for another node left: walk back until one repeats.
  const seen = new Map<number, number>()
  const walk: number[] = []
  let u = left.indexOf(1)
  while (!seen.has(u)) {
    seen.set(u, walk.length)
    walk.push(u)
    u = preds[u]!.find((p) => left[p] === 1)!
  }
  const cycle = walk.slice(seen.get(u)).reverse()
  const steps = cycle.filter((v) => v < stepCount)
  const names = steps.map((v) => `“${labels[v]}”`)
  const circle = [...names, names[0]].join(' → ')
  throw new PlanError(
    'cycle',
    cycle.some((v) => v >= stepCount)
      ? `These steps wait for one another across recipes (${circle}), so the recipes cannot cook one after the other; let two recipes cook at once, or remove a link.`
      : `These steps wait for one another in a circle: ${circle}. Remove one of the links.`,
    steps.map((v) => ids[v]!),
  )
}

/** Recipes in an order their cross links allow, ties by first appearance. */
export function planRecipeOrder(recipes: (string | null)[], edges: PlanEdge[]): string[] {
  const names = [...new Set(recipes.filter((r): r is string => r !== null))]
  const pos = new Map(names.map((r, i) => [r, i]))
  const indeg = new Array<number>(names.length).fill(0)
  const out: Set<number>[] = names.map(() => new Set())
  for (const e of edges) {
    const a = recipes[e.from]
    const b = recipes[e.to]
    if (e.plain && a != null && b != null && a !== b && !out[pos.get(a)!]!.has(pos.get(b)!)) {
      out[pos.get(a)!]!.add(pos.get(b)!)
      indeg[pos.get(b)!]!++
    }
  }
  const order: string[] = []
  const done = new Uint8Array(names.length)
  for (let k = 0; k < names.length; k++) {
    // The first recipe (by appearance) that nothing left waits for; if none, keep appearance order and let the cycle check name the steps.
    let pick = indeg.findIndex((d, i) => d === 0 && !done[i])
    if (pick < 0) pick = done.indexOf(0)
    done[pick] = 1
    order.push(names[pick]!)
    for (const v of out[pick]!) indeg[v]!--
  }
  return order
}

/** Tarjan's strongly connected components (iterative), numbered in topological order, members by link order. */
export function planStronglyConnected(net: PlanNet, rank: Int32Array) {
  const { n, outOff, outEdges, eTo } = net
  const idx = new Int32Array(n).fill(-1)
  const low = new Int32Array(n)
  const onStack = new Uint8Array(n)
  const stack: number[] = []
  const found: number[][] = []
  let counter = 0
  const callStack: [number, number][] = []
  for (let root = 0; root < n; root++) {
    if (idx[root] !== -1) continue
    callStack.push([root, outOff[root]!])
    idx[root] = low[root] = counter++
    stack.push(root)
    onStack[root] = 1
    while (callStack.length) {
      const frame = callStack[callStack.length - 1]!
      const u = frame[0]
      if (frame[1] < outOff[u + 1]!) {
        const v = eTo[outEdges[frame[1]++]!]!
        if (idx[v] === -1) {
          idx[v] = low[v] = counter++
          stack.push(v)
          onStack[v] = 1
          callStack.push([v, outOff[v]!])
        } else if (onStack[v]) low[u] = Math.min(low[u]!, idx[v]!)
        continue
      }
      callStack.pop()
      if (callStack.length) {
        const parent = callStack[callStack.length - 1]![0]
        low[parent] = Math.min(low[parent]!, low[u]!)
      }
      if (low[u] === idx[u]) {
        const members: number[] = []
        let v: number
        do {
          v = stack.pop()!
          onStack[v] = 0
          members.push(v)
        } while (v !== u)
        found.push(members)
      }
    }
  }
  // Tarjan finds components in reverse topological order.
  found.reverse()
  net.comps = found.map((members, c) => {
    for (const v of members) net.comp[v] = c
    return Int32Array.from(members.sort((a, b) => rank[a]! - rank[b]!))
  })
}

/** The same network run backwards in time: start' = T − finish. Edges turn round; groups stay (eFinish is not turned: only re-plans read it). */
export function planMirror(net: PlanNet): PlanNet {
  const { eFrom, eTo, eW, dur, comps } = net
  const last = comps.length - 1
  return {
    ...net,
    eFrom: eTo,
    eTo: eFrom,
    eW: eW.map((w, e) => w + dur[eTo[e]!]! - dur[eFrom[e]!]!),
    outOff: net.inOff,
    outEdges: net.inEdges,
    inOff: net.outOff,
    inEdges: net.outEdges,
    comp: net.comp.map((c) => last - c),
    comps: comps.map((_, c) => comps[last - c]!.slice().reverse()),
  }
}
