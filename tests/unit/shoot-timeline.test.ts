// The control desk's timeline (shared/utils/shoot-timeline.ts) read from a shoot running the cook
// plan: bars where the live plan has each step beside where the first plan put it, the hands-on step
// that will wait, the now-line and both finishes. The scheduler and the re-planning are checked
// against their published sources in plan.test.ts and plan-replan.test.ts; the kitchen here is small
// enough to work every time by hand, in the comment beside it.
import { describe, expect, it } from 'vitest'
import type { ShootActor, ShootPlanStep, ShootState } from '../../shared/types/shoot'
import { createShootState } from '../../shared/utils/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'
import { planShootRun } from '../../shared/utils/shoot-plan'
import { shootTimeline, shootTimelineBarLines } from '../../shared/utils/shoot-timeline'
import { planLaneName } from '../../shared/utils/plan-lanes'

const T0 = 1_770_000_000_000
const MIN = 60_000
const PRODUCER: ShootActor = { role: 'producer', id: 'user:1' }
const PASTA = { recipe: 'pasta', recipeTitle: 'Pasta with greens', station: null, name: null, minMs: null, after: [] as string[] }
// The water boils 8–10 min on a burner; the greens are washed and chopped (12 min, by hand); the
// pasta is drained (2 min) once the water is done. The cook's hands are on the greens when the water
// is ready at 10:00, so draining waits until 12:00 and the cook ends at 14:00.
const STEPS: ShootPlanStep[] = [
  { ...PASTA, id: 'water', label: 'Boil the water', name: 'Pasta water', duration: 600, handsOn: false, station: 'burner', minMs: 8 * MIN, maxMs: 10 * MIN },
  { ...PASTA, id: 'greens', label: 'Wash and chop the greens', duration: 720, handsOn: true, maxMs: null },
  { ...PASTA, id: 'drain', label: 'Drain the pasta', duration: 120, handsOn: true, maxMs: null, after: ['water'] },
]

function started(): ShootState {
  const { runOrder, plan } = planShootRun(
    [{ segmentId: 'segment-1', recipeId: 'pasta', title: 'Pasta with greens', stepIds: ['water', 'greens', 'drain'] }],
    STEPS, { hands: 1, burners: 1, ovens: 1, racksPerOven: 1, parallelRecipes: true },
  )
  return apply(createShootState({ id: 'shoot-3', mode: 'rehearsal', runOrder, plan }), { type: 'shoot.start' }, 0)
}
function apply(s: ShootState, command: unknown, at: number): ShootState {
  const r = applyShootCommand(s, command, { nowServerMs: T0 + at, actor: PRODUCER })
  if (!r.ok) throw new Error(`${JSON.stringify(command)}: ${r.error.message}`)
  return r.state
}
const bar = (s: ShootState, at: number, id: string) => shootTimeline(s, T0 + at)!.bars.find((b) => b.stepId === id)!

describe('the desk timeline', () => {
  it('draws the first plan with its lanes, the now-line, and the step that will wait', () => {
    const s = started()
    const t = shootTimeline(s, T0 + 90_000)!
    expect(t.lanes.map((l) => planLaneName(l, t.lanes))).toEqual(expect.arrayContaining(['Hands', 'Burner']))
    // 1:30 in at 1×: the now-line is at 90 s; planned and projected finish 14:00, worked above.
    expect(t).toMatchObject({ nowMs: 90_000, plannedMs: 14 * MIN, projectedMs: 14 * MIN, spanMs: 14 * MIN })
    expect(bar(s, 0, 'water')).toMatchObject({ lane: 'burner-1', startMs: 0, endMs: 10 * MIN, first: { startMs: 0, endMs: 10 * MIN }, label: 'Pasta water' })
    expect(bar(s, 0, 'drain')).toMatchObject({ lane: 'hands-1', startMs: 12 * MIN, endMs: 14 * MIN, state: 'pending' })
    // Draining falls due at 10:00 and waits 2 min for the cook's hands: the collision is on its bar.
    expect(bar(s, 0, 'drain').collision).toMatchObject({ stepId: 'drain', dueMs: 10 * MIN, startMs: 12 * MIN, waitMs: 2 * MIN })
    expect(shootTimelineBarLines(bar(s, 0, 'drain'))).toEqual([
      'Drain the pasta (Pasta with greens)',
      'Projected: 12:00 to 14:00',
      'First plan: 12:00 to 14:00 (on time)',
      'Hands-on',
      `Will wait: ${bar(s, 0, 'drain').collision!.text}`,
    ])
  })

  it('shows what happened where it happened, against the first plan, and the finish moving', () => {
    let s = started()
    // Walk to the greens, then leave them 3 min late (15:00 instead of 12:00): draining runs 15–17.
    while (s.runOrder[0]!.stepIds[s.cursor.step] !== 'greens') s = apply(s, { type: 'step.next' }, 0)
    s = apply(s, { type: 'step.next' }, 15 * MIN)
    const greens = bar(s, 15 * MIN, 'greens')
    expect(greens).toMatchObject({ state: 'done', startMs: 0, endMs: 15 * MIN, first: { startMs: 0, endMs: 12 * MIN } })
    expect(bar(s, 15 * MIN, 'drain')).toMatchObject({ state: 'running', startMs: 15 * MIN, endMs: 17 * MIN, collision: null })
    expect(shootTimelineBarLines(bar(s, 15 * MIN, 'drain')).slice(1, 3)).toEqual(['Running since 15:00, to 17:00', 'First plan: 12:00 to 14:00 (3:00 later)'])
    expect(shootTimeline(s, T0 + 15 * MIN)).toMatchObject({ plannedMs: 14 * MIN, projectedMs: 17 * MIN, spanMs: 17 * MIN })
    // Past the projected finish, the axis runs to now.
    expect(shootTimeline(s, T0 + 20 * MIN)!.spanMs).toBe(20 * MIN)
  })

  it('has nothing to draw for a shoot without a live plan', () => {
    const s = createShootState({ id: 'shoot-4', mode: 'take', runOrder: [{ id: 'segment-1', stepIds: ['a'] }] })
    expect(shootTimeline(s, T0)).toBeNull()
  })
})
