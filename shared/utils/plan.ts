// The cook plan: from an episode's steps and the kitchen, when each step starts so that unattended
// waits overlap, nothing needs more hands or stations than the kitchen has, and the cook is short.
// 1. Critical path method, ignoring capacity (plan-cpm.ts): earliest/latest starts, slack, the chain.
// 2. Serial schedule-generation scheme (plan-sgs.ts) under several priority rules from Kolisch,
//    "Serial and parallel resource-constrained project scheduling methods revisited" (EJOR 1996):
//    latest start, latest finish, minimum slack, most total successors, greatest rank positional
//    weight; plus "unattended first", a kitchen rule; then, for small and middling plans, seeded
//    samples (latest start blended with random keys, and the best plan so far shaken). Each plan is
//    then justified: decoded backwards in time by finish order and forwards again by start order
//    (forward–backward improvement; Valls, Ballestín & Quintanilla, "Justification and RCPSP: a
//    technique that pays", EJOR 2005, from memory). The shortest plan wins, ties keep the earlier
//    rule, and the search stops early at the lower bound: the same input always gives the same plan.
// 3. Lanes, cues for the prompter, and lower bounds beside the result.
import { planCriticalChain, planCriticalTimes, type PlanTimes } from './plan-cpm'
import { PLAN_HANDS, planBuildNetwork, type PlanNet } from './plan-network'
import { planMirror } from './plan-graph'
import { planPriorityRules, planSampledRules } from './plan-rules'
import { planCheckTies, planSerialScheme } from './plan-sgs'
import type { PlanBounds, PlanCue, PlanInput, PlannedStep, PlanResult } from './plan-types'

const lengthOf = (net: PlanNet, S: Float64Array) => {
  let t = 0
  for (let v = 0; v < net.n; v++) t = Math.max(t, S[v]! + net.dur[v]!)
  return t
}

/** Work held on each resource (hands, burners, oven places, counters), ms. */
function workOf(net: PlanNet): number[] {
  const work = [0, 0, 0, 0]
  for (let v = 0; v < net.stepCount; v++) {
    if (net.hands[v]) work[PLAN_HANDS]! += net.dur[v]!
    if (net.station[v]) work[net.station[v]!]! += net.dur[v]!
  }
  return work
}

/** No plan can be shorter than this (ms): the critical path, and each resource's work ÷ its capacity. */
function lowerBoundMs(net: PlanNet, times: PlanTimes): number {
  return Math.max(times.length, ...workOf(net).map((w, r) => (w && Number.isFinite(net.cap[r]) ? Math.ceil(w / net.cap[r]!) : 0)))
}

/** The best plan over every rule, each with its forward–backward justification; stops early at the lower bound. */
function bestSchedule(net: PlanNet, times: PlanTimes): { S: Float64Array; rule: string } {
  const forwardScheme = planSerialScheme(net)
  const backwardScheme = planSerialScheme(planMirror(net))
  const lower = lowerBoundMs(net, times)
  const { n, dur } = net
  let best: Float64Array | null = null
  let bestLength = Infinity
  let bestRule = ''
  const consider = (S: Float64Array | null, rule: string) => {
    if (!S) return
    const length = lengthOf(net, S)
    if (length < bestLength) {
      best = S
      bestLength = length
      bestRule = rule
    }
  }
  const finish = new Float64Array(n)
  const start = new Float64Array(n)
  const rules = [...planPriorityRules(net, times), ...planSampledRules(net, times, () => best!)]
  for (const rule of rules) {
    if (bestLength <= lower) break
    const prio = rule.prio()
    const forward = forwardScheme(prio, rule.tie)
    consider(forward, rule.name)
    if (!forward || bestLength <= lower) continue
    // Backwards in time: the step that finishes last goes first.
    for (let v = 0; v < n; v++) {
      finish[v] = -(forward[v]! + dur[v]!)
      start[v] = -forward[v]!
    }
    const back = backwardScheme(finish, start)
    if (!back) continue
    const length = lengthOf(net, back)
    for (let v = 0; v < n; v++) back[v] = length - back[v]! - dur[v]!
    // Forwards again by start order; on a tie the plan that starts everything early is kept.
    const again = forwardScheme(back, prio)
    if (again && lengthOf(net, again) <= length) consider(again, `${rule.name}, justified`)
    else consider(back, `${rule.name}, right-justified`)
  }
  if (!best) throw new Error('The cook plan found no schedule; this is a fault in the planner.')
  return { S: best, rule: bestRule }
}

/**
 * Lane of every step: the lowest free lane of its kind at its start (interval colouring by start time).
 * `tolerant` (a re-plan, whose past may have held more than the kitchen has): when every lane of a kind
 * is taken, the one that frees first is shared instead of refusing.
 */
export function planAssignLanes(net: PlanNet, S: Float64Array, tolerant = false) {
  const count = net.stepCount
  const order = Array.from({ length: count }, (_, v) => v).sort((a, b) => S[a]! - S[b]! || a - b)
  const free = new Map<string, number[]>()
  const fixed: Record<string, number> = { hands: net.cap[0]!, burner: net.cap[1]!, oven: net.cap[2]!, counter: net.cap[3]! }
  const take = (kind: string, start: number, end: number): number => {
    let slots = free.get(kind)
    if (!slots) free.set(kind, (slots = Number.isFinite(fixed[kind]) ? new Array(fixed[kind]).fill(-Infinity) : []))
    if (end === start && slots.length) return 0
    let k = slots.findIndex((f) => f <= start)
    if (k < 0 && tolerant && Number.isFinite(fixed[kind]) && slots.length) k = slots.indexOf(Math.min(...slots))
    if (k < 0) {
      if (Number.isFinite(fixed[kind])) throw new Error(`The cook plan overfilled the ${kind} lanes; this is a fault in the planner.`)
      k = slots.push(-Infinity) - 1
    }
    slots[k] = Math.max(slots[k]!, end)
    return k
  }
  const lane: string[] = new Array(count)
  const handsLane: (string | null)[] = new Array(count).fill(null)
  const rack: (number | null)[] = new Array(count).fill(null)
  for (const v of order) {
    const start = S[v]!
    const end = start + net.dur[v]!
    if (net.hands[v]) handsLane[v] = `hands-${take('hands', start, end) + 1}`
    const station = net.station[v]!
    if (station === 2) {
      // Ovens fill one rack each before any takes a second dish.
      const slot = take('oven', start, end)
      lane[v] = `oven-${(slot % net.ovens) + 1}`
      rack[v] = Math.floor(slot / net.ovens) + 1
    } else if (station) lane[v] = `${station === 1 ? 'burner' : 'counter'}-${take(station === 1 ? 'burner' : 'counter', start, end) + 1}`
    else lane[v] = handsLane[v] ?? `aside-${take('aside', start, end) + 1}`
  }
  const names = (kind: string, k: number) => Array.from({ length: k }, (_, i) => `${kind}-${i + 1}`)
  const lanes = [
    ...names('hands', net.cap[0]!),
    ...names('burner', net.cap[1]!),
    ...names('oven', net.cap[2]! ? net.ovens : 0),
    ...names('counter', Number.isFinite(net.cap[3]) ? net.cap[3]! : (free.get('counter')?.length ?? 0)),
    ...names('aside', free.get('aside')?.length ?? 0),
  ]
  return { lane, handsLane, rack, lanes }
}

/** For each unattended step: when to start it and the hands-on step under way at that moment. */
export function planLeadCues(net: PlanNet, S: Float64Array, handsLane: (string | null)[]): PlanCue[] {
  const byLane = new Map<string, number[]>()
  for (let v = 0; v < net.stepCount; v++) {
    if (!net.hands[v] || net.dur[v] === 0) continue
    const list = byLane.get(handsLane[v]!) ?? []
    list.push(v)
    byLane.set(handsLane[v]!, list)
  }
  for (const list of byLane.values()) list.sort((a, b) => S[a]! - S[b]!)
  const laneNames = [...byLane.keys()].sort((a, b) => Number(a.slice(6)) - Number(b.slice(6)))
  const cues: PlanCue[] = []
  for (let u = 0; u < net.stepCount; u++) {
    if (net.hands[u]) continue
    const at = S[u]!
    let during = -1
    for (const name of laneNames) {
      // Steps in one hands lane never overlap: the last to start by `at` is the only candidate.
      const list = byLane.get(name)!
      let lo = 0
      let hi = list.length - 1
      while (lo < hi) {
        const mid = (lo + hi + 1) >> 1
        if (S[list[mid]!]! <= at) lo = mid
        else hi = mid - 1
      }
      const h = list[lo]!
      if (S[h]! <= at && at < S[h]! + net.dur[h]!) {
        const sameRecipe = net.recipes[h] !== null && net.recipes[h] === net.recipes[u]
        if (during < 0 || (sameRecipe && net.recipes[during] !== net.recipes[u])) during = h
      }
    }
    const label = net.labels[u]
    cues.push({
      stepId: net.ids[u]!,
      at: at / 1000,
      endsAt: (at + net.dur[u]!) / 1000,
      during: during < 0 ? null : net.ids[during]!,
      text: during < 0 ? `Start “${label}” now; hands are free.` : `While “${net.labels[during]}”: start “${label}”.`,
    })
  }
  return cues.sort((a, b) => a.at - b.at)
}

function lowerBounds(net: PlanNet, times: PlanTimes, makespan: number): PlanBounds {
  const work = workOf(net)
  const share = (r: number) => (work[r]! && Number.isFinite(net.cap[r]) ? work[r]! / net.cap[r]! / 1000 : 0)
  const bounds = { criticalPath: times.length / 1000, handsOn: share(0), burners: share(1), ovens: share(2), counters: share(3) }
  const lower = Math.max(...Object.values(bounds))
  return { ...bounds, lower, gap: lower > 0 ? (makespan - lower) / lower : 0 }
}

/** Plans the cook. Throws a PlanError (plan-types.ts) for input it cannot plan, naming the steps involved. */
export function planCook(input: PlanInput): PlanResult {
  const net = planBuildNetwork(input)
  const times = planCriticalTimes(net)
  planCheckTies(net)
  const { S, rule } = bestSchedule(net, times)
  const { lane, handsLane, rack, lanes } = planAssignLanes(net, S)
  const steps: PlannedStep[] = []
  let makespan = 0
  for (let v = 0; v < net.stepCount; v++) {
    const slack = times.ls[v]! - times.es[v]!
    makespan = Math.max(makespan, S[v]! + net.dur[v]!)
    steps.push({
      id: net.ids[v]!,
      start: S[v]! / 1000,
      end: (S[v]! + net.dur[v]!) / 1000,
      lane: lane[v]!,
      handsLane: handsLane[v]!,
      rack: rack[v]!,
      slack: slack / 1000,
      critical: slack === 0,
      earliestStart: times.es[v]! / 1000,
      latestStart: times.ls[v]! / 1000,
    })
  }
  return {
    makespan: makespan / 1000,
    steps,
    lanes,
    bounds: lowerBounds(net, times, makespan / 1000),
    criticalPath: planCriticalChain(net, times).map((v) => net.ids[v]!),
    cues: planLeadCues(net, S, handsLane),
    rule,
  }
}

/** The critical path method alone, ignoring capacity: length, per-step earliest/latest starts and slack, the chain. */
export function planCriticalPath(input: PlanInput) {
  const net = planBuildNetwork(input)
  const times = planCriticalTimes(net)
  return {
    length: times.length / 1000,
    steps: net.ids.slice(0, net.stepCount).map((id, v) => {
      const slack = times.ls[v]! - times.es[v]!
      return { id, earliestStart: times.es[v]! / 1000, latestStart: times.ls[v]! / 1000, slack: slack / 1000, critical: slack === 0 }
    }),
    criticalPath: planCriticalChain(net, times).map((v) => net.ids[v]!),
  }
}
