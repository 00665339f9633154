// The cook plan (shared/utils/plan.ts): time to plan episodes of 60, 500 and 2,000 steps against the
// critical path method alone on the same steps (the baseline, measured in the same run), and the
// average optimality gap on a fixed set of small random plans against exhaustive search
// (plan-exact.ts), with the latest-start rule alone, no justification, as the baseline. Re-planning
// (plan-replan.ts) part way through the cook, with timers running and a step late, against the first
// plan of the same episode in the same run.
import { planCriticalPath, planCook } from '../shared/utils/plan'
import { planCriticalTimes } from '../shared/utils/plan-cpm'
import { planCookExhaustive } from '../shared/utils/plan-exact'
import { planBuildNetwork } from '../shared/utils/plan-network'
import { planSeededRandom } from '../shared/utils/plan-rules'
import { replanCook } from '../shared/utils/plan-replan'
import { planSerialSchedule } from '../shared/utils/plan-sgs'
import type { PlanInput, PlanKitchen, PlanProgress, PlanResult, PlanStation, PlanStep } from '../shared/utils/plan-types'
import { percentile, type Benchmark } from './types'

/** An episode of `count` steps in recipes of 6–14 steps: prep, pans, ovens, rests, a few ties. */
export function planBenchEpisode(count: number, seed: number, kitchen: PlanKitchen): PlanInput {
  const random = planSeededRandom(seed)
  const pick = <T>(xs: T[]) => xs[Math.floor(random() * xs.length)]!
  const steps: PlanStep[] = []
  for (let r = 0; steps.length < count; r++) {
    const size = Math.min(count - steps.length, 6 + Math.floor(random() * 9))
    const first = steps.length
    for (let k = 0; k < size; k++) {
      const handsOn = random() < 0.55
      const station: PlanStation | null = handsOn ? pick<PlanStation | null>(['counter', 'counter', 'burner', null]) : pick<PlanStation | null>(['burner', 'burner', 'oven', null])
      const duration = 60 * (handsOn ? 1 + Math.floor(random() * 10) : 5 + Math.floor(random() * 40))
      const step: PlanStep = { id: `r${r}s${k}`, label: `recipe ${r} step ${k}`, recipe: `r${r}`, duration, handsOn, station, links: [] }
      if (k > 0) {
        const from = steps[first + Math.max(0, k - 1 - Math.floor(random() * 3))]!
        const roll = random()
        if (roll < 0.06 && !handsOn && station === null && from.duration >= duration) step.links!.push({ from: from.id, kind: 'finish-together' })
        else if (roll < 0.15) step.links!.push({ from: from.id, kind: 'start-start', lag: 60 * Math.floor(random() * 5) })
        else step.links!.push({ from: from.id })
        if (k > 2 && random() < 0.3) step.after = [steps[first + Math.floor(random() * (k - 1))]!.id].filter((id) => id !== from.id)
      }
      steps.push(step)
    }
  }
  return { steps, kitchen }
}

/** A small random plan, 6–8 steps, in a tight kitchen so that capacity matters. */
export function planBenchSmall(seed: number): PlanInput {
  const random = planSeededRandom(seed)
  const n = 6 + Math.floor(random() * 3)
  const steps: PlanStep[] = []
  for (let j = 0; j < n; j++) {
    const handsOn = random() < 0.6
    const station = [null, 'burner', 'oven', 'counter'][Math.floor(random() * 4)] as PlanStation | null
    const step: PlanStep = { id: `s${j}`, duration: 60 * (1 + Math.floor(random() * 12)), handsOn, station, links: [] }
    for (let i = 0; i < j; i++) {
      if (random() < 0.25) step.links!.push(random() < 0.75 ? { from: `s${i}` } : { from: `s${i}`, kind: 'start-start', lag: 60 * Math.floor(random() * 4) })
    }
    steps.push(step)
  }
  return { steps, kitchen: { hands: 1, burners: 1 + Math.floor(random() * 2), ovens: 1, racksPerOven: 1, counters: random() < 0.5 ? 1 : undefined } }
}

/** Timings in ms after as many warm-up runs (a server plans many episodes), and the first, cold, run. */
function timed(run: () => unknown, rounds: number): { times: number[]; first: number } {
  const t0 = performance.now()
  run()
  const first = performance.now() - t0
  for (let i = 1; i < rounds; i++) run()
  const times: number[] = []
  for (let i = 0; i < rounds; i++) {
    const t = performance.now()
    run()
    times.push(performance.now() - t)
  }
  return { times, first }
}

function planTime(count: number, seed: number, kitchen: PlanKitchen, rounds: number, bound: number): Benchmark {
  return {
    name: `plan: ${count.toLocaleString('en')} steps, p50`,
    async run() {
      const input = planBenchEpisode(count, seed, kitchen)
      const plan = planCook(input)
      const { times, first } = timed(() => planCook(input), rounds)
      const baseline = percentile(timed(() => planCriticalPath(input), rounds).times, 50)
      const kit = `${kitchen.hands} hands, ${kitchen.burners} burners, ${kitchen.ovens} oven(s) × ${kitchen.racksPerOven} racks`
      const search = plan.bounds.gap > 0 ? `every rule tried, ${(plan.bounds.gap * 100).toFixed(2)} % over the lower bound` : 'stopped at the lower bound'
      return { figure: percentile(times, 50), unit: 'ms', baseline, bound, note: `${kit}; ${search}; best: ${plan.rule}; first run ${first.toFixed(1)} ms; baseline: critical path method alone` }
    },
  }
}

const SMALL = 40

export const planOptimalityGap: Benchmark = {
  name: 'plan: optimality gap on small random plans, average',
  async run() {
    let gap = 0
    let single = 0
    let optimal = 0
    for (let seed = 1; seed <= SMALL; seed++) {
      const input = planBenchSmall(seed)
      const best = planCookExhaustive(input).makespan
      const plan = planCook(input).makespan
      const net = planBuildNetwork(input)
      const times = planCriticalTimes(net)
      const S = planSerialSchedule(net, times.ls, times.es)!
      const lst = Math.max(...net.dur.map((d, v) => S[v]! + d)) / 1000
      gap += (plan - best) / best
      single += (lst - best) / best
      if (plan === best) optimal++
    }
    const note = `${SMALL} plans of 6–8 steps against exhaustive search; optimal in ${optimal}; baseline: latest-start rule alone`
    return { figure: (100 * gap) / SMALL, unit: '%', baseline: (100 * single) / SMALL, bound: 5, note }
  },
}

/**
 * The shoot at `share` of the first plan: steps that should have ended are done (some up to 2 minutes
 * early, seeded), steps under way are running to their planned end, except hands-on ones, 3 minutes late.
 */
export function planBenchProgress(plan: PlanResult, share: number, seed: number): PlanProgress {
  const random = planSeededRandom(seed)
  const now = Math.round(share * plan.makespan)
  const done: NonNullable<PlanProgress['done']> = {}
  const running: NonNullable<PlanProgress['running']> = {}
  for (const step of plan.steps) {
    if (step.start >= now) continue
    if (step.end <= now) done[step.id] = { start: step.start, end: Math.max(step.start, step.end - 60 * Math.floor(random() * 3)) }
    else running[step.id] = { start: step.start, end: step.end + (step.handsLane ? 180 : 0) }
  }
  return { now, done, running, previous: plan }
}

function replanTime(count: number, seed: number, kitchen: PlanKitchen, rounds: number, bound: number): Benchmark {
  return {
    name: `plan: re-plan ${count.toLocaleString('en')} steps with running timers, p50`,
    async run() {
      const input = planBenchEpisode(count, seed, kitchen)
      const first = planCook(input)
      const progress = planBenchProgress(first, 0.4, seed)
      const re = replanCook(input, progress)
      const { times } = timed(() => replanCook(input, progress), rounds)
      const baseline = percentile(timed(() => planCook(input), Math.max(5, rounds / 10)).times, 50)
      const timers = Object.keys(progress.running!).filter((id) => !first.steps.find((s) => s.id === id)!.handsLane).length
      const state = `at ${Math.round(progress.now / 60)} of ${Math.round(first.makespan / 60)} min: ${Object.keys(progress.done!).length} done, ${timers} timers running`
      const result = `finish ${Math.round(re.makespan / 60)} min, ${re.collisions.length} collisions, order: ${re.rule}`
      return { figure: percentile(times, 50), unit: 'ms', baseline, bound, note: `${state}; ${result}; p95 ${percentile(times, 95).toFixed(3)} ms; baseline: the first plan (p50)` }
    },
  }
}

const host = { hands: 1, burners: 4, ovens: 1, racksPerOven: 2 }
const studio = { hands: 2, burners: 4, ovens: 2, racksPerOven: 2 }

export const planBenchmarks: Benchmark[] = [
  planTime(60, 2, host, 100, 5),
  planTime(500, 1, studio, 20, 50),
  planTime(2000, 1, studio, 8, 200),
  planOptimalityGap,
  replanTime(60, 2, host, 400, 5),
  replanTime(500, 1, studio, 100, 50),
]
