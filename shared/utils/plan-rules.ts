// Priority rules for the serial schedule-generation scheme (Kolisch, "Serial and parallel
// resource-constrained project scheduling methods revisited", EJOR 1996): latest start, latest finish,
// minimum slack, most total successors, greatest rank positional weight; "unattended first", a kitchen
// rule (get the waits going); and seeded samples. Lower priority goes first.
import type { PlanTimes } from './plan-cpm'
import type { PlanNet } from './plan-network'

export interface PlanRule {
  name: string
  /** Made when the rule's turn comes, so a sample can start from the best plan so far. */
  prio: () => ArrayLike<number>
  tie: ArrayLike<number>
}

/** Total successors of each node through links, counted with bit sets (skipped for very large plans). */
function successorCounts(net: PlanNet): Float64Array | null {
  const { n } = net
  const words = (n + 31) >> 5
  if (n * words > 4_000_000) return null
  const bits = new Uint32Array(n * words)
  const order = net.comps.flatMap((members) => [...members])
  const count = new Float64Array(n)
  for (let i = n - 1; i >= 0; i--) {
    const v = order[i]!
    const row = v * words
    for (let k = net.outOff[v]!; k < net.outOff[v + 1]!; k++) {
      const e = net.outEdges[k]!
      if (!net.ePlain[e]) continue
      const w = net.eTo[e]!
      const other = w * words
      for (let j = 0; j < words; j++) bits[row + j]! |= bits[other + j]!
      bits[row + (w >> 5)]! |= 1 << (w & 31)
    }
    let c = 0
    for (let j = 0; j < words; j++) {
      let x = bits[row + j]!
      x -= (x >>> 1) & 0x55555555
      x = (x & 0x33333333) + ((x >>> 2) & 0x33333333)
      c += (((x + (x >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24
    }
    count[v] = c
  }
  return count
}

/** A small seeded generator (mulberry32), so sampled priorities are the same on every run. */
export function planSeededRandom(seed: number) {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** How many seeded samples to add: many for a small plan, none for a large one. */
const sampleCount = (n: number) => Math.min(64, Math.floor(1000 / Math.max(n, 1)))

export function planPriorityRules(net: PlanNet, times: PlanTimes): PlanRule[] {
  const { n, dur } = net
  const { es, ls } = times
  const at = (f: (v: number) => number) => Float64Array.from({ length: n }, (_, v) => f(v))
  const rules: PlanRule[] = [
    { name: 'latest start', prio: () => ls, tie: es },
    { name: 'latest finish', prio: () => at((v) => ls[v]! + dur[v]!), tie: ls },
    { name: 'minimum slack', prio: () => at((v) => ls[v]! - es[v]!), tie: ls },
    { name: 'unattended first', prio: () => at((v) => net.hands[v]!), tie: ls },
  ]
  const succ = successorCounts(net)
  if (succ) rules.push({ name: 'most total successors', prio: () => at((v) => -succ[v]!), tie: ls })
  const weight = at((v) => {
    let w = dur[v]!
    for (let k = net.outOff[v]!; k < net.outOff[v + 1]!; k++) if (net.ePlain[net.outEdges[k]!]) w += dur[net.eTo[net.outEdges[k]!]!]!
    return w
  })
  rules.push({ name: 'rank positional weight', prio: () => at((v) => -weight[v]!), tie: ls })
  return rules
}

/**
 * Seeded samples, in turn: latest start blended with random keys (from a little noise to a random
 * order of the eligible steps), and the best plan so far, shaken.
 */
export function planSampledRules(net: PlanNet, times: PlanTimes, best: () => Float64Array): PlanRule[] {
  const { n } = net
  const random = planSeededRandom(0x5eed)
  const spread = Math.max(times.length, 1)
  return Array.from({ length: sampleCount(n) }, (_, s): PlanRule => {
    const fromBest = s % 2 === 1
    const mix = [0.05, 0.15, 0.4, 1][(s >> 1) % 4]!
    return {
      name: `${fromBest ? 'best so far' : 'latest start'}, sample ${s + 1}`,
      prio: () => {
        const base = fromBest ? best() : times.ls
        return Float64Array.from({ length: n }, (_, v) => (fromBest
          ? base[v]! + (random() - 0.5) * mix * 0.5 * spread
          : (1 - mix) * base[v]! + mix * random() * spread))
      },
      tie: times.ls,
    }
  })
}
