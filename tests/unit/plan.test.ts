// The cook plan (shared/utils/plan.ts): critical path method against a textbook worked example, the
// link kinds, capacity, lanes, cues, and the refusals. Random instances are in plan.property.test.ts.
import { describe, expect, it } from 'vitest'
import { planCook, planCriticalPath } from '../../shared/utils/plan'
import { planCookExhaustive } from '../../shared/utils/plan-exact'
import { PlanError, type PlanInput, type PlanKitchen, type PlanStep } from '../../shared/utils/plan-types'

const MIN = 60
const WEEK = 7 * 24 * 3600

/**
 * Hillier & Lieberman, Introduction to Operations Research, chapter "Project Management with PERT/CPM",
 * the prototype example "the Reliable Construction Co. project" and the section "Scheduling a project
 * with PERT/CPM" (sections 10.1 and 10.3 in the 8th and 9th editions, from memory). The activity
 * list, the durations (weeks) and the immediate predecessors are reproduced from memory; the
 * published figures we expect, also from memory: the project takes 44 weeks, the critical path is START → A → B → C → E → F → J → L → N →
 * FINISH, and the slacks are D 4, G 4, H 4, I 2, K 1, M 4 and 0 for the others. The earliest and
 * latest starts below follow from the forward and backward passes the book describes, worked by hand.
 */
const reliable: [id: string, weeks: number, after: string[], es: number, ls: number][] = [
  ['A', 2, [], 0, 0], // excavate
  ['B', 4, ['A'], 2, 2], // lay the foundation
  ['C', 10, ['B'], 6, 6], // put up the rough wall
  ['D', 6, ['C'], 16, 20], // put up the roof
  ['E', 4, ['C'], 16, 16], // install the exterior plumbing
  ['F', 5, ['E'], 20, 20], // install the interior plumbing
  ['G', 7, ['D'], 22, 26], // put up the exterior siding
  ['H', 9, ['E', 'G'], 29, 33], // do the exterior painting
  ['I', 7, ['C'], 16, 18], // do the electrical work
  ['J', 8, ['F', 'I'], 25, 25], // put up the wallboard
  ['K', 4, ['J'], 33, 34], // install the flooring
  ['L', 5, ['J'], 33, 33], // do the interior painting
  ['M', 2, ['H'], 38, 42], // install the exterior fixtures
  ['N', 6, ['K', 'L'], 38, 38], // install the interior fixtures
]
const publishedSlack: Record<string, number> = { A: 0, B: 0, C: 0, D: 4, E: 0, F: 0, G: 4, H: 4, I: 2, J: 0, K: 1, L: 0, M: 4, N: 0 }

function reliableProject(handsOn: boolean, kitchen: PlanKitchen = {}): PlanInput {
  return { steps: reliable.map(([id, weeks, after]) => ({ id, duration: weeks * WEEK, handsOn, station: null, after })), kitchen }
}

describe('critical path method: Hillier & Lieberman, the Reliable Construction Co. project', () => {
  const cpm = planCriticalPath(reliableProject(false))

  it('takes 44 weeks', () => {
    expect(cpm.length / WEEK).toBe(44)
  })
  it('has the critical path A B C E F J L N', () => {
    expect(cpm.criticalPath).toEqual(['A', 'B', 'C', 'E', 'F', 'J', 'L', 'N'])
    expect(cpm.steps.filter((s) => s.critical).map((s) => s.id)).toEqual(['A', 'B', 'C', 'E', 'F', 'J', 'L', 'N'])
  })
  it('gives every activity its published slack, and earliest and latest starts by the two passes', () => {
    for (const [id, , , es, ls] of reliable) {
      const step = cpm.steps.find((s) => s.id === id)!
      expect([id, step.earliestStart / WEEK, step.latestStart / WEEK, step.slack / WEEK]).toEqual([id, es, ls, publishedSlack[id]])
    }
  })
  it('plans steps that hold nothing (unattended, no station) exactly at their earliest starts', () => {
    const plan = planCook(reliableProject(false))
    expect(plan.makespan / WEEK).toBe(44)
    expect(plan.criticalPath).toEqual(cpm.criticalPath)
    expect(plan.bounds.criticalPath / WEEK).toBe(44)
    for (const step of plan.steps) {
      expect(step.start).toBe(step.earliestStart)
      expect(step.slack / WEEK).toBe(publishedSlack[step.id])
      expect(step.lane).toMatch(/^aside-\d+$/)
    }
  })
  it('with one crew doing every activity by hand, takes the sum of the durations, 79 weeks', () => {
    // 2+4+10+6+4+5+7+9+7+8+4+5+2+6 = 79: one pair of hands works without a break, the hands bound.
    const plan = planCook(reliableProject(true))
    expect(plan.makespan / WEEK).toBe(79)
    expect(plan.bounds.handsOn / WEEK).toBe(79)
    expect(plan.bounds.gap).toBe(0)
    expect(new Set(plan.steps.map((s) => s.lane))).toEqual(new Set(['hands-1']))
  })
  it('with two crews, is no shorter than either bound (44 weeks; 79 ÷ 2 = 39.5) and keeps every link', () => {
    const plan = planCook(reliableProject(true, { hands: 2 }))
    expect(plan.makespan).toBeGreaterThanOrEqual(44 * WEEK)
    expect(plan.bounds.handsOn / WEEK).toBe(39.5)
    const at = Object.fromEntries(plan.steps.map((s) => [s.id, s]))
    for (const [id, , after] of reliable) for (const p of after) expect(at[id]!.start).toBeGreaterThanOrEqual(at[p]!.end)
  })
})

const step = (id: string, minutes: number, handsOn: boolean, station: PlanStep['station'], extra: Partial<PlanStep> = {}): PlanStep => ({
  id,
  label: extra.label ?? id,
  duration: minutes * MIN,
  handsOn,
  station,
  ...extra,
})
const byId = (plan: ReturnType<typeof planCook>) => Object.fromEntries(plan.steps.map((s) => [s.id, s]))

describe('links', () => {
  it('finish-start with a lag: the dough rests 30 min after kneading before it is shaped', () => {
    const plan = byId(planCook({ steps: [step('knead', 10, true, 'counter'), step('shape', 5, true, 'counter', { links: [{ from: 'knead', lag: 30 * MIN }] })] }))
    expect(plan.shape!.start - plan.knead!.end).toBe(30 * MIN)
  })
  it('start-start with a lag: the stock is skimmed 5 min after it starts', () => {
    const plan = byId(planCook({ steps: [step('stock', 60, false, 'burner'), step('skim', 2, true, null, { links: [{ from: 'stock', kind: 'start-start', lag: 5 * MIN }] })] }))
    expect(plan.skim!.start - plan.stock!.start).toBe(5 * MIN)
  })
  it('finish-together: the eggs poach in the sauce for its last six minutes', () => {
    const plan = planCook({
      steps: [step('sauce', 20, false, 'burner'), step('eggs', 6, false, null, { links: [{ from: 'sauce', kind: 'finish-together' }] })],
    })
    const at = byId(plan)
    expect(at.eggs!.end).toBe(at.sauce!.end)
    expect(at.sauce!.end - at.eggs!.start).toBe(6 * MIN)
  })
  it('finish-together with a lead: the eggs are cracked in (1 min) six minutes before the sauce is done', () => {
    const at = byId(planCook({ steps: [step('sauce', 20, false, 'burner'), step('crack', 1, true, null, { links: [{ from: 'sauce', kind: 'finish-together', lag: 6 * MIN }] })] }))
    expect(at.sauce!.end - at.crack!.start).toBe(6 * MIN)
  })
  it('finish-together holds even when the kitchen pushes the pair later: the tie moves as one', () => {
    // One burner: the sauce must wait for the pasta, and the eggs go with the sauce, not before it.
    const at = byId(
      planCook({
        steps: [step('pasta', 12, false, 'burner'), step('sauce', 20, false, 'burner', { after: ['pasta'] }), step('eggs', 6, false, null, { links: [{ from: 'sauce', kind: 'finish-together' }] })],
        kitchen: { burners: 1 },
      }),
    )
    expect(at.sauce!.start).toBe(12 * MIN)
    expect(at.eggs!.end).toBe(at.sauce!.end)
  })
  it('a step tied between two partners gets a window; when a link pushes it out, the whole group moves later', () => {
    // The sauce simmers 20 min; the stir comes 5 min after the sauce starts and needs the prep (15 min)
    // done; the eggs go in after the stir and finish with the sauce. Placing the sauce at 0 leaves the
    // stir the window 5–13 min, which the prep (done at 15) misses by 2: the sauce starts at 2 instead,
    // the stir at 15, and the cook ends at 22, the shortest the links allow.
    const plan = planCook({
      steps: [
        step('prep', 15, true, 'counter'),
        step('sauce', 20, false, 'burner'),
        step('stir', 1, true, null, { after: ['prep'], links: [{ from: 'sauce', kind: 'start-start', lag: 5 * MIN }] }),
        step('eggs', 6, false, null, { after: ['stir'], links: [{ from: 'sauce', kind: 'finish-together' }] }),
      ],
    })
    const at = byId(plan)
    expect(plan.makespan).toBe(22 * MIN)
    expect(plan.bounds.criticalPath).toBe(22 * MIN)
    expect(at.sauce!.start).toBe(2 * MIN)
    expect(at.stir!.start).toBe(15 * MIN)
    expect(at.eggs!.end).toBe(at.sauce!.end)
    expect(at.eggs!.start).toBeGreaterThanOrEqual(at.stir!.end)
  })
})

describe('capacity and lanes', () => {
  it('two pots on a one-burner stove boil one after the other; on two burners, side by side', () => {
    const steps = [step('potatoes', 20, false, 'burner'), step('beans', 8, false, 'burner')]
    const one = planCook({ steps, kitchen: { burners: 1 } })
    expect(one.makespan).toBe(28 * MIN)
    const two = planCook({ steps, kitchen: { burners: 2 } })
    expect(two.makespan).toBe(20 * MIN)
    expect(new Set(two.steps.map((s) => s.lane))).toEqual(new Set(['burner-1', 'burner-2']))
  })
  it('a hands-on step at a burner holds both: its station lane and its cook', () => {
    const plan = planCook({ steps: [step('saute', 8, true, 'burner'), step('chop', 5, true, 'counter')], kitchen: { hands: 1 } })
    const at = byId(plan)
    expect(at.saute!.lane).toBe('burner-1')
    expect(at.saute!.handsLane).toBe('hands-1')
    expect(at.chop!.lane).toBe('counter-1')
    expect(plan.makespan).toBe(13 * MIN)
    expect(plan.lanes).toEqual(['hands-1', 'burner-1', 'burner-2', 'burner-3', 'burner-4', 'oven-1', 'counter-1'])
  })
  it('ovens: one dish per oven by default; two racks take two trays at once; two ovens, one each', () => {
    const steps = [step('bread', 35, false, 'oven'), step('roots', 40, false, 'oven')]
    expect(planCook({ steps }).makespan).toBe(75 * MIN)
    const racks = planCook({ steps, kitchen: { racksPerOven: 2 } })
    expect(racks.makespan).toBe(40 * MIN)
    expect(racks.steps.map((s) => [s.lane, s.rack])).toEqual([['oven-1', 1], ['oven-1', 2]])
    const ovens = planCook({ steps, kitchen: { ovens: 2, racksPerOven: 2 } })
    expect(ovens.steps.map((s) => [s.lane, s.rack])).toEqual([['oven-1', 1], ['oven-2', 1]])
  })
  it('overlaps the waits: the water boils while the onion is chopped and fried', () => {
    const plan = planCook({
      steps: [
        step('water', 10, false, 'burner', { label: 'Bring the pasta water to the boil' }),
        step('pasta', 9, false, 'burner', { after: ['water'], label: 'Cook the pasta' }),
        step('onion', 5, true, 'counter', { label: 'Chop the onion' }),
        step('fry', 8, true, 'burner', { after: ['onion'], label: 'Soften the onion' }),
      ],
      kitchen: { hands: 1, burners: 2 },
    })
    // Critical path water → pasta, 19 min; hands-on work 13 min: the waits hide behind the work.
    expect(plan.makespan).toBe(19 * MIN)
    expect(plan.bounds).toMatchObject({ criticalPath: 19 * MIN, handsOn: 13 * MIN, lower: 19 * MIN, gap: 0 })
  })
  it('one recipe at a time: the recipes do not overlap, and follow the links between them', () => {
    const steps = [
      step('dress', 3, true, 'counter', { recipe: 'salad', after: ['roast'] }),
      step('leaves', 4, true, 'counter', { recipe: 'salad' }),
      step('roast', 30, false, 'oven', { recipe: 'chicken' }),
      step('rest', 10, false, null, { recipe: 'chicken', after: ['roast'] }),
    ]
    const apart = byId(planCook({ steps, kitchen: { parallelRecipes: false } }))
    // The salad's dressing needs the roast's juices, so the chicken goes first, whole.
    const chickenEnd = Math.max(apart.roast!.end, apart.rest!.end)
    expect(Math.min(apart.dress!.start, apart.leaves!.start)).toBeGreaterThanOrEqual(chickenEnd)
    const together = planCook({ steps, kitchen: { parallelRecipes: true } })
    expect(together.makespan).toBeLessThan(Math.max(...Object.values(apart).map((s) => s.end)))
  })
})

describe('cues for the prompter', () => {
  it('names, for every unattended step, the moment to start it and the hands-on step under way', () => {
    const plan = planCook({
      steps: [
        step('onion', 5, true, 'counter', { label: 'Chop the onion', recipe: 'sauce' }),
        step('water', 10, false, 'burner', { label: 'Bring the pasta water to the boil', recipe: 'pasta' }),
        step('pasta', 9, false, 'burner', { after: ['water'], label: 'Cook the pasta', recipe: 'pasta' }),
        step('fry', 8, true, 'burner', { after: ['onion'], label: 'Soften the onion', recipe: 'sauce' }),
      ],
      kitchen: { hands: 1, burners: 2 },
    })
    expect(plan.cues.map((c) => c.stepId)).toEqual(['water', 'pasta'])
    const water = plan.cues[0]!
    expect(water).toMatchObject({ at: 0, endsAt: 10 * MIN, during: 'onion' })
    expect(water.text).toBe('While “Chop the onion”: start “Bring the pasta water to the boil”.')
    const pasta = plan.cues[1]!
    expect(pasta.at).toBe(byId(plan).water!.end)
    expect(pasta.during).toBe('fry')
  })
  it('says so when the hands are free', () => {
    const plan = planCook({ steps: [step('oven', 15, false, 'oven', { label: 'Heat the oven' })] })
    expect(plan.cues).toEqual([{ stepId: 'oven', at: 0, endsAt: 15 * MIN, during: null, text: 'Start “Heat the oven” now; hands are free.' }])
  })
})

describe('refusals', () => {
  const refusal = (input: PlanInput): PlanError => {
    try {
      planCook(input)
    } catch (error) {
      expect(error).toBeInstanceOf(PlanError)
      return error as PlanError
    }
    throw new Error('planCook accepted a plan it should refuse')
  }

  it('a circle of links: names the steps on it, and only those', () => {
    const error = refusal({
      steps: [step('a', 1, true, null), step('b', 1, true, null, { after: ['a', 'd'] }), step('c', 1, true, null, { after: ['b'] }), step('d', 1, true, null, { after: ['c'] })],
    })
    expect(error.code).toBe('cycle')
    expect([...error.stepIds].sort()).toEqual(['b', 'c', 'd'])
    expect(error.message).toMatch(/circle/)
  })
  it('a step that waits for itself', () => {
    expect(refusal({ steps: [step('a', 1, true, null, { after: ['a'] })] })).toMatchObject({ code: 'cycle', stepIds: ['a'] })
  })
  it('a station the kitchen lacks: every step that needs it', () => {
    const error = refusal({ steps: [step('bake', 30, false, 'oven', { label: 'Bake the tart' }), step('chill', 30, false, null), step('roast', 30, false, 'oven')], kitchen: { ovens: 0 } })
    expect(error).toMatchObject({ code: 'missing-station', stepIds: ['bake', 'roast'] })
    expect(error.message).toContain('“Bake the tart”')
    expect(refusal({ steps: [step('fry', 3, true, 'burner')], kitchen: { burners: 0 } }).code).toBe('missing-station')
    expect(refusal({ steps: [step('plate', 3, true, 'counter')], kitchen: { counters: 0 } }).code).toBe('missing-station')
    expect(refusal({ steps: [step('chop', 3, true, null)], kitchen: { hands: 0 } }).code).toBe('missing-station')
  })
  it('a lead longer than the step it goes into', () => {
    const error = refusal({ steps: [step('sauce', 5, false, 'burner'), step('eggs', 6, false, null, { links: [{ from: 'sauce', kind: 'finish-together' }] })] })
    expect(error).toMatchObject({ code: 'impossible-lag', stepIds: ['sauce', 'eggs'] })
    expect(error.message).toContain('lasts only 5 min')
  })
  it('a lead shorter than the step, which would then outlast its partner', () => {
    expect(refusal({ steps: [step('sauce', 20, false, 'burner'), step('eggs', 6, false, null, { links: [{ from: 'sauce', kind: 'finish-together', lag: 4 * MIN }] })] }).code).toBe('impossible-lag')
  })
  it('links that cannot all be met: the eggs finish with the sauce but must also wait for a step after the sauce', () => {
    const error = refusal({
      steps: [step('sauce', 20, false, 'burner'), step('taste', 2, true, null, { after: ['sauce'] }), step('eggs', 6, false, null, { after: ['taste'], links: [{ from: 'sauce', kind: 'finish-together' }] }), step('bread', 5, true, 'counter')],
    })
    expect(error.code).toBe('impossible-lag')
    expect([...error.stepIds].sort()).toEqual(['eggs', 'sauce', 'taste'])
  })
  it('tied steps that need the one burner at the same moment', () => {
    const error = refusal({ steps: [step('sauce', 20, false, 'burner'), step('greens', 4, false, 'burner', { links: [{ from: 'sauce', kind: 'finish-together' }] })], kitchen: { burners: 1 } })
    expect(error).toMatchObject({ code: 'impossible-lag' })
    expect([...error.stepIds].sort()).toEqual(['greens', 'sauce'])
    expect(error.message).toContain('burner')
  })
  it('a finish-together link across recipes in a kitchen that cooks one recipe at a time', () => {
    const error = refusal({
      steps: [step('sauce', 20, false, 'burner', { recipe: 'shakshuka' }), step('bread', 6, false, 'oven', { recipe: 'flatbread', links: [{ from: 'sauce', kind: 'finish-together' }] })],
      kitchen: { parallelRecipes: false },
    })
    expect(error.code).toBe('impossible-lag')
    expect(error.message).toMatch(/one recipe at a time/)
  })
  it('recipes that wait for each other in a kitchen that cooks one recipe at a time', () => {
    const error = refusal({
      steps: [step('a1', 5, true, null, { recipe: 'A' }), step('b1', 5, true, null, { recipe: 'B', after: ['a1'] }), step('a2', 5, true, null, { recipe: 'A', after: ['b1'] })],
      kitchen: { parallelRecipes: false },
    })
    expect(error.code).toBe('cycle')
    expect(error.message).toMatch(/recipes/)
  })
  it('bad input, each with a message that says what to fix', () => {
    const cases: [PlanInput, RegExp, string[]][] = [
      [{ steps: [step('a', 1, true, null), step('a', 2, true, null)] }, /share the id/, ['a']],
      [{ steps: [step('a', 1, true, null, { after: ['ghost'] })] }, /“ghost”, which is not a step/, ['a']],
      [{ steps: [{ id: 'a', duration: -5, handsOn: true, station: null }] }, /duration of zero or more/, ['a']],
      [{ steps: [{ id: 'a', duration: Number.NaN, handsOn: true, station: null }] }, /duration/, ['a']],
      [{ steps: [{ id: 'a', duration: 5, handsOn: 'yes' as unknown as boolean, station: null }] }, /hands-on or unattended/, ['a']],
      [{ steps: [{ id: 'a', duration: 5, handsOn: true, station: 'grill' as never }] }, /unknown station “grill”/, ['a']],
      [{ steps: [{ id: 'a', duration: 5, handsOn: true, station: 'toString' as never }] }, /unknown station/, ['a']],
      [{ steps: [step('a', 1, true, null), step('b', 1, true, null, { links: [{ from: 'a', lag: -60 }] })] }, /zero or more seconds/, ['a', 'b']],
      [{ steps: [step('a', 1, true, null), step('b', 1, true, null, { links: [{ from: 'a', kind: 'sideways' as never }] })] }, /unknown kind/, ['b']],
      [{ steps: [step('a', 1, true, null)], kitchen: { burners: 2.5 } }, /^Burners: write a whole number of zero or more/, []],
      [{ steps: 'soup' as never }, /list of steps/, []],
    ]
    for (const [input, message, stepIds] of cases) {
      const error = refusal(input)
      expect([error.code, error.stepIds]).toEqual(['bad-input', stepIds])
      expect(error.message).toMatch(message)
    }
  })
})

describe('behaviour', () => {
  it('gives the same plan for the same input, and leaves the input as it was', () => {
    const input: PlanInput = {
      steps: [
        step('a', 4, true, 'counter'),
        step('b', 7, false, 'burner', { after: ['a'] }),
        step('c', 3, true, 'burner'),
        step('d', 5, true, null, { links: [{ from: 'b', kind: 'start-start', lag: 60 }] }),
        step('e', 9, false, 'oven', { after: ['c'] }),
      ],
      kitchen: { hands: 1, burners: 1 },
    }
    const copy = structuredClone(input)
    expect(planCook(input)).toEqual(planCook(copy))
    expect(input).toEqual(copy)
  })
  it('plans an empty episode as nothing', () => {
    expect(planCook({ steps: [] })).toMatchObject({ makespan: 0, steps: [], criticalPath: [], cues: [] })
  })
  it('keeps times to the millisecond: fractional seconds add up exactly', () => {
    const plan = planCook({ steps: [step('a', 0.1 / MIN, true, null), step('b', 0.2 / MIN, true, null, { after: ['a'] })] })
    expect(plan.makespan).toBe(0.3)
    expect(plan.steps[1]!.critical).toBe(true)
  })
})

describe('exhaustive search (plan-exact.ts), worked by hand', () => {
  it('finds the optimum of a one-cook, one-burner case', () => {
    // One cook, one burner. fry (hands, burner, 5) then simmer (burner, 10); chop (hands, 6) then
    // boil (burner, 4). The burner's work, 5 + 10 + 4 = 19 min, bounds every plan, and fry 0–5,
    // simmer 5–15, chop 5–11, boil 15–19 reaches it. Any other order idles the burner: chopping
    // first leaves it empty for the first 6 min (≥ 25), and boiling before the simmer delays the
    // simmer to 15 (25).
    const input: PlanInput = {
      steps: [step('fry', 5, true, 'burner'), step('simmer', 10, false, 'burner', { after: ['fry'] }), step('chop', 6, true, null), step('boil', 4, false, 'burner', { after: ['chop'] })],
      kitchen: { hands: 1, burners: 1 },
    }
    const best = planCookExhaustive(input)
    expect(best.makespan).toBe(19 * MIN)
    expect(best.starts).toEqual({ fry: 0, simmer: 5 * MIN, chop: 5 * MIN, boil: 15 * MIN })
    expect(planCook(input).makespan).toBe(19 * MIN)
  })
  it('refuses what it does not cover', () => {
    expect(() => planCookExhaustive({ steps: Array.from({ length: 10 }, (_, i) => step(`s${i}`, 1, true, null)) })).toThrow(/at most 9 steps/)
  })
})
