// What the shoot screens are sent: each step's text with its amounts scaled in the studio's units,
// the ingredients and allergens of the step, caution texts, where the cook plan puts the step, and
// who is on the shoot (for quiet on set).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ShootPresence, ShootSnapshot } from '../../shared/types/socket-events'
import { CAUTIONS } from '../../shared/utils/cautions'
import { useBuiltApp } from '../support/app'
import { Client, demo, signedIn } from '../support/client'
import { connect, emitAck, waitFor, type TestSocket } from '../support/sockets'

describe('what the shoot screens read', async () => {
  await useBuiltApp()
  let producer: Client
  let shootId: number
  const sockets: TestSocket[] = []
  afterAll(() => sockets.forEach((s) => s.disconnect()))
  const open = async (client: Client | null) => {
    const s = await connect(client)
    sockets.push(s)
    return s
  }
  const snapshot = async () => (await producer.get(`/api/shoots/${shootId}`)).body as ShootSnapshot
  const stepWith = (snap: ShootSnapshot, words: string) => Object.values(snap.steps).find((s) => s.text.includes(words))!

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    const started = await producer.post('/api/episodes/1/shoots', { mode: 'take' })
    expect(started.status).toBe(201)
    shootId = started.body.shoot.id
  })

  it('scales amounts in the studio\'s units: 30 mL of oil, or 2 US tablespoons once the studio uses US units', async () => {
    const metric = await snapshot()
    expect(metric.units).toBe('metric')
    const warm = stepWith(metric, 'Warm {{olive-oil|item}}')
    expect(warm.segments.map((s) => s.text).join('')).toBe('Warm 30 mL olive oil in a wide pan and soften the onion.')
    expect(warm.segments.find((s) => s.ingredientKey === 'olive-oil')).toMatchObject({ text: '30 mL olive oil' })
    expect(warm.ingredients).toEqual([{ key: 'olive-oil', item: 'olive oil', amount: '30 mL' }])

    expect((await producer.patch('/api/studios/1', { unitSystem: 'us' })).status).toBe(200)
    const us = await snapshot()
    expect(us.units).toBe('us')
    // NIST Handbook 44 Appendix C: 1 US tablespoon = 14.786 765 mL, so 30 mL = 2.03 tbsp, shown as 2 tbsp.
    expect(stepWith(us, 'Warm {{olive-oil|item}}').ingredients).toEqual([{ key: 'olive-oil', item: 'olive oil', amount: '2 tbsp' }])
    // In US units the US list (FALCPA 2004: wheat, milk) goes beside the EU one, in the order the step uses
    // the ingredients (flour, then yoghurt); the demo's allergens are suggestions.
    expect(stepWith(us, '{{plain-yoghurt*5/7|item}}').allergensUs).toEqual(['Wheat', 'Milk'])
    expect(stepWith(us, '{{plain-yoghurt*5/7|item}}').allergensUnchecked).toEqual(['self-raising flour', 'plain yoghurt'])
    expect((await producer.patch('/api/studios/1', { unitSystem: 'metric' })).status).toBe(200)
  })

  it('names the step\'s allergens from its ingredients and adds the allergen caution with its text', async () => {
    const snap = await snapshot()
    // Flour is a cereal containing gluten and yoghurt is milk (Regulation (EU) No 1169/2011 Annex II,
    // items 1 and 7), in the Annex's order.
    const dough = stepWith(snap, '{{plain-yoghurt*5/7|item}}')
    expect(dough.allergens).toEqual(['Cereals containing gluten (wheat (such as spelt and khorasan wheat), rye, barley, oats)', 'Milk (including lactose)'])
    expect(dough.cautions).toContain('allergen')
    expect(dough.allergensUs).toEqual([]) // the studio works in metric
    expect(dough.cautionNotes.find((c) => c.id === 'allergen')).toEqual({ id: 'allergen', label: CAUTIONS.allergen.label, text: CAUTIONS.allergen.text })
    const warm = stepWith(snap, 'Warm {{olive-oil|item}}')
    expect(warm.allergens).toEqual([])
    expect(warm.cautionNotes.map((c) => c.id)).toEqual(['hot-oil'])
  })

  it('puts each step where the cook plan does, in ms on the shoot clock', async () => {
    const snap = await snapshot()
    const plan = (await producer.get('/api/episodes/1/plan')).body as { makespan: number; steps: Array<{ stepId: number; start: number; end: number }> }
    expect(snap.makespanMs).toBe(plan.makespan * 1000)
    for (const p of plan.steps) {
      expect(snap.steps[String(p.stepId)]).toMatchObject({ plannedStartMs: p.start * 1000, plannedEndMs: p.end * 1000 })
    }
  })

  it('lists the screens on the shoot and which ring while rolling, and tells the room when that changes', async () => {
    const desk = await open(producer)
    await emitAck(desk, 'shoot:join', { shootId })
    const presences: ShootPresence[] = []
    desk.on('shoot:presence', (m) => presences.push({ screens: m.screens }))
    const hostCode = (await producer.post(`/api/shoots/${shootId}/join-codes`, { role: 'host' })).body.code
    const tablet = new Client()
    await tablet.post('/api/join', { code: hostCode })
    const host = await open(tablet)
    const joined = await emitAck<{ ok: boolean } & ShootSnapshot>(host, 'shoot:join', { shootId })
    expect(joined.presence.screens.map((s) => s.role).sort()).toEqual(['host', 'producer'])
    await waitFor(() => presences.find((p) => p.screens.length === 2))

    desk.emit('screen:alarm', { shootId, audibleWhileRolling: true })
    const ringing = await waitFor(() => presences.find((p) => p.screens.some((s) => s.role === 'producer' && s.audibleWhileRolling)))
    expect(ringing.screens.find((s) => s.role === 'host')!.audibleWhileRolling).toBe(false)

    // A screen that has not joined the shoot changes nothing, whatever it sends.
    const stranger = await open(await signedIn(demo.viewer))
    const before = presences.length
    stranger.emit('screen:alarm', { shootId, audibleWhileRolling: true })
    stranger.emit('screen:alarm', { shootId: 'x', audibleWhileRolling: 'yes' } as never)
    await new Promise((r) => setTimeout(r, 200))
    expect(presences.length).toBe(before)

    // The tablet leaves: the desk hears that only the producer is left.
    host.disconnect()
    await waitFor(() => presences.at(-1)!.screens.length === 1 && presences.at(-1))
    expect(presences.at(-1)!.screens).toEqual([{ role: 'producer', audibleWhileRolling: true }])
  })
})
