// The serial schedule-generation scheme (Kolisch, "Serial and parallel resource-constrained project
// scheduling methods revisited", EJOR 1996): take the eligible step with the best priority and start
// it at the earliest moment its links and every capacity allow, until all are placed.
// Steps tied by finish-together links form groups (strongly connected components of the network)
// that are placed together: each member within the time window its placed partners leave it; when a
// member's window has no room, the group is taken out and tried again later. Past the moment every
// earlier step has finished the kitchen is empty for the group, so a group that fits in an empty
// kitchen (checked once, planCheckTies) always fits there, and the search ends. (That holds for runs
// forwards in time; a run backwards that cannot place a group gives no plan and is passed over.)
import { PLAN_HANDS, type PlanNet } from './plan-network'
import { PlanProfile } from './plan-profile'
import { PlanError } from './plan-types'

const RETRIES = 16

/**
 * For a re-plan: nodes whose start is already fixed (done or under way: `start` in ms, NaN for the others)
 * and the present (`release`, ms), before which no other node may start. A fixed node must have no links
 * into it (they are history); it is placed first, at its start, whatever the kitchen holds then.
 */
export interface PlanPins {
  start: Float64Array
  release: number
}

/** One run of the serial scheme over a network; reusable for the tie check. */
class SerialRun {
  readonly S: Float64Array
  private readonly es: Float64Array
  private readonly ls: Float64Array
  private readonly low: Float64Array
  private readonly dist: Float64Array
  private readonly placed: Uint8Array
  private readonly inQueue: Uint8Array
  private readonly queue: Int32Array
  profiles: (PlanProfile | null)[] = []
  maxEnd = 0
  /** The member that found no room in the last failed attempt. */
  failed = -1

  /** Links into each group from outside it. */
  private readonly waiting: Int32Array
  private readonly keyP: Float64Array
  private readonly keyT: Float64Array
  private readonly keyI: Int32Array
  private readonly heap: Int32Array

  constructor(
    readonly net: PlanNet,
    private readonly pins: PlanPins | null = null,
  ) {
    const n = net.n
    const C = net.comps.length
    this.waiting = new Int32Array(C)
    for (let e = 0; e < net.eTo.length; e++) if (net.comp[net.eFrom[e]!] !== net.comp[net.eTo[e]!]) this.waiting[net.comp[net.eTo[e]!]!]!++
    this.keyP = new Float64Array(C)
    this.keyT = new Float64Array(C)
    this.keyI = new Int32Array(C)
    this.heap = new Int32Array(C)
    this.S = new Float64Array(n).fill(NaN)
    this.es = new Float64Array(n)
    this.ls = new Float64Array(n)
    this.low = new Float64Array(n)
    this.dist = new Float64Array(n)
    this.placed = new Uint8Array(n)
    this.inQueue = new Uint8Array(n)
    this.queue = new Int32Array(n + 1)
    this.emptyKitchen()
  }

  emptyKitchen() {
    this.profiles = this.net.cap.map((c) => (Number.isFinite(c) ? new PlanProfile(c) : null))
    this.maxEnd = 0
  }

  private resource(v: number, r: number): PlanProfile | null {
    if (r === PLAN_HANDS) return this.net.hands[v] ? this.profiles[PLAN_HANDS]! : null
    const s = this.net.station[v]!
    return s ? this.profiles[s]! : null
  }

  /** Earliest start ≥ x at which the step's hands and station are both free for its whole duration. */
  fit(v: number, x: number): number {
    const d = this.net.dur[v]!
    if (d === 0) return x
    const a = this.resource(v, PLAN_HANDS)
    const b = this.resource(v, 1)
    for (let y = x; ; ) {
      const ya = a ? a.fit(y, d) : y
      const yb = b ? b.fit(ya, d) : ya
      if (yb === ya) return ya
      y = yb
    }
  }

  place(v: number, t: number) {
    const d = this.net.dur[v]!
    this.S[v] = t
    this.placed[v] = 1
    if (d > 0) {
      this.resource(v, PLAN_HANDS)?.add(t, t + d, 1)
      this.resource(v, 1)?.add(t, t + d, 1)
    }
    this.maxEnd = Math.max(this.maxEnd, t + d)
  }

  unplace(v: number) {
    const d = this.net.dur[v]!
    const t = this.S[v]!
    if (d > 0) {
      this.resource(v, PLAN_HANDS)?.add(t, t + d, -1)
      this.resource(v, 1)?.add(t, t + d, -1)
    }
    this.S[v] = NaN
    this.placed[v] = 0
  }

  /** Earliest start of v from the steps outside its group (all placed). */
  private fromOutside(v: number): number {
    const { inOff, inEdges, eFrom, eW, comp } = this.net
    let es = this.pins ? this.pins.release : 0
    for (let k = inOff[v]!; k < inOff[v + 1]!; k++) {
      const e = inEdges[k]!
      if (comp[eFrom[e]!] !== comp[v]) es = Math.max(es, this.S[eFrom[e]!]! + eW[e]!)
    }
    return es
  }

  /** Longest-path relaxation inside v's group, forwards (earliest starts) or backwards (latest starts). */
  private relax(sources: ArrayLike<number>, forward: boolean, value: Float64Array, skipPlaced: boolean) {
    const { outOff, outEdges, inOff, inEdges, eFrom, eTo, eW, comp } = this.net
    const { queue, inQueue } = this
    const size = queue.length
    let head = 0
    let tail = 0
    for (let i = 0; i < sources.length; i++) {
      queue[tail++] = sources[i]!
      inQueue[sources[i]!] = 1
    }
    while (head !== tail) {
      const u = queue[head]!
      head = (head + 1) % size
      inQueue[u] = 0
      const off = forward ? outOff : inOff
      const list = forward ? outEdges : inEdges
      for (let k = off[u]!; k < off[u + 1]!; k++) {
        const e = list[k]!
        const v = forward ? eTo[e]! : eFrom[e]!
        if (comp[v] !== comp[u] || (skipPlaced && this.placed[v])) continue
        const bound = forward ? value[u]! + eW[e]! : value[u]! - eW[e]!
        if (forward ? bound > value[v]! : bound < value[v]!) {
          value[v] = bound
          if (!inQueue[v]) {
            queue[tail] = v
            tail = (tail + 1) % size
            inQueue[v] = 1
          }
        }
      }
    }
  }

  /** Longest path from the group's first member to each member, ignoring the kitchen. */
  private distances(members: Int32Array): Float64Array {
    for (const v of members) this.dist[v] = -Infinity
    this.dist[members[0]!] = 0
    this.relax([members[0]!], true, this.dist, false)
    return this.dist
  }

  /**
   * Places the group's members in link order, the first no earlier than `anchor`. Returns 0, or, when a
   * member's window has no room, by how much it missed (the group is left placed; the caller takes it out).
   */
  attempt(members: Int32Array, anchor: number): number {
    const { es, ls, low } = this
    for (const v of members) {
      es[v] = low[v]!
      ls[v] = Infinity
    }
    es[members[0]!] = Math.max(es[members[0]!]!, anchor)
    this.relax(members, true, es, true)
    for (const m of members) {
      if (es[m]! > ls[m]!) return (this.failed = m), es[m]! - ls[m]!
      const t = this.fit(m, es[m]!)
      if (t > ls[m]!) return (this.failed = m), t - ls[m]!
      this.place(m, t)
      es[m] = t
      ls[m] = t
      this.relax([m], true, es, true)
      this.relax([m], false, ls, true)
    }
    return 0
  }

  /** Places a whole group, retrying later until it fits; false only if even an empty kitchen refuses it. */
  placeGroup(members: Int32Array): boolean {
    for (const v of members) this.low[v] = this.fromOutside(v)
    const before = this.maxEnd
    const first = members[0]!
    let anchor = 0
    for (let round = 0; ; round++) {
      const missed = this.attempt(members, anchor)
      if (missed === 0) return true
      const start = this.S[first]!
      for (const v of members) if (this.placed[v]) this.unplace(v)
      this.maxEnd = before
      // From here on nothing outside the group is in the kitchen and no outside link binds.
      const dist = this.distances(members)
      let clear = 0
      for (const v of members) clear = Math.max(clear, Math.max(before, this.low[v]!) - dist[v]!)
      if (anchor >= clear) return false
      anchor = round >= RETRIES ? clear : Math.min(clear, start + missed)
    }
  }

  /** Clears every placement, for the next run on the same network. */
  private reset() {
    this.S.fill(NaN)
    this.placed.fill(0)
    this.emptyKitchen()
  }

  /** The whole scheme: priorities (lower first), ties by `tie`, then input order. Null if a group never fits. */
  run(prio: ArrayLike<number>, tie: ArrayLike<number>): Float64Array | null {
    this.reset()
    const { comps, comp, outOff, outEdges, eTo } = this.net
    const pinned = this.pins?.start
    // Fixed nodes hold the kitchen before anything else is placed, and come first in the order; one that
    // ends by the release holds nothing (nothing else starts before the release).
    if (pinned) {
      for (let v = 0; v < this.net.n; v++) {
        const t = pinned[v]!
        if (Number.isNaN(t)) continue
        if (t + this.net.dur[v]! > this.pins!.release) this.place(v, t)
        else {
          this.S[v] = t
          this.placed[v] = 1
          this.maxEnd = Math.max(this.maxEnd, t + this.net.dur[v]!)
        }
      }
    }
    const isPinned = (v: number) => pinned !== undefined && !Number.isNaN(pinned[v]!)
    const C = comps.length
    const waiting = this.waiting.slice()
    const { keyP, keyT, keyI } = this
    for (let c = 0; c < C; c++) {
      keyP[c] = Infinity
      keyT[c] = Infinity
      keyI[c] = 2 ** 30
      const members = comps[c]!
      for (let i = 0; i < members.length; i++) {
        const v = members[i]!
        if (isPinned(v) && members.length > 1) throw new Error('A fixed step is tied into a group; this is a fault in the re-planner.')
        const p = isPinned(v) ? -Infinity : prio[v]!
        const q = tie[v]!
        if (p < keyP[c]! || (p === keyP[c] && (q < keyT[c]! || (q === keyT[c] && v < keyI[c]!)))) {
          keyP[c] = p
          keyT[c] = q
          keyI[c] = v
        }
      }
    }
    const before = (a: number, b: number) =>
      keyP[a]! < keyP[b]! || (keyP[a] === keyP[b] && (keyT[a]! < keyT[b]! || (keyT[a] === keyT[b] && keyI[a]! < keyI[b]!)))
    const heap = this.heap
    let size = 0
    const push = (c: number) => {
      let i = size++
      while (i > 0) {
        const p = (i - 1) >> 1
        if (!before(c, heap[p]!)) break
        heap[i] = heap[p]!
        i = p
      }
      heap[i] = c
    }
    const pop = () => {
      const top = heap[0]!
      const last = heap[--size]!
      let i = 0
      for (let l = 1; l < size; l = 2 * i + 1) {
        const m = l + 1 < size && before(heap[l + 1]!, heap[l]!) ? l + 1 : l
        if (!before(heap[m]!, last)) break
        heap[i] = heap[m]!
        i = m
      }
      heap[i] = last
      return top
    }
    for (let c = 0; c < C; c++) if (!waiting[c]) push(c)
    while (size) {
      const c = pop()
      const members = comps[c]!
      if (members.length === 1) {
        if (!isPinned(members[0]!)) this.place(members[0]!, this.fit(members[0]!, this.fromOutside(members[0]!)))
      } else if (!this.placeGroup(members)) return null
      for (let i = 0; i < members.length; i++) {
        const v = members[i]!
        for (let k = outOff[v]!; k < outOff[v + 1]!; k++) {
          const c2 = comp[eTo[outEdges[k]!]!]!
          if (c2 !== c && !--waiting[c2]!) push(c2)
        }
      }
    }
    return this.S.slice()
  }

  /** The group alone in an empty kitchen, its first member placed so that no one starts before 0. */
  checkAlone(members: Int32Array): number {
    this.emptyKitchen()
    const dist = this.distances(members)
    let anchor = 0
    for (const v of members) {
      anchor = Math.max(anchor, -dist[v]!)
      this.low[v] = 0
    }
    const missed = this.attempt(members, anchor)
    for (const v of members) if (this.placed[v]) this.unplace(v)
    return missed
  }
}

/**
 * The serial scheme on one network, reusable: `schedule(prio, tie)` gives the start of each node in ms
 * (lower priority first, ties by `tie`, then input order), or null when a tied group never fits. With
 * `pins` (a re-plan), fixed nodes keep their starts and every other node starts at or after the release.
 */
export function planSerialScheme(net: PlanNet, pins: PlanPins | null = null): (prio: ArrayLike<number>, tie: ArrayLike<number>) => Float64Array | null {
  const run = new SerialRun(net, pins)
  return (prio, tie) => run.run(prio, tie)
}

/** One run of the serial scheme with the given priorities. */
export function planSerialSchedule(net: PlanNet, prio: ArrayLike<number>, tie: ArrayLike<number>): Float64Array | null {
  return new SerialRun(net).run(prio, tie)
}

/**
 * Refuses groups of tied steps that cannot fit in the kitchen even with nothing else cooking, e.g. two
 * pans that must finish together on a one-burner stove.
 */
export function planCheckTies(net: PlanNet) {
  const run = new SerialRun(net)
  for (const members of net.comps) {
    if (members.length < 2) continue
    if (run.checkAlone(members) === 0) continue
    const m = run.failed
    const steps = [...members].filter((v) => v < net.stepCount)
    const others = steps.filter((v) => v !== m).map((v) => `“${net.labels[v]}”`).join(', ')
    const station = ['', 'a burner', 'a place in the oven', 'a counter'][net.station[m]!]
    const what = net.hands[m] && station ? `a cook's hands and ${station}` : net.hands[m] ? `a cook's hands` : station
    throw new PlanError(
      'impossible-lag',
      `“${net.labels[m]}” is tied to ${others} by its links and needs ${what} at the moment it must start, and the kitchen has none free then. Add one to the kitchen, or loosen the links.`,
      steps.map((v) => net.ids[v]!),
    )
  }
}
