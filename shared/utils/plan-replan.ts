// The cook plan follows the kitchen: after every change on the shoot (a step done late or early, time
// added, a timer confirmed, a pause) the rest of the plan is computed again from the present.
// - What is done and what is running is fixed: done steps keep their real times and hold nothing after
//   they finished; running steps keep their start and their deadline and hold their hands and station
//   until it. Links into a done or running step are history and are dropped; links out of one count
//   from its real start or end.
// - Every other step is scheduled again, no earlier than now, by the same serial schedule-generation
//   scheme with the same capacities (plan-sgs.ts; Kolisch, "Serial and parallel resource-constrained
//   project scheduling methods revisited", EJOR 1996). The first order tried is the plan being followed
//   (its start times as priorities), so cues do not jump about: while the kitchen keeps to that plan,
//   the serial scheme decoding it in start order starts no step later than it did (each step's slot is
//   still free, the steps before it having only moved earlier; tied groups aside, for which this is not
//   proven). Then one pass of each of the planner's priority rules;
//   one of those replaces the followed order only when it finishes at least a minute earlier.
//   No sampling and no justification: a re-plan must take milliseconds.
// - A finish-together link whose first step is already done or running becomes a lower bound: the
//   second step goes in at the agreed moment if the kitchen allows, else as soon as it can. A kitchen
//   that cooks one recipe at a time keeps the recipe order of the first plan.
// Collisions (what the desk and the prompter announce before they happen): in this scheduler's terms a
// link is only a lower bound, so a step waiting after its links allow is normal (one cook does prep in
// some order). What is not normal is food left waiting: a pending hands-on step that falls due at the
// end of an unattended step (a timer: the pasta is cooked) through a link that counts from that end,
// and that starts PLAN_COLLISION_WAIT seconds or more after that moment because every cook's hands are
// held then (not for lack of a burner or an oven place). Two timers ending together for one cook give
// one such collision: the hands-on step after the second waits for the one after the first.
import { planAssignLanes, planLeadCues } from './plan'
import { planCriticalTimes, type PlanTimes } from './plan-cpm'
import { planCsr, planStronglyConnected, planTopoRanks } from './plan-graph'
import { PLAN_HANDS, planBuildNetwork, planDurationText, type PlanNet } from './plan-network'
import { planPriorityRules } from './plan-rules'
import { planCheckTies, planSerialScheme } from './plan-sgs'
import { PlanError, type PlanCollision, type PlanInput, type PlanProgress, type ReplannedStep, type ReplanResult } from './plan-types'

/** Shortest wait, seconds, that counts as a collision. */
export const PLAN_COLLISION_WAIT = 30
/** How much earlier (ms) a priority rule must finish to replace the order of the plan being followed. */
const STABLE_MARGIN = 60_000
const PENDING = 0
const DONE = 1
const RUNNING = 2

const toMs = (seconds: number) => Math.round(seconds * 1000)

/** "12:05", "1:02:05": a moment on the shoot clock, for messages. */
function clockText(ms: number): string {
  const s = Math.round(ms / 1000)
  const h = Math.floor(s / 3600)
  const m = Math.floor((s % 3600) / 60)
  const pad = (x: number) => String(x).padStart(2, '0')
  return h ? `${h}:${pad(m)}:${pad(s % 60)}` : `${m}:${pad(s % 60)}`
}

interface Fixed {
  now: number
  state: Uint8Array
  /** Start and end (ms) of each done or running node, NaN for the others. */
  start: Float64Array
  end: Float64Array
  overdue: string[]
}

/** Checks the progress against the plan's steps; throws a PlanError naming the step for anything it cannot use. */
function readProgress(net: PlanNet, progress: PlanProgress): Fixed {
  if (!progress || typeof progress !== 'object') throw new PlanError('bad-input', 'A re-plan needs the progress of the shoot: now, and the steps done and running.')
  const nowS = progress.now
  if (typeof nowS !== 'number' || !Number.isFinite(nowS) || nowS < 0) {
    throw new PlanError('bad-input', `Now must be zero or more seconds from the start of the cook (got ${String(nowS)}).`)
  }
  const now = toMs(nowS)
  const index = new Map(net.ids.slice(0, net.stepCount).map((id, v) => [id, v]))
  const fixed: Fixed = { now, state: new Uint8Array(net.n), start: new Float64Array(net.n).fill(NaN), end: new Float64Array(net.n).fill(NaN), overdue: [] }
  for (const [state, list, word] of [[DONE, progress.done, 'done'], [RUNNING, progress.running, 'under way']] as const) {
    if (list === undefined || list === null) continue
    if (typeof list !== 'object') throw new PlanError('bad-input', `The steps ${word} must be given by id, each with a start and an end.`)
    for (const [id, times] of Object.entries(list)) {
      const v = index.get(id)
      if (v === undefined) throw new PlanError('bad-input', `“${id}” is marked ${word}, but it is not a step of this plan.`, [id])
      const label = net.labels[v]!
      if (fixed.state[v]) throw new PlanError('bad-input', `“${label}” is marked both done and under way; it is one or the other.`, [id])
      const ok = (x: unknown) => typeof x === 'number' && Number.isFinite(x) && x >= 0
      if (!times || typeof times !== 'object' || !ok(times.start) || !ok(times.end)) {
        throw new PlanError('bad-input', `“${label}” is marked ${word} without a start and an end of zero or more seconds.`, [id])
      }
      const start = toMs(times.start)
      let end = toMs(times.end)
      if (end < start) throw new PlanError('bad-input', `“${label}” is marked ${word} from ${clockText(start)} to ${clockText(end)}; it cannot end before it starts.`, [id])
      if (start > now) throw new PlanError('bad-input', `“${label}” is marked ${word} from ${clockText(start)}, after now (${clockText(now)}).`, [id])
      if (state === DONE && end > now) throw new PlanError('bad-input', `“${label}” is marked done at ${clockText(end)}, after now (${clockText(now)}).`, [id])
      if (state === RUNNING && end < now) {
        end = now
        fixed.overdue.push(id)
      }
      fixed.state[v] = state
      fixed.start[v] = start
      fixed.end[v] = end
    }
  }
  return fixed
}

/**
 * The network of the re-plan: done and running steps take their real durations, links into them are
 * dropped (so each is a group of its own, placed first at its start), and links counted from their end
 * count from the real end.
 */
function replanNetwork(net: PlanNet, fixed: Fixed): PlanNet {
  const isFixed = (v: number) => fixed.state[v] !== PENDING
  const dur = net.dur.map((d, v) => (isFixed(v) ? fixed.end[v]! - fixed.start[v]! : d))
  const keep: number[] = []
  for (let e = 0; e < net.eTo.length; e++) if (!isFixed(net.eTo[e]!)) keep.push(e)
  const eFrom = Int32Array.from(keep, (e) => net.eFrom[e]!)
  const eTo = Int32Array.from(keep, (e) => net.eTo[e]!)
  const eW = Float64Array.from(keep, (e) => net.eW[e]! + (net.eFinish[e] ? dur[net.eFrom[e]!]! - net.dur[net.eFrom[e]!]! : 0))
  const ePlain = Uint8Array.from(keep, (e) => net.ePlain[e]!)
  const [outOff, outEdges] = planCsr(net.n, eFrom)
  const [inOff, inEdges] = planCsr(net.n, eTo)
  const out: PlanNet = {
    ...net, dur, eFrom, eTo, eW, ePlain, eFinish: Uint8Array.from(keep, (e) => net.eFinish[e]!),
    outOff, outEdges, inOff, inEdges, comp: new Int32Array(net.n), comps: [],
  }
  // Fewer links than the first plan's network, which had no circle of plain links.
  planStronglyConnected(out, planTopoRanks(net.n, eFrom, eTo, ePlain)!)
  return out
}

const lengthOf = (net: PlanNet, S: Float64Array) => {
  let t = 0
  for (let v = 0; v < net.n; v++) t = Math.max(t, S[v]! + net.dur[v]!)
  return t
}

/** The followed order first, then one pass of each rule; a rule wins only by STABLE_MARGIN (or when nothing is followed). */
function bestReplan(net: PlanNet, fixed: Fixed, times: PlanTimes, previous: PlanProgress['previous']): { S: Float64Array; rule: string } {
  const scheme = planSerialScheme(net, { start: fixed.start, release: fixed.now })
  let best: Float64Array | null = null
  let bestLength = Infinity
  let rule = ''
  if (previous && Array.isArray(previous.steps)) {
    const before = new Map(previous.steps.map((s) => [s.id, s.start]))
    // Milestones between recipes hold nothing: they go as soon as they may.
    const prio = Float64Array.from({ length: net.n }, (_, v) => {
      if (v >= net.stepCount) return -Infinity
      const was = before.get(net.ids[v]!)
      return was === undefined ? times.ls[v]! : toMs(was)
    })
    best = scheme(prio, times.ls)
    if (best) {
      bestLength = lengthOf(net, best)
      rule = 'the plan being followed'
    }
  }
  const margin = best ? STABLE_MARGIN : 0
  let challenger: Float64Array | null = null
  let challengerLength = Infinity
  let challengerRule = ''
  for (const r of planPriorityRules(net, times)) {
    const S = scheme(r.prio(), r.tie)
    if (!S) continue
    const length = lengthOf(net, S)
    if (length < challengerLength) {
      challenger = S
      challengerLength = length
      challengerRule = r.name
    }
  }
  if (challenger && challengerLength <= bestLength - margin) {
    best = challenger
    rule = challengerRule
  }
  if (!best) throw new Error('The re-plan found no schedule; this is a fault in the planner.')
  return { S: best, rule }
}

/** Hands-on steps that fall due at a timer's end and wait for the hands (see the head of this file). */
function findCollisions(net: PlanNet, fixed: Fixed, S: Float64Array): PlanCollision[] {
  const { stepCount, hands, dur, inOff, inEdges, eFrom, eW, eFinish, ePlain, labels, ids } = net
  const cap = net.cap[PLAN_HANDS]!
  const handsOn: number[] = []
  for (let v = 0; v < stepCount; v++) if (hands[v] && dur[v]! > 0) handsOn.push(v)
  const found: PlanCollision[] = []
  for (const v of handsOn) {
    if (fixed.state[v] !== PENDING) continue
    // The link that binds last; on a tie, one from a timer's end.
    let bound = -Infinity
    let by = -1
    let byEdge = -1
    for (let k = inOff[v]!; k < inOff[v + 1]!; k++) {
      const e = inEdges[k]!
      const u = eFrom[e]!
      const b = S[u]! + eW[e]!
      const timer = u < stepCount && !hands[u] && eFinish[e] === 1 && ePlain[e] === 1
      if (b > bound || (b === bound && timer)) {
        bound = b
        by = u
        byEdge = e
      }
    }
    if (by < 0 || by >= stepCount || hands[by] || !eFinish[byEdge] || !ePlain[byEdge]) continue
    const due = Math.max(fixed.now, bound)
    const wait = S[v]! - due
    if (wait < PLAN_COLLISION_WAIT * 1000) continue
    // Were the hands full at some moment of [due, due + duration)? Sweep the other hands-on steps there.
    const from = due
    const to = due + dur[v]!
    const events: [number, number][] = []
    // Who holds the hands: of the steps under way at `due`, the one that ends first; else the first to start after it.
    let held = -1
    let heldKey = Infinity
    for (const u of handsOn) {
      if (u === v) continue
      const s = S[u]!
      const f = s + dur[u]!
      if (s >= to || f <= from) continue
      events.push([Math.max(s, from), 1], [f, -1])
      const key = s <= due ? f - 1e12 : s
      if (key < heldKey) {
        held = u
        heldKey = key
      }
    }
    events.sort((a, b) => a[0] - b[0] || a[1] - b[1])
    let level = 0
    let full = false
    for (const [, q] of events) if ((level += q) >= cap) full = true
    if (!full || held < 0) continue
    const cooks = cap === 1 ? 'the cook is on' : 'every cook is busy, one on'
    const ends = bound < fixed.now ? 'has ended' : `ends at ${clockText(bound)}`
    found.push({
      stepId: ids[v]!,
      afterId: ids[by]!,
      heldBy: ids[held]!,
      due: due / 1000,
      start: S[v]! / 1000,
      wait: wait / 1000,
      text: `“${labels[v]}” waits ${planDurationText(wait)}: “${labels[by]}” ${ends} while ${cooks} “${labels[held]}”.`,
    })
  }
  return found.sort((a, b) => a.due - b.due || a.start - b.start)
}

/**
 * Re-plans the cook from the present: done and running steps as given, the rest from now, with the same
 * links and capacities as planCook. Throws a PlanError for input or progress it cannot use.
 */
export function replanCook(input: PlanInput, progress: PlanProgress): ReplanResult {
  const first = planBuildNetwork(input)
  // The same refusals as the first plan: circles of links that cannot be met, ties the kitchen cannot hold.
  planCriticalTimes(first)
  planCheckTies(first)
  const fixed = readProgress(first, progress)
  const net = replanNetwork(first, fixed)
  const floor = Float64Array.from({ length: net.n }, (_, v) => (fixed.state[v] === PENDING ? fixed.now : fixed.start[v]!))
  const times = planCriticalTimes(net, floor)
  const { S, rule } = bestReplan(net, fixed, times, progress.previous)
  const { lane, handsLane, rack, lanes } = planAssignLanes(net, S, true)
  const before = new Map((progress.previous?.steps ?? []).map((s) => [s.id, s.start]))
  const states = ['pending', 'done', 'running'] as const
  const steps: ReplannedStep[] = []
  let makespan = 0
  for (let v = 0; v < net.stepCount; v++) {
    const start = S[v]! / 1000
    const end = (S[v]! + net.dur[v]!) / 1000
    makespan = Math.max(makespan, end)
    const was = before.get(net.ids[v]!)
    const state = states[fixed.state[v]!]!
    steps.push({ id: net.ids[v]!, start, end, lane: lane[v]!, handsLane: handsLane[v]!, rack: rack[v]!, state, moved: was === undefined ? null : start - was })
  }
  const pending = new Set(steps.filter((s) => s.state === 'pending').map((s) => s.id))
  return {
    now: fixed.now / 1000,
    makespan,
    steps,
    lanes,
    cues: planLeadCues(net, S, handsLane).filter((c) => pending.has(c.stepId)),
    collisions: findCollisions(net, fixed, S),
    overdue: fixed.overdue,
    rule,
  }
}
