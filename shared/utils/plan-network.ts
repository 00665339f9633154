// The cook plan's input, checked and turned into a temporal network: one node per step (plus one
// zero-length milestone between recipes when the kitchen cooks one recipe at a time), and edges
// "S(to) ≥ S(from) + w" in milliseconds. Finish-together links add a back edge with −w, which makes
// the pair's offset exact; such ties are the only cycles the network may hold, so its strongly
// connected components are the groups of steps that have to be placed together.
import { planCheckAcyclic, planCsr, planRecipeOrder, planStronglyConnected, planTopoRanks, type PlanEdge } from './plan-graph'
import { fieldLabel } from './field-labels'
import { PlanError, type PlanInput, type PlanLinkKind, type PlanStation } from './plan-types'

export const PLAN_HANDS = 0
const STATIONS: Record<PlanStation, number> = { burner: 1, oven: 2, counter: 3 }
const STATION_NAMES = ['hands', 'burner', 'oven', 'counter'] as const
const KINDS: PlanLinkKind[] = ['finish-start', 'start-start', 'finish-together']

export interface PlanNet {
  /** Nodes: the steps first (input order), then the milestones. */
  n: number
  stepCount: number
  ids: string[]
  labels: string[]
  recipes: (string | null)[]
  dur: number[]
  hands: Uint8Array
  /** Station resource index (1 burner, 2 oven, 3 counter), 0 for none. */
  station: Int8Array
  /** Capacity per resource index: hands, burners, oven places, counters (Infinity when unlimited). */
  cap: number[]
  ovens: number
  racks: number
  eFrom: Int32Array
  eTo: Int32Array
  eW: Float64Array
  /** 1 for an edge that comes from a link (or a milestone), 0 for the back edge of a finish-together link. */
  ePlain: Uint8Array
  /** 1 for an edge whose weight counts the duration of its `from` node (finish-start, finish-together, into a milestone). */
  eFinish: Uint8Array
  outOff: Int32Array
  outEdges: Int32Array
  inOff: Int32Array
  inEdges: Int32Array
  /** Strongly connected component of each node; components are numbered in topological order. */
  comp: Int32Array
  /** Members of each component, in topological order of the links. */
  comps: Int32Array[]
}

/** "6 min", "1 h 5 min", "45 s": how long something lasts, for messages a cook reads. */
export function planDurationText(ms: number): string {
  const s = Math.round(ms / 1000)
  if (s < 60) return `${s} s`
  const h = Math.floor(s / 3600)
  const m = Math.floor((s % 3600) / 60)
  const rest = s % 60
  return [h ? `${h} h` : '', m ? `${m} min` : '', rest ? `${rest} s` : ''].filter(Boolean).join(' ')
}

/** Seconds to whole milliseconds: the scheduler's time grain, so sums of durations stay exact. */
const toMs = (seconds: number) => Math.round(seconds * 1000)

function countOf(kitchen: Record<string, unknown>, key: string, fallback: number): number {
  const value = kitchen[key]
  if (value === undefined || value === null) return fallback
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0) {
    throw new PlanError('bad-input', `${fieldLabel(['kitchen', key])}: write a whole number of zero or more.`)
  }
  return value
}

const quoted = (labels: string[]) => labels.slice(0, 3).map((l) => `“${l}”`).join(', ') + (labels.length > 3 ? ` and ${labels.length - 3} more` : '')

/** Checks the input and builds the network; throws PlanError for anything it cannot plan. */
export function planBuildNetwork(input: PlanInput): PlanNet {
  if (!input || typeof input !== 'object' || !Array.isArray(input.steps)) throw new PlanError('bad-input', 'The plan needs a list of steps.')
  const kitchen = (input.kitchen ?? {}) as Record<string, unknown>
  if (typeof kitchen !== 'object') throw new PlanError('bad-input', 'The kitchen must be an object such as { hands: 1, burners: 4, ovens: 1 }.')
  const handsCap = countOf(kitchen, 'hands', 1)
  const burners = countOf(kitchen, 'burners', 4)
  const ovens = countOf(kitchen, 'ovens', 1)
  const racks = countOf(kitchen, 'racksPerOven', 1)
  const counters = countOf(kitchen, 'counters', Infinity)
  const parallel = kitchen.parallelRecipes ?? true
  if (typeof parallel !== 'boolean') throw new PlanError('bad-input', 'Two recipes at once: choose yes or no (true or false).')
  const cap = [handsCap, burners, ovens * racks, counters]

  const steps = input.steps
  const stepCount = steps.length
  const index = new Map<string, number>()
  const ids: string[] = []
  const labels: string[] = []
  const recipes: (string | null)[] = []
  const dur: number[] = []
  const hands: number[] = []
  const station: number[] = []
  steps.forEach((step, i) => {
    if (!step || typeof step !== 'object') throw new PlanError('bad-input', `Step ${i + 1} is not a step.`)
    const id = step.id
    if (typeof id !== 'string' || id === '') throw new PlanError('bad-input', `Step ${i + 1} has no id.`)
    if (index.has(id)) throw new PlanError('bad-input', `Two steps share the id “${id}”; give each step its own id.`, [id])
    index.set(id, i)
    const label = typeof step.label === 'string' && step.label.trim() ? step.label.trim() : id
    ids.push(id)
    labels.push(label)
    if (step.recipe !== undefined && step.recipe !== null && typeof step.recipe !== 'string') throw new PlanError('bad-input', `The recipe of “${label}” must be a name.`, [id])
    recipes.push(step.recipe ?? null)
    if (typeof step.duration !== 'number' || !Number.isFinite(step.duration) || step.duration < 0) {
      throw new PlanError('bad-input', `“${label}” needs a duration of zero or more seconds (got ${String(step.duration)}).`, [id])
    }
    dur.push(toMs(step.duration))
    if (typeof step.handsOn !== 'boolean') throw new PlanError('bad-input', `Say whether “${label}” is hands-on or unattended.`, [id])
    hands.push(step.handsOn ? 1 : 0)
    const st = step.station ?? null
    if (st !== null && !Object.hasOwn(STATIONS, st as string)) throw new PlanError('bad-input', `“${label}” names an unknown station “${String(st)}”; use burner, oven, counter or none.`, [id])
    station.push(st === null ? 0 : STATIONS[st as PlanStation])
  })

  // A station (or a cook's hands) the kitchen does not have.
  for (let r = 0; r < 4; r++) {
    const needing = ids.filter((_, i) => (r === PLAN_HANDS ? hands[i] === 1 : station[i] === r))
    if (!needing.length || cap[r] !== 0) continue
    const names = quoted(needing.map((id) => labels[index.get(id)!]!))
    const many = needing.length > 1
    const why =
      r === PLAN_HANDS
        ? `${many ? 'are' : 'is'} hands-on, and this kitchen has no cook (hands is 0)`
        : r === STATIONS.oven && ovens > 0
          ? `${many ? 'need' : 'needs'} the oven, and this kitchen’s ovens take no dishes (racksPerOven is 0)`
          : `${many ? 'need' : 'needs'} ${r === STATIONS.oven ? 'an' : 'a'} ${STATION_NAMES[r]}, and this kitchen has none`
    throw new PlanError('missing-station', `${names} ${why}. Add one to the kitchen, or change the step.`, needing)
  }

  // Links → edges.
  const edges: PlanEdge[] = []
  steps.forEach((step, j) => {
    const label = labels[j]!
    const links: { from: unknown; kind?: unknown; lag?: unknown }[] = []
    if (step.after !== undefined) {
      if (!Array.isArray(step.after)) throw new PlanError('bad-input', `“${label}” waits for something that is not a list of steps.`, [ids[j]!])
      for (const from of step.after) links.push({ from })
    }
    if (step.links !== undefined) {
      if (!Array.isArray(step.links)) throw new PlanError('bad-input', `“${label}” has links that are not a list.`, [ids[j]!])
      for (const link of step.links) {
        if (!link || typeof link !== 'object') throw new PlanError('bad-input', `“${label}” has a link that is not a link.`, [ids[j]!])
        links.push(link)
      }
    }
    for (const link of links) {
      const i = typeof link.from === 'string' ? index.get(link.from) : undefined
      if (i === undefined) throw new PlanError('bad-input', `“${label}” waits for “${String(link.from)}”, which is not a step of this plan.`, [ids[j]!])
      if (i === j) throw new PlanError('cycle', `“${label}” waits for itself; remove that link.`, [ids[j]!])
      const kind = (link.kind ?? 'finish-start') as PlanLinkKind
      if (!KINDS.includes(kind)) throw new PlanError('bad-input', `“${label}” has a link of unknown kind “${String(link.kind)}”; use ${KINDS.join(', ')}.`, [ids[j]!])
      if (link.lag !== undefined && (typeof link.lag !== 'number' || !Number.isFinite(link.lag) || link.lag < 0)) {
        throw new PlanError('bad-input', `The lag of “${label}” after “${labels[i]}” must be zero or more seconds (got ${String(link.lag)}); to overlap them, use a start-start or finish-together link.`, [ids[i]!, ids[j]!])
      }
      const lag = link.lag === undefined ? undefined : toMs(link.lag as number)
      if (kind === 'finish-start') edges.push({ from: i, to: j, w: dur[i]! + (lag ?? 0), plain: true, finish: true })
      else if (kind === 'start-start') edges.push({ from: i, to: j, w: lag ?? 0, plain: true })
      else {
        const lead = lag ?? dur[j]!
        if (lead > dur[i]!) {
          throw new PlanError('impossible-lag', `“${label}” goes in ${planDurationText(lead)} before “${labels[i]}” finishes, but “${labels[i]}” lasts only ${planDurationText(dur[i]!)}; shorten the lead or lengthen “${labels[i]}”.`, [ids[i]!, ids[j]!])
        }
        if (lead < dur[j]!) {
          throw new PlanError('impossible-lag', `“${label}” lasts ${planDurationText(dur[j]!)} but must finish with “${labels[i]}”, ${planDurationText(lead)} after it goes in; make the lead at least ${planDurationText(dur[j]!)}.`, [ids[i]!, ids[j]!])
        }
        edges.push({ from: i, to: j, w: dur[i]! - lead, plain: true, finish: true }, { from: j, to: i, w: -(dur[i]! - lead), plain: false })
      }
    }
  })
  planCheckAcyclic(stepCount, edges, labels, ids, stepCount)

  // One recipe at a time: a milestone between consecutive recipes, in an order the links allow.
  let n = stepCount
  if (!parallel) {
    const order = planRecipeOrder(recipes, edges)
    for (let k = 0; k + 1 < order.length; k++) {
      const m = n++
      recipes.forEach((r, i) => {
        if (r === order[k]) edges.push({ from: i, to: m, w: dur[i]!, plain: true, finish: true })
        if (r === order[k + 1]) edges.push({ from: m, to: i, w: 0, plain: true })
      })
      ids.push('')
      labels.push('')
      recipes.push(null)
      dur.push(0)
      hands.push(0)
      station.push(0)
    }
    planCheckAcyclic(n, edges, labels, ids, stepCount)
  }

  const eFrom = Int32Array.from(edges, (e) => e.from)
  const eTo = Int32Array.from(edges, (e) => e.to)
  const [outOff, outEdges] = planCsr(n, eFrom)
  const [inOff, inEdges] = planCsr(n, eTo)
  const net: PlanNet = {
    n, stepCount, ids, labels, recipes, dur, hands: Uint8Array.from(hands), station: Int8Array.from(station), cap, ovens, racks,
    eFrom, eTo, eW: Float64Array.from(edges, (e) => e.w), ePlain: Uint8Array.from(edges, (e) => (e.plain ? 1 : 0)),
    eFinish: Uint8Array.from(edges, (e) => (e.finish ? 1 : 0)),
    outOff, outEdges, inOff, inEdges, comp: new Int32Array(n), comps: [],
  }
  const rank = planTopoRanks(n, eFrom, eTo, Uint8Array.from(edges, (e) => (e.plain ? 1 : 0)))!
  planStronglyConnected(net, rank)
  return net
}
