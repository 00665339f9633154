// The prompter plays the show: the demo rehearsal opens on the intro with its live fields written,
// the cue screen says what to frame for it, and at the stew's last step the prompter reads the cost
// line. A price changed by the producer in another window rewrites that line on the open prompter;
// the desk lists every segment and flags a claim the data does not bear out.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, sameOrigin, screenshot, signInOnPage } from '../support/page'
import type { ShootSnapshot } from '../../shared/types/socket-events'

async function signedIn(email: string, viewport = { width: 1024, height: 768 }) {
  const page = await createPage(undefined, { viewport })
  const errors = consoleErrorsOf(page)
  await signInOnPage(page, email)
  return { page, errors }
}

const online = (page: Page) => page.locator('[data-testid="connection"][data-online="true"]').waitFor()
const lines = (page: Page) => page.getByTestId('prompter-lines').innerText()

describe.skipIf(!chromiumAvailable())('the show on the shoot screens', async () => {
  await useBuiltApp({ browser: true })

  it('opens on the intro, reads the cost line at the stew\'s last step, and follows a price change live', async () => {
    const producer = await signedIn('producer@brackenford.test', { width: 1280, height: 900 })
    const created = await producer.page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const snap = (await created.json()) as ShootSnapshot
    const shootId = snap.shoot.id

    // The host's tablet: the prompter opens on the intro, its script with the servings written in.
    const host = await signedIn('host@brackenford.test')
    await host.page.goto(url(`/shoots/${shootId}/prompter`))
    await online(host.page)
    await expect(host.page.getByTestId('current-step').innerText()).resolves.toMatch(/^Welcome · Intro/)
    await expect(lines(host.page)).resolves.toContain('Tonight: three dinners, each for 4, each under £1.50 a serving.')
    await expect(host.page.locator('[data-testid="live-field"][data-kind="servings"]').first().innerText()).resolves.toBe('4')
    await screenshot(host.page, 'show-prompter-intro')

    // The camera operator's phone: what to frame for the intro.
    const camera = await signedIn('camera@brackenford.test', { width: 390, height: 844 })
    await camera.page.goto(url(`/shoots/${shootId}/cue`))
    await online(camera.page)
    await expect(camera.page.getByTestId('shot-now').innerText()).resolves.toBe('Host to camera, mid shot, the finished dishes in the background')

    // The desk jumps to the stew's last step in the cooking segment: the prompter reads its closing cost line.
    const cook = snap.state.runOrder.findIndex((s) => s.stepIds.length > 0)
    const stewLast = snap.state.runOrder[cook]!.stepIds.findIndex((id) => snap.show!.atSteps[id]?.closing?.segmentId === 'segment-stew')
    expect(stewLast).toBeGreaterThan(0)
    const jump = await producer.page.request.post(url(`/api/shoots/${shootId}/commands`), {
      data: { type: 'step.jump', segment: cook, step: stewLast }, headers: sameOrigin(),
    })
    expect(jump.status(), await jump.text()).toBeLessThan(300)
    await host.page.locator(`[data-testid="current-step"][data-segment="${cook}"][data-step="${stewLast}"]`).waitFor()
    const closing = host.page.locator('[data-testid="prompter-lines"] li[data-from="closing"]')
    await expect(closing.innerText()).resolves.toBe('That is the stew: £0.92 a serving, or £1.11 with the parsley.')
    await screenshot(host.page, 'show-prompter-cost-line')

    // The producer doubles the butter beans' price in the studio's price list: the open prompter's line follows.
    const prices = (await (await producer.page.request.get(url('/api/studios/1/prices'))).json()).prices as Array<Record<string, unknown> & { id: number; item: string }>
    const beans = prices.find((p) => p.item === 'Butter beans')!
    const { id, item, packageSize, packageUnit, currency, shop, boughtOn } = beans
    const changed = await producer.page.request.patch(url(`/api/studios/1/prices/${id}`), {
      data: { item, packageSize, packageUnit, currency, shop, boughtOn, priceMinor: 140 }, headers: sameOrigin(),
    })
    expect(changed.status(), await changed.text()).toBe(200)
    // Two cans for four servings: 2 × 70p ÷ 4 = 35p more a serving.
    await host.page.locator('[data-testid="prompter-lines"] li[data-from="closing"]', { hasText: '£1.27 a serving, or £1.46 with the parsley' }).waitFor()

    // A false claim in the intro is flagged on the desk.
    const episode = await (await producer.page.request.get(url('/api/episodes/1'))).json()
    const segments = episode.segments.map((s: Record<string, unknown>) => ({
      id: s.id, kind: s.kind, title: s.title, script: s.id === 'intro' ? [{ text: 'Three dinners, each under £1 a serving.' }] : s.script,
      ...(s.recipeId ? { recipeId: s.recipeId, closing: s.closing } : {}),
    }))
    const saved = await producer.page.request.patch(url('/api/episodes/1'), { data: { version: episode.version, segments }, headers: sameOrigin() })
    expect(saved.status(), await saved.text()).toBe(200)
    await producer.page.goto(url(`/shoots/${shootId}/desk`))
    await online(producer.page)
    const flag = producer.page.locator('[data-testid="segment-0"] [data-testid="show-flags"] [data-flag="false"]')
    await expect(flag.innerText()).resolves.toContain('“under £1 a serving” is not true')
    await screenshot(producer.page, 'show-desk-flags')

    for (const s of [producer, host, camera]) expect(s.errors).toEqual([])
  })
})
