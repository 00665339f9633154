// The shoot runs the cook plan, end to end over the built server: the run order of a new shoot is
// the plan route's order of starts (for the demo episode and for a generated one), reaching a wait
// starts its timer by itself with the step's time, and every screen gets the same re-planned starts
// after a late step. The planner's own arithmetic is checked in tests/unit/plan*.test.ts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import type { ShootState } from '../../shared/types/shoot'
import { shootClockAt } from '../../shared/utils/shoot-clock'
import { useBuiltApp } from '../support/app'
import { demo, signedIn, type Client } from '../support/client'
import { connect, emitAck, waitFor, type TestSocket } from '../support/sockets'

type PlanRoute = {
  makespan: number
  steps: Array<{ stepId: number; start: number; end: number; handsOn: boolean; recipeId: number; durationMin: number | null; durationMax: number | null }>
}

/** Where the cooking is in a shoot's run order: the one segment with steps. */
const cookIndex = (state: Pick<ShootState, 'runOrder'>) => state.runOrder.findIndex((s) => s.stepIds.length > 0)

/** The plan's order of starts, as the host meets them: by start; a wait first at the same moment; then the episode's written order. */
function planOrder(plan: PlanRoute, written: number[]): string[] {
  const pos = new Map(written.map((id, i) => [id, i]))
  return [...plan.steps]
    .sort((a, b) => a.start - b.start || Number(a.handsOn) - Number(b.handsOn) || pos.get(a.stepId)! - pos.get(b.stepId)!)
    .map((s) => String(s.stepId))
}

describe('the shoot runs the cook plan', async () => {
  await useBuiltApp()
  let producer: Client
  let episodeId: number
  const sockets: TestSocket[] = []
  afterAll(() => sockets.forEach((s) => s.disconnect()))

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    const list = await producer.get('/api/studios/1/episodes')
    episodeId = list.body.episodes.find((e: { title: string }) => e.title === 'Thursday supper special').id
  })

  async function writtenOrder(id: number): Promise<number[]> {
    const episode = (await producer.get(`/api/episodes/${id}`)).body
    const out: number[] = []
    for (const seg of episode.segments) {
      if (!seg.recipeId) continue
      out.push(...(await producer.get(`/api/recipes/${seg.recipeId}`)).body.steps.map((s: { id: number }) => s.id))
    }
    return out
  }

  async function agree(id: number) {
    const plan = (await producer.get(`/api/episodes/${id}/plan`)).body as PlanRoute
    const shoot = await producer.post(`/api/episodes/${id}/shoots`, { mode: 'rehearsal' })
    expect(shoot.status).toBe(201)
    const state = shoot.body.state as ShootState
    // Side by side (the demo kitchen): one cooking segment, the plan's order of starts; segments
    // without steps (intro, sponsor read, outro) keep places of their own around it.
    expect(state.runOrder.filter((s) => s.stepIds.length)).toHaveLength(1)
    expect(state.runOrder[cookIndex(state)]!.stepIds).toEqual(planOrder(plan, await writtenOrder(id)))
    // The same plan: every step's planned start, and the makespan.
    expect(state.plan!.first!.makespanMs).toBe(Math.round(plan.makespan * 1000))
    for (const s of plan.steps) expect(state.plan!.first!.steps[String(s.stepId)]!.startMs).toBe(Math.round(s.start * 1000))
    return { plan, shoot: shoot.body as ShootSnapshot }
  }

  it('the demo episode: the shoot\'s run order is the plan route\'s order of starts, one segment with the recipes interleaved', async () => {
    const { plan, shoot } = await agree(episodeId)
    // The demo show: the intro before the cooking; the sponsor read (between recipes in the episode) and the sign-off after it.
    expect(shoot.state.runOrder.map((s) => s.title)).toEqual([
      'Welcome', 'Smoky butter bean and tomato stew, Pan flatbreads with mint yoghurt and Roast squash with lentils and tahini',
      'A word from Kettlebrook Pans', 'Sign-off',
    ])
    expect(shoot.state.plan!.source).toEqual({ kind: 'plan', sideBySide: true })
    // Recipes interleave: not all of one recipe's steps before the next recipe's.
    const recipeOf = new Map(plan.steps.map((s) => [String(s.stepId), s.recipeId]))
    const recipes = shoot.state.runOrder[cookIndex(shoot.state)]!.stepIds.map((id) => recipeOf.get(id))
    const changes = recipes.filter((r, i) => i > 0 && r !== recipes[i - 1]).length
    expect(changes).toBeGreaterThan(2)
    // The screens' script carries the plan's times and each step's recipe.
    for (const s of plan.steps) {
      expect(shoot.steps[String(s.stepId)]).toMatchObject({ recipeId: s.recipeId, plannedStartMs: Math.round(s.start * 1000) })
    }
  })

  it('a generated episode agrees too (random waits, burners and links, seeded)', async () => {
    const stepArb = fc.record({
      handsOn: fc.boolean(),
      minutes: fc.integer({ min: 1, max: 25 }),
      spread: fc.integer({ min: 0, max: 5 }),
      station: fc.constantFrom(null, 'burner', 'counter'),
      follows: fc.boolean(),
    })
    const recipesArb = fc.array(fc.array(stepArb, { minLength: 1, maxLength: 5 }), { minLength: 2, maxLength: 3 })
    const [recipes] = fc.sample(recipesArb, { seed: 1202, numRuns: 1 })
    const ids: number[] = []
    for (const [r, steps] of recipes!.entries()) {
      const made = await producer.post('/api/studios/1/recipes', {
        title: `Generated dish ${r + 1}`, servings: 4,
        steps: steps.map((s, i) => ({
          text: `Step ${i + 1} of dish ${r + 1}`, handsOn: s.handsOn, station: s.station,
          durationMin: s.minutes * 60, durationMax: (s.minutes + s.spread) * 60,
          after: i > 0 && s.follows ? [i] : [],
        })),
      })
      expect(made.status, JSON.stringify(made.body)).toBe(201)
      ids.push(made.body.id)
    }
    const episode = await producer.post('/api/studios/1/episodes', { title: 'Generated episode', recipeIds: ids })
    expect(episode.status).toBe(201)
    await agree(episode.body.id)
  })

  /** A new rehearsal of the demo episode with the host and the producer on sockets; `send` applies a
   * host command and returns the message every screen got for it (the host's, the producer's). */
  async function rehearsal() {
    const made = await producer.post(`/api/episodes/${episodeId}/shoots`, { mode: 'rehearsal' })
    const shootId = made.body.shoot.id as number
    const host = await connect(await signedIn(demo.host))
    const camera = await connect(producer)
    sockets.push(host, camera)
    for (const s of [host, camera]) expect((await emitAck(s, 'shoot:join', { shootId })).ok).toBe(true)
    // These checks are about the cooking: the shoot starts there, past the intro.
    const ready = made.body.state as ShootState
    expect((await emitAck(host, 'shoot:command', { shootId, type: 'step.jump', segment: cookIndex(ready), step: 0 })).ok).toBe(true)
    const send = async (command: object) => {
      const ack = await emitAck<{ ok: boolean; seq: number }>(host, 'shoot:command', { shootId, ...command })
      expect(ack.ok, JSON.stringify(ack)).toBe(true)
      await waitFor(() => host.received.some((m) => m.seq === ack.seq) && camera.received.some((m) => m.seq === ack.seq))
      return [host.received.find((m) => m.seq === ack.seq)!, camera.received.find((m) => m.seq === ack.seq)!] as const
    }
    return { shootId, plan: (made.body.state as ShootState).plan!, send, camera }
  }

  it('advancing through the script starts each wait\'s timer by itself, with the step\'s time and the deadline it gives', async () => {
    const { plan, send: sendBoth } = await rehearsal()
    const send = async (command: object) => ({ mine: (await sendBoth(command))[0] })
    const waits = plan.steps.filter((s) => !s.handsOn && (s.maxMs ?? s.minMs) !== null)
    expect(waits.length).toBeGreaterThan(2)

    let message = (await send({ type: 'shoot.start' })).mine
    const cook = cookIndex(message.state)
    expect(message.state.cursor).toEqual({ segment: cook, step: 0 })
    const order = message.state.runOrder[cook]!.stepIds
    const started = new Set<string>()
    const checkWaits = () => {
      for (const t of message.state.timers.filter((x) => x.origin === 'step' && !started.has(x.stepRef.stepId!))) {
        const step = waits.find((w) => w.id === t.stepRef.stepId)!
        // Named after the step and its recipe, the long end of its range, checked at the short end.
        expect(t.label).toContain(step.recipeTitle.slice(0, 10))
        expect(t.durationMs).toBe(step.maxMs ?? step.minMs)
        expect(t.checkLeftMs).toBe(step.minMs !== null && step.maxMs !== null && step.minMs < step.maxMs ? step.maxMs - step.minMs : null)
        // The deadline: the moment of the command plus the kitchen time at the rehearsal's speed.
        expect(t.deadlineServerMs).toBe(t.startedAtServerMs + t.durationMs / message.state.clock.speed)
        expect(t.startedAtServerMs).toBe(message.serverNow)
        started.add(t.stepRef.stepId!)
      }
    }
    checkWaits()
    // Walk the script: every beat reached that is a timed wait has its timer, started when it was reached.
    for (let i = 1; i < order.length; i++) {
      message = (await send({ type: 'step.next' })).mine
      checkWaits()
      const here = message.state.runOrder[cook]!.stepIds[message.state.cursor.step]!
      if (waits.some((w) => w.id === here)) expect(started.has(here)).toBe(true)
      if (message.state.cursor.step === order.length - 1) break
    }
    expect([...started].sort()).toEqual(waits.map((w) => w.id).sort())
  })

  it('a hands-on step 3 minutes late: every screen gets the same new plan, what depends on it moves by 3 minutes', async () => {
    const { shootId, plan: first, send, camera } = await rehearsal()
    // 32×: three kitchen minutes are 5.6 real seconds.
    await emitAck(camera, 'shoot:command', { shootId, type: 'clock.speed', speed: 32 })
    let [mine] = await send({ type: 'shoot.start' })
    const order = mine.state.runOrder[cookIndex(mine.state)]!.stepIds
    // Go to the first hands-on beat.
    const handsOn = new Set(first.steps.filter((s) => s.handsOn).map((s) => s.id))
    while (!handsOn.has(order[mine.state.cursor.step]!)) [mine] = await send({ type: 'step.next' })
    const stepId = order[mine.state.cursor.step]!
    const plannedEnd = mine.state.plan!.live!.steps[stepId]!.endMs
    // Stay until 3 kitchen minutes after its planned end, then move on.
    const lateBy = 3 * 60_000
    const target = plannedEnd + lateBy
    while (shootClockAt(mine.state.clock, Date.now()) < target) await new Promise((r) => setTimeout(r, 20))
    const before = mine.state.plan!.live!
    const [after, theirs] = await send({ type: 'step.next' })
    // The same plan on every screen.
    expect(theirs.state.plan).toEqual(after.state.plan)
    const live = after.state.plan!.live!
    const leftAt = live.steps[stepId]!.endMs
    // Left within a second (kitchen time at 32×, plus the round trip) of 3 minutes late.
    expect(Math.abs(leftAt - target)).toBeLessThan(32 * 250)
    // The steps that follow it directly start when it was left: moved by the lateness.
    const dependents = first.steps.filter((s) => (s.links ?? []).some((l) => l.from === stepId && (l.kind ?? 'finish-start') === 'finish-start'))
    expect(dependents.length).toBeGreaterThan(0)
    for (const d of dependents) {
      expect(live.steps[d.id]!.startMs).toBeGreaterThanOrEqual(leftAt)
      if (before.steps[d.id]!.startMs < leftAt) expect(live.steps[d.id]!.movedMs).toBeGreaterThan(0)
    }
    // Waits already running keep their deadlines.
    for (const t of after.state.timers.filter((x) => x.state === 'running')) {
      expect(t.deadlineServerMs).toBe(mine.state.timers.find((x) => x.id === t.id)?.deadlineServerMs ?? t.deadlineServerMs)
    }
    // The projected finish moved later.
    expect(live.makespanMs).toBeGreaterThan(before.makespanMs)
  })
})
