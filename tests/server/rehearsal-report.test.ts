// The rehearsal report over the built app: a recipe of three steps (chop 2 min, simmer 1–1.5 min on
// a burner, season 1 min; one cook, so the plan is the chain 0–2, 2–3:30, 3:30–4:30, makespan 270 s)
// rehearsed twice at 32× through the commands route. Each actual must be 32 × the real time the test
// measured between its own commands (shoot-clock.ts), within the requests' latency; the suggested
// range gathers both rehearsals. Adopting writes it into the recipe's steps over the recipe's version
// (a stale version is refused and nothing is written), the cook plan's makespan follows, undo puts
// the ranges back; only the producer may do either, refusals in the one error shape.
import { beforeAll, describe, expect, it } from 'vitest'
import { suggestedRange } from '../../shared/utils/rehearsal-report'
import { useBuiltApp } from '../support/app'
import { type Client, demo, signedIn } from '../support/client'

const SPEED = 32
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))
type Step = { id: number; durationMin: number | null; durationMax: number | null }
type ReportStep = {
  stepId: string; label: string; actualMs: number | null; source: string | null; overMs: number | null
  suggested: { min: number; max: number; rehearsals: number } | null
}

describe('the rehearsal report', async () => {
  await useBuiltApp()
  let producer: Client
  let host: Client
  let viewer: Client
  let recipeId: number
  let episodeId: number
  let stepIds: number[]
  /** Real ms the test measured around each stretch, per rehearsal: [low, high] bounds. */
  const measured: Array<Record<string, [number, number]>> = []
  const shoots: number[] = []

  async function rehearse(chopMs: number, waitForSimmer: boolean) {
    const created = await producer.post(`/api/episodes/${episodeId}/shoots`, { mode: 'rehearsal' })
    expect(created.status).toBe(201)
    const id: number = created.body.shoot.id
    shoots.push(id)
    const send = async (data: Record<string, unknown>) => {
      const before = Date.now()
      const r = await producer.post(`/api/shoots/${id}/commands`, data)
      expect(r.status, `${JSON.stringify(data)}: ${JSON.stringify(r.body)}`).toBe(200)
      return [before, Date.now()] as const
    }
    await send({ type: 'clock.speed', speed: SPEED })
    const start = await send({ type: 'shoot.start' }) // chop
    await sleep(chopMs)
    const next1 = await send({ type: 'step.next' }) // simmer: its timer starts
    const next2 = await send({ type: 'step.next' }) // season
    const times: Record<string, [number, number]> = {
      // A stretch runs from a command's arrival to the next's: between [after first sent… wait] bounds.
      chop: [next1[0] - start[1], next1[1] - start[0]],
    }
    if (waitForSimmer) {
      await sleep(3200) // 90 s of kitchen time is 2.8 s at 32×: it has rung
      const snapshot = (await producer.get(`/api/shoots/${id}`)).body
      const timer = snapshot.state.timers.find((t: { origin: string; stepRef: { stepId: string } }) => t.origin === 'step' && t.stepRef.stepId === String(stepIds[1]))
      expect(timer.state).toBe('due')
      const done = await send({ type: 'timer.acknowledge', timerId: timer.id })
      times.simmer = [done[0] - next1[1], done[1] - next1[0]]
      await sleep(800)
    }
    const end = await send({ type: 'shoot.end', cancelTimers: true })
    times.season = [end[0] - next2[1], end[1] - next2[0]]
    measured.push(times)
    return id
  }

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    host = await signedIn(demo.host)
    viewer = await signedIn(demo.viewer)
    const recipe = await producer.post('/api/studios/1/recipes', {
      title: 'Report test leek broth', servings: 2, steps: [
        { name: 'Leek', text: 'Wash and chop the leek.', handsOn: true, durationMin: null, durationMax: 120, station: 'counter' },
        { name: 'Broth', text: 'Simmer the leek in the stock.', handsOn: false, durationMin: 60, durationMax: 90, station: 'burner' },
        { name: 'Season', text: 'Season and ladle into bowls.', handsOn: true, durationMin: null, durationMax: 60, station: 'counter' },
      ],
    })
    expect(recipe.status).toBe(201)
    recipeId = recipe.body.id
    stepIds = recipe.body.steps.map((s: { id: number }) => s.id)
    const episode = await producer.post('/api/studios/1/episodes', { title: 'Report test night', recipeIds: [recipeId] })
    expect(episode.status).toBe(201)
    episodeId = episode.body.id
    await rehearse(5000, true) // chop ≈ 160 s of kitchen time
    await rehearse(2500, false) // chop ≈ 80 s; simmer's timer cancelled at the end: not measured
  }, 60_000)

  const within = (actualMs: number, [lo, hi]: [number, number]) => {
    expect(actualMs).toBeGreaterThanOrEqual(lo * SPEED - 1)
    expect(actualMs).toBeLessThanOrEqual(hi * SPEED + 1)
  }

  it('gives each step\'s actual in kitchen time: 32 × the real time, by the timer for the wait', async () => {
    const res = await viewer.get(`/api/shoots/${shoots[0]}/report`)
    expect(res.status).toBe(200)
    const by = Object.fromEntries(res.body.steps.map((s: ReportStep) => [s.label, s])) as Record<string, ReportStep>
    expect(Object.keys(by)).toEqual(['Leek', 'Broth', 'Season'])
    within(by.Leek!.actualMs!, measured[0]!.chop!)
    within(by.Broth!.actualMs!, measured[0]!.simmer!)
    within(by.Season!.actualMs!, measured[0]!.season!)
    expect([by.Leek!.source, by.Broth!.source, by.Season!.source]).toEqual(['cursor', 'timer', 'cursor'])
    // Over = actual − the long end: 120 s, 90 s, 60 s.
    expect(by.Leek!.overMs).toBe(by.Leek!.actualMs! - 120_000)
    expect(by.Season!.overMs).toBe(by.Season!.actualMs! - 60_000)
    const over = res.body.overruns.map((s: ReportStep) => s.overMs)
    expect(over).toEqual([...over].sort((a: number, b: number) => b - a))
    expect(res.body.plannedMakespanMs).toBe(270_000)
    expect(res.body.segments).toHaveLength(1)
    expect(res.body.segments[0].plannedMs).toBe(270_000)
  })

  it('suggests a range from both rehearsals, saying how many measured each step', async () => {
    const one = (await viewer.get(`/api/shoots/${shoots[0]}/report`)).body
    const two = (await viewer.get(`/api/shoots/${shoots[1]}/report`)).body
    expect(two.rehearsals).toBe(2)
    const stepsOf = (r: { steps: ReportStep[] }) => Object.fromEntries(r.steps.map((s) => [s.label, s])) as Record<string, ReportStep>
    const [a, b] = [stepsOf(one), stepsOf(two)]
    within(b.Leek!.actualMs!, measured[1]!.chop!)
    expect(b.Broth!.actualMs).toBeNull() // its timer was cancelled
    expect(b.Leek!.suggested).toEqual(suggestedRange([a.Leek!.actualMs!, b.Leek!.actualMs!]))
    expect(b.Leek!.suggested!.rehearsals).toBe(2)
    expect(b.Broth!.suggested).toEqual({ ...suggestedRange([a.Broth!.actualMs!]), rehearsals: 1 })
    // The same suggestion from either report: it is the recipe's, not the shoot's.
    expect(a.Leek!.suggested).toEqual(b.Leek!.suggested)
    expect(one.rule).toMatch(/shortest to the longest/)
  })

  it('adopts the actuals over the recipe\'s version, moves the plan, and undoes', async () => {
    const report = (await producer.get(`/api/shoots/${shoots[1]}/report`)).body
    const before = (await producer.get(`/api/recipes/${recipeId}`)).body
    expect((await producer.get(`/api/episodes/${episodeId}/plan`)).body.makespan).toBe(270)
    const versions = report.recipes.map((r: { id: number; version: number }) => ({ id: r.id, version: r.version }))
    expect(versions).toEqual([{ id: recipeId, version: before.version }])

    // A version nobody has: refused, nothing written.
    const stale = await producer.post(`/api/shoots/${shoots[1]}/report/adopt`, { recipes: [{ id: recipeId, version: before.version + 5 }] })
    expect(stale.status).toBe(409)
    expect(stale.body.data.code).toBe('conflict')
    expect(stale.body.message).toMatch(/^“Report test leek broth” was saved by someone else since you opened this report/)
    expect((await producer.get(`/api/recipes/${recipeId}`)).body.steps).toEqual(before.steps)

    const adopted = await producer.post(`/api/shoots/${shoots[1]}/report/adopt`, { recipes: versions })
    expect(adopted.status).toBe(200)
    expect(adopted.body.adopted).toBe(3)
    const after = (await producer.get(`/api/recipes/${recipeId}`)).body
    expect(after.version).toBe(before.version + 1)
    const suggested = report.steps.map((s: ReportStep) => s.suggested)
    const ranges = after.steps.map((s: Step) => ({ min: s.durationMin, max: s.durationMax }))
    expect(ranges).toEqual(suggested.map((s: { min: number; max: number }) => ({ min: s.min, max: s.max })))
    // One cook, a chain: the plan's makespan is the three long ends added.
    const makespan = (await producer.get(`/api/episodes/${episodeId}/plan`)).body.makespan
    expect(makespan).toBe(suggested.reduce((sum: number, s: { max: number }) => sum + s.max, 0))
    expect(makespan).not.toBe(270)
    const again = (await producer.get(`/api/shoots/${shoots[1]}/report`)).body
    expect(again.adoption).toMatchObject({ steps: 3, byName: expect.any(String) })
    const nothing = await producer.post(`/api/shoots/${shoots[1]}/report/adopt`, { recipes: again.recipes.map((r: { id: number; version: number }) => ({ id: r.id, version: r.version })) })
    expect(nothing.status).toBe(409)
    expect(nothing.body.data.code).toBe('no-change')

    const undone = await producer.post(`/api/shoots/${shoots[1]}/report/undo`, { adoptionId: again.adoption.id })
    expect(undone.status).toBe(200)
    expect(undone.body.restored).toBe(3)
    const restored = (await producer.get(`/api/recipes/${recipeId}`)).body
    expect(restored.version).toBe(before.version + 2)
    expect(restored.steps.map((s: Step) => [s.durationMin, s.durationMax])).toEqual(before.steps.map((s: Step) => [s.durationMin, s.durationMax]))
    expect((await producer.get(`/api/episodes/${episodeId}/plan`)).body.makespan).toBe(270)
    const twice = await producer.post(`/api/shoots/${shoots[1]}/report/undo`, { adoptionId: again.adoption.id })
    expect(twice.status).toBe(409)
    expect(twice.body.message).toBe('These ranges were already put back.')
    expect((await producer.get(`/api/shoots/${shoots[1]}/report`)).body.adoption).toBeNull()
  })

  it('lets only the producer adopt or undo; bad bodies and a recording\'s report are refused in the one error shape', async () => {
    const camera = await signedIn(demo.camera)
    const versions = [{ id: recipeId, version: 1 }]
    for (const c of [host, camera, viewer]) {
      for (const [path, body] of [['adopt', { recipes: versions }], ['undo', { adoptionId: 1 }]] as const) {
        const r = await c.post(`/api/shoots/${shoots[1]}/report/${path}`, body)
        expect(r.status).toBe(403)
        expect(r.body).toMatchObject({ statusCode: 403, data: { code: 'forbidden' } })
        expect(r.body.message).toMatch(/may not edit episodes\. Ask the studio's producer\.$/)
      }
    }
    const bad = await producer.post(`/api/shoots/${shoots[1]}/report/adopt`, { recipes: 'all' })
    expect(bad.status).toBe(400)
    expect(bad.body.data).toMatchObject({ code: 'invalid', field: 'recipes' })
    expect(bad.body.message).toMatch(/^Recipe versions: /)
    const badUndo = await producer.post(`/api/shoots/${shoots[1]}/report/undo`, { adoptionId: 'last' })
    expect(badUndo.status).toBe(400)
    expect(badUndo.body.message).toMatch(/^Adoption to undo: /)
    const take = await producer.post(`/api/episodes/${episodeId}/shoots`, { mode: 'take' })
    const none = await viewer.get(`/api/shoots/${take.body.shoot.id}/report`)
    expect(none.status).toBe(404)
    expect(none.body.message).toBe('A recording has no rehearsal report; open its take log from the list of shoots.')
  })

  it('will not undo over a save made since: the recipe keeps that save', async () => {
    const report = (await producer.get(`/api/shoots/${shoots[0]}/report`)).body
    const adopted = await producer.post(`/api/shoots/${shoots[0]}/report/adopt`, { recipes: report.recipes.map((r: { id: number; version: number }) => ({ id: r.id, version: r.version })) })
    expect(adopted.status).toBe(200)
    const now = (await host.get(`/api/recipes/${recipeId}`)).body
    const steps = now.steps.map((s: Step & { name: string | null; text: string; handsOn: boolean; station: string | null }, i: number) => ({
      id: s.id, name: s.name, text: s.text, handsOn: s.handsOn, station: s.station, durationMin: s.durationMin, durationMax: i === 2 ? 75 : s.durationMax,
    }))
    const saved = await host.patch(`/api/recipes/${recipeId}`, { version: now.version, title: now.title, servings: now.servings, steps })
    expect(saved.status).toBe(200)
    const undo = await producer.post(`/api/shoots/${shoots[0]}/report/undo`, { adoptionId: adopted.body.adoptionId })
    expect(undo.status).toBe(409)
    expect(undo.body.data.code).toBe('conflict')
    expect(undo.body.message).toMatch(/^“Report test leek broth” was saved by someone else after the actuals were adopted, so undo would overwrite that save/)
    const kept = (await producer.get(`/api/recipes/${recipeId}`)).body
    expect(kept.version).toBe(now.version + 1)
    expect(kept.steps.map((s: Step) => s.durationMax)).toEqual(steps.map((s: { durationMax: number | null }) => s.durationMax))
  })
})
