// The cook plan route for the demo episode, kitchen what-ifs, the studio's kitchen profile, and the
// refusals (422 naming the steps).
import { beforeAll, describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn } from '../support/client'

describe('cook plan', async () => {
  await useBuiltApp()
  let producer: Client
  let episodeId: number

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    const list = await producer.get('/api/studios/1/episodes')
    episodeId = list.body.episodes.find((e: { title: string }) => e.title === 'Thursday supper special').id
  })

  it('plans the demo episode: every step once, on a lane, within the links, at or above the lower bounds', async () => {
    const plan = await producer.get(`/api/episodes/${episodeId}/plan`)
    expect(plan.status).toBe(200)
    const { body } = plan
    const episode = (await producer.get(`/api/episodes/${episodeId}`)).body
    // The demo show's recipe segments (its intro, sponsor read and sign-off have no steps to plan).
    expect(episode.segments.filter((s: { recipeId: number | null }) => s.recipeId).map((s: { title: string }) => s.title))
      .toEqual(['Smoky butter bean and tomato stew', 'Pan flatbreads with mint yoghurt', 'Roast squash with lentils and tahini'])
    expect(body.steps).toHaveLength(16)
    expect(body.kitchen).toEqual({ hands: 1, burners: 4, ovens: 1, racksPerOven: 1, parallelRecipes: true })
    for (const s of body.steps) {
      expect(body.lanes).toContain(s.lane)
      expect(s.end).toBeGreaterThan(s.start)
      // Planned at the long end of the step's range.
      expect(s.end - s.start).toBe(s.durationMax ?? 60)
    }
    expect(body.makespan).toBe(Math.max(...body.steps.map((s: { end: number }) => s.end)))
    expect(body.makespan).toBeGreaterThanOrEqual(body.bounds.criticalPath)
    expect(body.makespan).toBeGreaterThanOrEqual(body.bounds.handsOn)
    // One cook: hands-on steps never overlap.
    const handsOn = body.steps.filter((s: { handsOn: boolean }) => s.handsOn).sort((a: { start: number }, b: { start: number }) => a.start - b.start)
    for (let i = 1; i < handsOn.length; i++) expect(handsOn[i].start).toBeGreaterThanOrEqual(handsOn[i - 1].end)
    // The roast and the lentils wait at the same time (the point of the plan).
    const roast = body.steps.find((s: { label: string }) => s.label.startsWith('Toss the squash'))
    const lentils = body.steps.find((s: { label: string }) => s.label.startsWith('Simmer green lentils'))
    expect(lentils.start).toBeLessThan(roast.end)
    expect(roast.start).toBeLessThan(lentils.end)
    // The tahini sauce finishes its lead before the roast ends (finish-together, 5 min lead).
    const tahini = body.steps.find((s: { label: string }) => s.label.startsWith('Whisk tahini'))
    expect(tahini.start).toBe(roast.end - 300)
    expect(body.cues.length).toBeGreaterThan(0)
    expect(body.cues[0].text).toMatch(/^While “.+”: start “.+”\.$/)
    // Labels are quoted inside a sentence: no full stop of their own.
    expect(body.cues.map((c: { text: string }) => c.text).join(" ")).not.toMatch(/\.”/)
  })

  it('one burner instead of four makes the cook longer; the studio profile is the default', async () => {
    const four = (await producer.get(`/api/episodes/${episodeId}/plan`)).body.makespan
    const one = (await producer.get(`/api/episodes/${episodeId}/plan?burners=1`)).body
    expect(one.makespan).toBeGreaterThan(four)
    expect(one.lanes.filter((l: string) => l.startsWith('burner'))).toEqual(['burner-1'])
    const saved = await producer.patch('/api/studios/1', { kitchen: { hands: 1, burners: 1, ovens: 1, racksPerOven: 1, parallelRecipes: true } })
    expect(saved.status).toBe(200)
    expect((await producer.get(`/api/episodes/${episodeId}/plan`)).body.makespan).toBe(one.makespan)
    await producer.patch('/api/studios/1', { kitchen: { hands: 1, burners: 4, ovens: 1, racksPerOven: 1, parallelRecipes: true } })
    // A second cook can only help.
    expect((await producer.get(`/api/episodes/${episodeId}/plan?hands=2`)).body.makespan).toBeLessThanOrEqual(four)
  })

  it('refuses a kitchen without the oven a step needs: 422 naming the step', async () => {
    const res = await producer.get(`/api/episodes/${episodeId}/plan?ovens=0`)
    expect(res.status).toBe(422)
    expect(res.body.statusMessage).toMatch(/needs an oven/)
    expect(res.body.data).toMatchObject({ code: 'missing-station', steps: [expect.objectContaining({ label: expect.stringMatching(/^Toss the squash/), recipeTitle: 'Roast squash with lentils and tahini' })] })
  })

  it('a step saved as "starts together with the step before" is planned to start with it; unticked it follows it', async () => {
    // What the editor's checkbox sends: no "after", a start-start link from the step before with no lag.
    const steps = (together: boolean) => [
      { name: 'Pasta water', text: 'Bring a large pot of salted water to the boil.', handsOn: false, durationMin: 600, durationMax: 600, station: 'burner' },
      { text: 'Meanwhile, peel and finely chop the onion.', handsOn: true, durationMin: 300, durationMax: 300, station: 'counter',
        links: together ? [{ step: 1, kind: 'start-start', lag: 0 }] : [] },
      // Names no step: it follows the onion and, since the onion started together with the water, the water too.
      { text: 'Cook the rigatoni in the boiling water.', handsOn: false, durationMin: 660, durationMax: 660, station: 'burner' },
    ]
    const recipe = await producer.post('/api/studios/1/recipes', { title: 'Weeknight rigatoni', servings: 2, steps: steps(true) })
    expect(recipe.status).toBe(201)
    expect(recipe.body.steps.map((s: { name: string | null }) => s.name)).toEqual(['Pasta water', null, null])
    const episode = await producer.post('/api/studios/1/episodes', { title: 'Rigatoni night', recipeIds: [recipe.body.id] })
    const planned = async (saved: { steps: { id: number }[] }) => {
      const res = await producer.get(`/api/episodes/${episode.body.id}/plan`)
      expect(res.status).toBe(200)
      return saved.steps.map((s) => res.body.steps.find((p: { stepId: number }) => p.stepId === s.id))
    }
    const [water, onion, pasta] = await planned(recipe.body)
    expect(onion.start).toBe(water.start)
    expect(onion.end).toBeLessThan(water.end)
    expect(pasta.start).toBe(water.end)

    const unticked = await producer.patch(`/api/recipes/${recipe.body.id}`, { version: 1, title: 'Weeknight rigatoni', servings: 2, steps: steps(false) })
    expect(unticked.status).toBe(200)
    const [water2, onion2, pasta2] = await planned(unticked.body)
    expect(onion2.start).toBe(water2.end)
    expect(pasta2.start).toBe(onion2.end)
  })

  it('the demo flatbreads: the mint yoghurt starts with the dough\'s rest, not after it', async () => {
    const { body } = await producer.get(`/api/episodes/${episodeId}/plan`)
    const rest = body.steps.find((s: { label: string }) => s.label === 'Cover and rest the dough')
    const dip = body.steps.find((s: { label: string }) => s.label.startsWith('Chop the mint'))
    expect(dip.start).toBeGreaterThanOrEqual(rest.start)
    expect(dip.start).toBeLessThan(rest.end)
  })

  it('refuses a lead that cannot be met: 422 naming both steps', async () => {
    const recipe = await producer.post('/api/studios/1/recipes', {
      title: 'Eggs in sauce', servings: 2,
      steps: [
        { text: 'Simmer the sauce', handsOn: false, durationMin: 600, durationMax: 600, station: 'burner' },
        // A 10-minute step cannot go in 6 minutes before the end of the sauce and finish with it.
        { text: 'Poach the eggs in the sauce', handsOn: true, durationMin: 600, durationMax: 600, links: [{ step: 1, kind: 'finish-together', lag: 360 }] },
      ],
    })
    expect(recipe.status).toBe(201)
    const episode = await producer.post('/api/studios/1/episodes', { title: 'Impossible brunch', recipeIds: [recipe.body.id] })
    expect(episode.status).toBe(201)
    const res = await producer.get(`/api/episodes/${episode.body.id}/plan`)
    expect(res.status).toBe(422)
    expect(res.body.data.code).toBe('impossible-lag')
    expect(res.body.data.steps.map((s: { label: string }) => s.label).sort()).toEqual(['Poach the eggs in the sauce', 'Simmer the sauce'])
  })

  it('episodes: a stale save is a 409; bad input a 400 naming the field; a camera may read the plan but not edit', async () => {
    const e = (await producer.post('/api/studios/1/episodes', { title: 'Saturday brunch' })).body
    expect((await producer.patch(`/api/episodes/${e.id}`, { version: 1, title: 'Saturday brunch, long' })).status).toBe(200)
    const stale = await producer.patch(`/api/episodes/${e.id}`, { version: 1, title: 'Lost edit' })
    expect(stale.status).toBe(409)
    expect(stale.body.data.current.title).toBe('Saturday brunch, long')
    expect((await producer.post('/api/studios/1/episodes', { title: '' })).body.statusMessage).toBe('Episode title: give the episode a title.')
    expect((await producer.post('/api/studios/1/episodes', { title: 'Twice', recipeIds: [1, 1] })).body.statusMessage).toMatch(/^Recipes in run order: a recipe appears twice/)
    expect((await producer.get(`/api/episodes/${episodeId}/plan?burners=lots`)).body.statusMessage).toBe('Burners: write a whole number from 0 to 16.')
    const camera = await signedIn(demo.camera)
    expect((await camera.get(`/api/episodes/${episodeId}/plan`)).status).toBe(200)
    expect((await camera.patch(`/api/episodes/${e.id}`, { version: 2, title: 'No' })).status).toBe(403)
    expect((await camera.patch('/api/studios/1', { kitchen: { hands: 2, burners: 4, ovens: 1, racksPerOven: 1, parallelRecipes: true } })).status).toBe(403)
    expect((await new Client().get(`/api/episodes/${episodeId}/plan`)).status).toBe(401)
  })
})
