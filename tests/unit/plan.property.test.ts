// The cook plan on random instances (fast-check): every link and every capacity holds at every
// instant, the lanes never double-book, the critical path figures agree with an independent
// relaxation, the plan is no shorter than its lower bounds, and on plans small enough for exhaustive
// search (plan-exact.ts) it is within 5 % of the true optimum on average.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { planCook } from '../../shared/utils/plan'
import { planCookExhaustive } from '../../shared/utils/plan-exact'
import { PlanError, type PlanInput, type PlanKitchen, type PlanResult, type PlanStation, type PlanStep } from '../../shared/utils/plan-types'

const EPS = 1e-6
const MIN = 60

interface LinkSpec { back: number; kind: 'after' | 'finish-start' | 'start-start' | 'finish-together'; lag: number; share: number }
interface StepSpec { minutes: number; handsOn: boolean; station: PlanStation | null; recipe: number; links: LinkSpec[] }

const linkSpec = (ties: boolean) =>
  fc.record({
    back: fc.integer({ min: 1, max: 6 }),
    kind: fc.constantFrom<LinkSpec['kind'][]>(...(ties ? ['after', 'finish-start', 'start-start', 'finish-together'] as const : ['after', 'finish-start', 'start-start'] as const)),
    lag: fc.integer({ min: 0, max: 5 }),
    share: fc.integer({ min: 0, max: 4 }),
  })
const stepSpec = (ties: boolean, maxMinutes: number) =>
  fc.record({
    minutes: fc.integer({ min: 0, max: maxMinutes }),
    handsOn: fc.boolean(),
    station: fc.constantFrom<(PlanStation | null)[]>(null, 'burner', 'oven', 'counter'),
    recipe: fc.integer({ min: 0, max: 2 }),
    links: fc.array(linkSpec(ties), { maxLength: 3 }),
  })
const kitchenSpec = fc.record({
  hands: fc.integer({ min: 1, max: 3 }),
  burners: fc.integer({ min: 1, max: 3 }),
  ovens: fc.integer({ min: 1, max: 2 }),
  racksPerOven: fc.integer({ min: 1, max: 2 }),
  counters: fc.option(fc.integer({ min: 1, max: 2 }), { nil: undefined }),
  parallelRecipes: fc.boolean(),
})

/** Steps s0…s(n−1), each linked only to earlier steps; a finish-together lead lies between the two durations. */
function build(specs: StepSpec[], kitchen: PlanKitchen): PlanInput {
  const steps: PlanStep[] = specs.map((spec, j) => {
    const step: PlanStep = { id: `s${j}`, label: `step ${j}`, duration: spec.minutes * MIN, handsOn: spec.handsOn, station: spec.station, recipe: `r${spec.recipe}`, after: [], links: [] }
    const used = new Set<number>()
    for (const link of spec.links) {
      const i = j - link.back
      if (i < 0 || used.has(i)) continue
      used.add(i)
      const from = `s${i}`
      const di = specs[i]!.minutes
      if (link.kind === 'after') step.after!.push(from)
      else if (link.kind === 'finish-together' && di >= spec.minutes) {
        step.links!.push({ from, kind: 'finish-together', lag: (spec.minutes + Math.round(((di - spec.minutes) * link.share) / 4)) * MIN })
      } else step.links!.push({ from, kind: link.kind === 'start-start' ? 'start-start' : 'finish-start', lag: link.lag * MIN })
    }
    return step
  })
  return { steps, kitchen }
}

const instance = (ties: boolean, maxSteps: number) =>
  fc.tuple(fc.array(stepSpec(ties, 12), { minLength: 1, maxLength: maxSteps }), kitchenSpec).map(([specs, kitchen]) => build(specs, kitchen))

/** Every constraint as "start(to) ≥ start(from) + w", seconds; finish-together gives two. */
function constraints(input: PlanInput, recipeOrder: string[] | null): [string, string, number][] {
  const d = Object.fromEntries(input.steps.map((s) => [s.id, s.duration]))
  const out: [string, string, number][] = []
  for (const s of input.steps) {
    for (const from of s.after ?? []) out.push([from, s.id, d[from]!])
    for (const l of s.links ?? []) {
      if (l.kind === 'start-start') out.push([l.from, s.id, l.lag ?? 0])
      else if (l.kind === 'finish-together') {
        const w = d[l.from]! - (l.lag ?? d[s.id]!)
        out.push([l.from, s.id, w], [s.id, l.from, -w])
      } else out.push([l.from, s.id, d[l.from]! + (l.lag ?? 0)])
    }
  }
  // One recipe at a time: every step of a recipe after every step of the one before it.
  if (recipeOrder) {
    for (let k = 0; k + 1 < recipeOrder.length; k++) {
      const before = input.steps.filter((s) => s.recipe === recipeOrder[k])
      const after = input.steps.filter((s) => s.recipe === recipeOrder[k + 1])
      for (const a of before) for (const b of after) out.push([a.id, b.id, a.duration])
    }
  }
  return out
}

/** Critical path method by plain relaxation to a fixed point (independent of plan-cpm.ts). */
function relaxedTimes(input: PlanInput, edges: [string, string, number][]) {
  const es: Record<string, number> = Object.fromEntries(input.steps.map((s) => [s.id, 0]))
  for (let round = 0, changed = true; changed; round++) {
    changed = false
    for (const [a, b, w] of edges) {
      if (es[a]! + w > es[b]! + EPS) {
        es[b] = es[a]! + w
        changed = true
      }
    }
    if (round > input.steps.length + 2) throw new Error('no fixed point')
  }
  const length = Math.max(0, ...input.steps.map((s) => es[s.id]! + s.duration))
  const ls: Record<string, number> = Object.fromEntries(input.steps.map((s) => [s.id, length - s.duration]))
  for (let changed = true; changed; ) {
    changed = false
    for (const [a, b, w] of edges) {
      if (ls[b]! - w < ls[a]! - EPS) {
        ls[a] = ls[b]! - w
        changed = true
      }
    }
  }
  return { es, ls, length }
}

/** How many steps each resource holds at once, with the planner's defaults (one cook, four burners, one oven rack). */
function capacities(input: PlanInput): Record<string, number> {
  const k = input.kitchen ?? {}
  return { hands: k.hands ?? 1, burner: k.burners ?? 4, oven: (k.ovens ?? 1) * (k.racksPerOven ?? 1), counter: k.counters ?? Infinity }
}

/** Checks a plan against its input; returns nothing, fails the test on the first broken rule. */
function checkPlan(input: PlanInput, plan: PlanResult) {
  const cap = capacities(input)
  expect(plan.steps.map((s) => s.id)).toEqual(input.steps.map((s) => s.id))
  const at = Object.fromEntries(plan.steps.map((s) => [s.id, s]))
  const spec = Object.fromEntries(input.steps.map((s) => [s.id, s]))
  for (const s of input.steps) {
    expect(at[s.id]!.start).toBeGreaterThanOrEqual(-EPS)
    expect(Math.abs(at[s.id]!.end - at[s.id]!.start - s.duration)).toBeLessThan(EPS)
  }
  // Recipes one at a time: their spans do not overlap.
  const parallel = input.kitchen?.parallelRecipes ?? true
  const recipes = [...new Set(input.steps.map((s) => s.recipe!))]
  const span = (r: string) => {
    const xs = plan.steps.filter((s) => spec[s.id]!.recipe === r)
    return [Math.min(...xs.map((s) => s.start)), Math.max(...xs.map((s) => s.end))] as const
  }
  const order = parallel ? null : [...recipes].sort((a, b) => span(a)[0] - span(b)[0] || span(a)[1] - span(b)[1])
  if (order) for (let i = 0; i + 1 < order.length; i++) expect(span(order[i]!)[1]).toBeLessThanOrEqual(span(order[i + 1]!)[0] + EPS)
  // Every link.
  const edges = constraints(input, order)
  for (const [a, b, w] of edges) expect(at[b]!.start).toBeGreaterThanOrEqual(at[a]!.start + w - EPS)
  // Every capacity at every instant: usage only rises where a step starts.
  const holds = (s: PlanStep, r: string) => s.duration > 0 && (r === 'hands' ? s.handsOn : s.station === r)
  for (const t of plan.steps.map((s) => s.start)) {
    for (const r of Object.keys(cap)) {
      const busy = input.steps.filter((s) => holds(s, r) && at[s.id]!.start <= t + EPS && t < at[s.id]!.end - EPS).length
      expect(busy).toBeLessThanOrEqual(cap[r]!)
    }
  }
  // Lanes: the right kind, and no two steps at once in one lane (one per oven rack).
  for (const s of input.steps) {
    const p = at[s.id]!
    const kind = s.station ?? (s.handsOn ? 'hands' : 'aside')
    expect(p.lane.startsWith(`${kind}-`)).toBe(true)
    expect(plan.lanes).toContain(p.lane)
    expect(p.handsLane === null).toBe(!s.handsOn)
    if (p.handsLane) expect(plan.lanes).toContain(p.handsLane)
    expect(p.rack === null).toBe(s.station !== 'oven')
  }
  const overlap = (a: PlanStep, b: PlanStep) => at[a.id]!.start < at[b.id]!.end - EPS && at[b.id]!.start < at[a.id]!.end - EPS
  for (const a of input.steps) {
    for (const b of input.steps) {
      if (a.id >= b.id || a.duration === 0 || b.duration === 0 || !overlap(a, b)) continue
      expect(at[a.id]!.lane === at[b.id]!.lane && at[a.id]!.rack === at[b.id]!.rack).toBe(false)
      if (a.handsOn && b.handsOn) expect(at[a.id]!.handsLane).not.toBe(at[b.id]!.handsLane)
    }
  }
  // Length and lower bounds.
  expect(plan.makespan).toBeCloseTo(Math.max(0, ...plan.steps.map((s) => s.end)), 6)
  const handsWork = input.steps.filter((s) => s.handsOn).reduce((sum, s) => sum + s.duration, 0)
  expect(plan.bounds.handsOn).toBeCloseTo(handsWork / cap.hands!, 6)
  expect(plan.makespan).toBeGreaterThanOrEqual(plan.bounds.criticalPath - EPS)
  expect(plan.makespan).toBeGreaterThanOrEqual(plan.bounds.handsOn - EPS)
  expect(plan.makespan).toBeGreaterThanOrEqual(plan.bounds.lower - EPS)
  // Critical path method, ignoring capacity, by an independent relaxation.
  const cpm = relaxedTimes(input, edges)
  expect(plan.bounds.criticalPath).toBeCloseTo(cpm.length, 6)
  for (const s of input.steps) {
    const p = at[s.id]!
    expect(p.earliestStart).toBeCloseTo(cpm.es[s.id]!, 6)
    expect(p.latestStart).toBeCloseTo(cpm.ls[s.id]!, 6)
    expect(p.slack).toBeCloseTo(p.latestStart - p.earliestStart, 6)
    expect(p.slack).toBeGreaterThanOrEqual(-EPS)
    expect(p.critical).toBe(p.slack < EPS)
  }
  if (plan.criticalPath.length) {
    expect(plan.criticalPath.every((id) => at[id]!.critical)).toBe(true)
    expect(at[plan.criticalPath.at(-1)!]!.earliestStart + spec[plan.criticalPath.at(-1)!]!.duration).toBeCloseTo(cpm.length, 6)
  }
  // Cues: one per unattended step, at its start, during a hands-on step then under way (if any).
  expect(plan.cues.map((c) => c.stepId).sort()).toEqual(input.steps.filter((s) => !s.handsOn).map((s) => s.id).sort())
  for (const cue of plan.cues) {
    expect(cue.at).toBe(at[cue.stepId]!.start)
    const under = input.steps.filter((s) => s.handsOn && s.duration > 0 && at[s.id]!.start <= cue.at && cue.at < at[s.id]!.end)
    if (cue.during === null) expect(under).toEqual([])
    else expect(under.map((s) => s.id)).toContain(cue.during)
  }
}

/** Whether the recipes wait on one another in a circle (then a one-recipe-at-a-time kitchen must refuse). */
function recipesCircle(input: PlanInput): boolean {
  const recipeOf = Object.fromEntries(input.steps.map((s) => [s.id, s.recipe!]))
  const next = new Map<string, Set<string>>()
  for (const s of input.steps) {
    for (const from of [...(s.after ?? []), ...(s.links ?? []).map((l) => l.from)]) {
      if (recipeOf[from] !== s.recipe) next.set(recipeOf[from]!, (next.get(recipeOf[from]!) ?? new Set()).add(s.recipe!))
    }
  }
  const reaches = (a: string, b: string, seen = new Set<string>()): boolean =>
    [...(next.get(a) ?? [])].some((c) => c === b || (!seen.has(c) && (seen.add(c), reaches(c, b, seen))))
  return [...next.keys()].some((r) => reaches(r, r))
}

/**
 * Whether a refusal as impossible is justified, checked apart from the planner: the links alone have no
 * solution (relaxation finds no fixed point), or a finish-together link overlaps two recipes in a kitchen
 * that cooks one at a time, or the named steps cannot be placed together even in an empty kitchen
 * (depth-first search over whole minutes, enough for data in whole minutes).
 */
function impossible(input: PlanInput, stepIds: string[]): boolean {
  try {
    relaxedTimes(input, constraints(input, null))
  } catch {
    return true
  }
  const spec = Object.fromEntries(input.steps.map((s) => [s.id, s]))
  if (input.kitchen?.parallelRecipes === false) {
    for (const s of input.steps) for (const l of s.links ?? []) if (l.kind === 'finish-together' && spec[l.from]!.recipe !== s.recipe && (l.lag ?? s.duration) > 0) return true
  }
  const cap = capacities(input)
  const group = new Set(stepIds)
  const edges = constraints(input, null).filter(([a, b]) => group.has(a) && group.has(b))
  const minutes = (id: string) => spec[id]!.duration / MIN
  const reach = stepIds.reduce((sum, id) => sum + minutes(id), 0) + 5 * stepIds.length
  const at = new Map<string, number>()
  const holds = (id: string, r: string) => minutes(id) > 0 && (r === 'hands' ? spec[id]!.handsOn : spec[id]!.station === r)
  const busy = (r: string, t: number) => [...at].filter(([p, start]) => holds(p, r) && start <= t && t < start + minutes(p)).length
  const fits = () => [...at.values()].every((t) => Object.keys(cap).every((r) => busy(r, t) <= cap[r]!))
  const place = (i: number): boolean => {
    if (i === stepIds.length) return true
    const id = stepIds[i]!
    for (let t = i ? -reach : 0; t <= (i ? reach : 0); t++) {
      at.set(id, t)
      if (edges.every(([a, b, w]) => !(at.has(a) && at.has(b)) || at.get(b)! * MIN >= at.get(a)! * MIN + w) && fits() && place(i + 1)) return true
      at.delete(id)
    }
    return false
  }
  return !place(0)
}

describe('random plans without finish-together links', () => {
  it('keep every link and capacity at every instant, and every figure; refuse only recipes that wait on one another', () => {
    fc.assert(
      fc.property(instance(false, 14), (input) => {
        const mustRefuse = input.kitchen!.parallelRecipes === false && recipesCircle(input)
        let plan: PlanResult
        try {
          plan = planCook(input)
        } catch (error) {
          expect(error).toBeInstanceOf(PlanError)
          expect([(error as PlanError).code, mustRefuse]).toEqual(['cycle', true])
          return
        }
        expect(mustRefuse).toBe(false)
        checkPlan(input, plan)
        expect(planCook(structuredClone(input))).toEqual(plan)
      }),
      { numRuns: 300, seed: 20240611 },
    )
  })
})

describe('random plans with finish-together links', () => {
  it('keep every tie exactly, or refuse with impossible-lag naming real steps, only when it is impossible', () => {
    let refused = 0
    fc.assert(
      fc.property(instance(true, 12).filter((input) => input.kitchen!.parallelRecipes !== false || !recipesCircle(input)), (input) => {
        let plan: PlanResult
        try {
          plan = planCook(input)
        } catch (error) {
          expect(error).toBeInstanceOf(PlanError)
          const e = error as PlanError
          expect(e.code).toBe('impossible-lag')
          expect(e.stepIds.length).toBeGreaterThan(0)
          for (const id of e.stepIds) expect(input.steps.map((s) => s.id)).toContain(id)
          expect(impossible(input, e.stepIds)).toBe(true)
          refused++
          return
        }
        checkPlan(input, plan)
      }),
      { numRuns: 300, seed: 7 },
    )
    console.log(`cook plan, random plans with ties: ${refused} of 300 refused, each checked impossible`)
  })
})

describe('small random plans against exhaustive search', () => {
  // Tight kitchens (one cook, one or two burners, one oven place), 6–8 steps, so capacity binds.
  const small = fc
    .tuple(
      fc.array(stepSpec(false, 12).map((s) => ({ ...s, minutes: Math.max(1, s.minutes) })), { minLength: 6, maxLength: 8 }),
      fc.record({
        hands: fc.constant(1),
        burners: fc.integer({ min: 1, max: 2 }),
        ovens: fc.constant(1),
        racksPerOven: fc.constant(1),
        counters: fc.option(fc.constant(1), { nil: undefined }),
      }),
    )
    .map(([specs, kitchen]) => build(specs, kitchen))

  it('the exhaustive optimum is a feasible plan and respects the lower bounds; the heuristic is never better', () => {
    fc.assert(
      fc.property(small, (input) => {
        const best = planCookExhaustive(input)
        const plan = planCook(input)
        // The exhaustive schedule, laid out as a plan, must pass the same checks.
        const starts = best.starts
        const edges = constraints(input, null)
        for (const [a, b, w] of edges) expect(starts[b]!).toBeGreaterThanOrEqual(starts[a]! + w - EPS)
        expect(best.makespan).toBeGreaterThanOrEqual(plan.bounds.lower - EPS)
        expect(plan.makespan).toBeGreaterThanOrEqual(best.makespan - EPS)
      }),
      { numRuns: 60, seed: 99 },
    )
  })

  it('is within 5 % of the optimum on average over a fixed set of 40', () => {
    const set = fc.sample(small, { seed: 2024, numRuns: 40 })
    let gap = 0
    let optimal = 0
    let worst = 0
    for (const input of set) {
      const best = planCookExhaustive(input).makespan
      const plan = planCook(input).makespan
      const g = (plan - best) / best
      gap += g
      worst = Math.max(worst, g)
      if (g < EPS) optimal++
    }
    const average = gap / set.length
    console.log(`cook plan vs exhaustive search: average gap ${(100 * average).toFixed(2)} %, worst ${(100 * worst).toFixed(2)} %, optimal in ${optimal} of ${set.length}`)
    expect(average).toBeLessThanOrEqual(0.05)
  })
})
