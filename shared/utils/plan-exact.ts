// The shortest cook plan by exhaustive search, for plans small enough (≤ 9 steps) to try every order.
// Method: every activity list (an order of the steps that respects their links) is decoded by the serial
// schedule-generation scheme, each step at the earliest moment its links and the kitchen allow, and
// the shortest result is kept. Every active schedule is such a decoding, and for the makespan an
// optimal schedule is always among the active ones (Kolisch, "Serial and parallel resource-constrained
// project scheduling methods revisited", EJOR 1996, section 2; Sprecher, Kolisch & Drexl, EJOR 1995,
// from memory), so the best decoding is the true optimum. Branches already as long as the best found
// are cut. The decoder here is written apart from plan-sgs.ts, so the two check each other.
// Finish-start and start-start links only; kitchens that cook one recipe at a time are not covered.
import { planBuildNetwork } from './plan-network'
import { PlanError, type PlanInput, type PlanStation } from './plan-types'

export interface PlanOptimum {
  makespan: number
  /** Start of each step, seconds. */
  starts: Record<string, number>
  /** Complete activity lists decoded (after cutting). */
  lists: number
}

const RESOURCE: Record<PlanStation, number> = { burner: 1, oven: 2, counter: 3 }

export function planCookExhaustive(input: PlanInput, maxSteps = 9): PlanOptimum {
  planBuildNetwork(input) // the same checks and refusals as planCook
  const steps = input.steps
  const n = steps.length
  if (n > maxSteps) throw new PlanError('bad-input', `Exhaustive search takes at most ${maxSteps} steps (got ${n}).`)
  const k = input.kitchen ?? {}
  if (k.parallelRecipes === false) throw new PlanError('bad-input', 'Exhaustive search covers kitchens that may cook two recipes at once.')
  const cap = [k.hands ?? 1, k.burners ?? 4, (k.ovens ?? 1) * (k.racksPerOven ?? 1), k.counters ?? Infinity]
  const index = new Map(steps.map((s, i) => [s.id, i]))
  const d = steps.map((s) => s.duration)
  const uses = steps.map((s) => [s.handsOn ? 0 : -1, s.station ? RESOURCE[s.station] : -1].filter((r) => r >= 0))
  // preds[j]: [i, w] meaning start(j) ≥ start(i) + w.
  const preds: [number, number][][] = steps.map((s) => [
    ...(s.after ?? []).map((id): [number, number] => [index.get(id)!, d[index.get(id)!]!]),
    ...(s.links ?? []).map((l): [number, number] => {
      const i = index.get(l.from)!
      if (l.kind === 'finish-together') throw new PlanError('bad-input', 'Exhaustive search covers finish-start and start-start links only.', [s.id])
      return [i, (l.kind === 'start-start' ? 0 : d[i]!) + (l.lag ?? 0)]
    }),
  ])

  // Lower bound to stop early: the longest chain of links, and the work per resource ÷ its capacity.
  const chain = new Array<number>(n).fill(-1)
  const longest = (j: number): number => (chain[j]! >= 0 ? chain[j]! : (chain[j] = Math.max(0, ...preds[j]!.map(([i, w]) => longest(i) + w))))
  let lower = 0
  for (let j = 0; j < n; j++) lower = Math.max(lower, longest(j) + d[j]!)
  for (let r = 0; r < 4; r++) lower = Math.max(lower, uses.reduce((sum, u, j) => sum + (u.includes(r) ? d[j]! : 0), 0) / cap[r]!)

  const start = new Array<number>(n).fill(NaN)
  const placed: number[] = []
  let best = Infinity
  let bestStarts: number[] = []
  let lists = 0

  // Is there a free unit of every resource j needs throughout [t, t + d(j))? Usage only rises at a start.
  const fits = (j: number, t: number) => {
    const end = t + d[j]!
    if (end === t) return true
    for (const r of uses[j]!) {
      const holders = placed.filter((i) => uses[i]!.includes(r) && d[i]! > 0 && start[i]! < end && start[i]! + d[i]! > t)
      for (const p of [t, ...holders.map((i) => start[i]!).filter((s) => s > t)]) {
        if (holders.filter((i) => start[i]! <= p && p < start[i]! + d[i]!).length >= cap[r]!) return false
      }
    }
    return true
  }

  const search = (length: number) => {
    if (best <= lower) return
    if (placed.length === n) {
      lists++
      if (length < best) {
        best = length
        bestStarts = [...start]
      }
      return
    }
    for (let j = 0; j < n; j++) {
      if (!Number.isNaN(start[j]!) || preds[j]!.some(([i]) => Number.isNaN(start[i]!))) continue
      const es = Math.max(0, ...preds[j]!.map(([i, w]) => start[i]! + w))
      const candidates = [es, ...placed.map((i) => start[i]! + d[i]!).filter((e) => e > es)].sort((a, b) => a - b)
      const t = candidates.find((c) => fits(j, c))!
      const next = Math.max(length, t + d[j]!)
      if (next >= best) continue
      start[j] = t
      placed.push(j)
      search(next)
      placed.pop()
      start[j] = NaN
    }
  }
  search(0)
  return { makespan: best, starts: Object.fromEntries(steps.map((s, i) => [s.id, bestStarts[i]!])), lists }
}
