// The producer's control desk follows the cook plan live: a rehearsal of the demo episode at 32×, the
// desk draws the plan's lanes with a now-line that moves with the shoot clock; the host stays on the
// first hands-on step 3 minutes (shoot clock) past its planned end, and the projected finish on the
// desk moves by those minutes, the step drawn done where it really ran, over the first plan's outline.
import { createPage, url } from '@nuxt/test-utils/e2e'
import { resolve } from 'node:path'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import type { ShootState } from '../../shared/types/shoot'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { artifactsDir, consoleErrorsOf, sameOrigin, screenshot, signInOnPage } from '../support/page'

const MIN = 60_000
const num = async (page: Page, testId: string, name: string) => Number(await page.getByTestId(testId).first().getAttribute(name))

/** The producer signed in on a laptop, with a new rehearsal of the demo episode (its id). */
async function producerWithRehearsal(viewport: { width: number; height: number }, beforeCreating?: (page: Page) => Promise<void>) {
  const page = await createPage(undefined, { viewport })
  const errors = consoleErrorsOf(page)
  await signInOnPage(page, 'producer@brackenford.test')
  await beforeCreating?.(page)
  const created = await page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
  expect(created.status()).toBe(201)
  return { page, errors, shootId: (await created.json()).shoot.id as number }
}

describe.skipIf(!chromiumAvailable())('the control desk\'s live cook plan', async () => {
  await useBuiltApp({ browser: true })

  it('draws the lanes and a moving now-line, and moves the projected finish when the host runs 3 minutes late', async () => {
    const { page, errors, shootId } = await producerWithRehearsal({ width: 1440, height: 900 })
    const command = async (data: object) => {
      const r = await page.request.post(url(`/api/shoots/${shootId}/commands`), { data, headers: sameOrigin() })
      expect(r.status(), JSON.stringify(data)).toBe(200)
    }
    const server = async (): Promise<ShootState> => (await (await page.request.get(url(`/api/shoots/${shootId}`))).json()).state
    await command({ type: 'clock.speed', speed: 32 })

    await page.goto(url(`/shoots/${shootId}/desk`), { waitUntil: 'networkidle' })
    await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
    const timeline = page.getByTestId('desk-timeline')
    await timeline.waitFor()

    // The demo kitchen's lanes in plain words (studio kitchen: 1 cook, 4 burners, 1 oven; server/db/demo-recipes.ts).
    const lanes = await timeline.locator('[data-lane]').allTextContents()
    expect(lanes.map((l) => l.trim())).toEqual(['Hands', 'Burner 1', 'Burner 2', 'Burner 3', 'Burner 4', 'Oven', 'Counter', 'Resting 1'])
    const before = await server()
    const plan = before.plan!
    await expect(page.getByTestId('desk-bar').count()).resolves.toBe(plan.steps.length)
    expect(await num(page, 'desk-projection', 'data-planned-ms')).toBe(plan.first!.makespanMs)
    // Minutes:seconds, as the desk writes a shoot-clock time (the demo plan is about 70 minutes).
    const planned = `${Math.floor(plan.first!.makespanMs / MIN)}:${String(Math.round(plan.first!.makespanMs / 1000) % 60).padStart(2, '0')}`
    await expect(page.getByTestId('desk-projection').textContent()).resolves.toMatch(new RegExp(`Projected finish\\s+${planned},\\s+on time with the plan \\(${planned}\\)`))
    // Every wait of the script is marked as a beat the host starts, with its planned start beside it.
    await expect(page.getByTestId('beat-wait').count()).resolves.toBe(plan.steps.filter((s) => !s.handsOn).length)
    // The demo plan has hands-on clashes ahead (the first plan's own, worked by replanCook): named before they happen, outlined on the bar.
    const clashes = plan.live!.collisions.length
    expect(clashes).toBeGreaterThan(0)
    await expect(page.getByTestId('desk-collision').count()).resolves.toBe(clashes)
    await expect(page.getByTestId('desk-collision').first().textContent()).resolves.toContain(plan.live!.collisions[0]!.text)
    await expect(page.locator(`[data-testid="desk-bar"][data-step="${plan.live!.collisions[0]!.stepId}"]`).getAttribute('data-collision')).resolves.toBe('true')

    // The cooking's first beat is a hands-on step the first plan ends at 10:00; the shoot starts
    // there, past the intro (the demo show: intro, the cooking, sponsor read, sign-off).
    const cook = before.runOrder.findIndex((s) => s.stepIds.length > 0)
    expect(before.runOrder.map((s) => s.stepIds.length > 0)).toEqual([false, true, false, false])
    await command({ type: 'step.jump', segment: cook, step: 0 })
    const firstId = before.runOrder[cook]!.stepIds[0]!
    expect(plan.steps.find((s) => s.id === firstId)!.handsOn).toBe(true)
    const plannedEnd = plan.first!.steps[firstId]!.endMs
    expect(plannedEnd).toBe(10 * MIN)

    await page.getByRole('button', { name: 'Start the shoot' }).click()
    await page.locator('[data-testid="shoot-status"][data-status="running"]').waitFor()
    // The now-line moves with the shoot clock: at 32×, 1 s of real time is 32 s of kitchen time.
    const now1 = await num(page, 'desk-now-line', 'data-now-ms')
    const x1 = await num(page, 'desk-now-line', 'data-x')
    await page.waitForTimeout(1000)
    const now2 = await num(page, 'desk-now-line', 'data-now-ms')
    expect(now2 - now1).toBeGreaterThan(28_000)
    expect(now2 - now1).toBeLessThan(40_000)
    expect(await num(page, 'desk-now-line', 'data-x')).toBeGreaterThan(x1)

    // Hovering a bar says the step, its recipe and its times.
    const firstBar = page.locator(`[data-testid="desk-bar"][data-step="${firstId}"]`)
    await firstBar.hover()
    const tip = page.getByTestId('desk-tooltip')
    await expect(tip.textContent()).resolves.toContain(plan.steps.find((s) => s.id === firstId)!.recipeTitle)
    await expect(tip.textContent()).resolves.toMatch(/First plan: 0:00 to 10:00/)
    await page.mouse.move(0, 0)

    // The host stays on it until 13:00 on the shoot clock, 3 minutes past its planned end, then moves on
    // (the last minute at 4×, so a second of the test's own latency is 4 s of kitchen time, not 32).
    const nowAtLeast = (at: number) => page.waitForFunction(
      (ms) => Number((document.querySelector('[data-testid="desk-now-line"]') as HTMLElement | null)?.dataset.nowMs) >= ms, at,
    )
    await nowAtLeast(plannedEnd + 2 * MIN)
    await command({ type: 'clock.speed', speed: 4 })
    await nowAtLeast(plannedEnd + 3 * MIN)
    await command({ type: 'step.next' })
    const after = await server()
    const left = after.visits.at(-1)!.enteredShootMs
    const lateMs = left - plannedEnd
    expect(lateMs).toBeGreaterThanOrEqual(3 * MIN)
    expect(lateMs).toBeLessThan(3.5 * MIN)
    // The step is on the critical chain (oven, then the rest hangs on it), so the finish moves by the same
    // minutes (re-planning: shared/utils/plan-replan.ts; tests/unit/shoot-live-plan.test.ts works it by hand).
    expect(Math.abs(after.plan!.live!.makespanMs - (plan.first!.makespanMs + lateMs))).toBeLessThan(1000)
    await page.waitForFunction(
      (ms) => (document.querySelector('[data-testid="desk-projection"]') as HTMLElement | null)?.dataset.projectedMs === String(ms),
      after.plan!.live!.makespanMs,
    )
    const shown = await num(page, 'desk-projection', 'data-projected-ms')
    expect(shown - plan.first!.makespanMs).toBeGreaterThanOrEqual(3 * MIN)
    expect(shown - plan.first!.makespanMs).toBeLessThan(3.5 * MIN)
    const lateFinish = `${Math.floor(plan.first!.makespanMs / MIN) + 3}:[0-2]\\d`
    await expect(page.getByTestId('desk-projection').textContent()).resolves.toMatch(new RegExp(`Projected finish\\s+${lateFinish},\\s+3:[0-2]\\d later than planned \\(${planned}\\)`))
    expect(await num(page, 'desk-projected-line', 'data-ms')).toBe(shown)
    // What happened is drawn where it happened: the step done from 0:00 to when the host left it.
    await expect(firstBar.getAttribute('data-state')).resolves.toBe('done')
    await firstBar.focus()
    await expect(tip.textContent()).resolves.toMatch(/Done: 0:00 to 13:[0-2]\d/)
    await page.keyboard.press('Escape')

    expect(await axeViolations(page, { aaa: true })).toEqual([])
    await expect(page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).resolves.toBe(0)
    await screenshot(page, 'desk-late')
    await page.getByTestId('desk-plan').screenshot({ path: resolve(artifactsDir, 'desk-timeline.png') })
    expect(errors).toEqual([])
    await page.close()
  })

  it('names the steps of an episode the plan refuses, and says the recipes run in their written order', async () => {
    // A kitchen without an oven cannot roast the squash (missing-station, tests/server/plan.test.ts).
    const kitchen = { hands: 1, burners: 4, ovens: 0, racksPerOven: 1, parallelRecipes: true }
    const { page, errors, shootId } = await producerWithRehearsal({ width: 1280, height: 800 }, async (p) => {
      expect((await p.request.patch(url('/api/studios/1'), { data: { kitchen }, headers: sameOrigin() })).status()).toBe(200)
    })
    await page.request.patch(url('/api/studios/1'), { data: { kitchen: { ...kitchen, ovens: 1 } }, headers: sameOrigin() })

    await page.goto(url(`/shoots/${shootId}/desk`), { waitUntil: 'networkidle' })
    const refused = page.getByTestId('desk-plan-refused')
    await refused.waitFor()
    await expect(refused.textContent()).resolves.toContain('the recipes run in their written order')
    await expect(refused.textContent()).resolves.toMatch(/needs an oven/)
    await expect(page.getByTestId('desk-refused-step').allTextContents()).resolves.toEqual([expect.stringMatching(/^Squash roast · Roast squash with lentils and tahini$/)])
    await expect(page.getByTestId('desk-timeline').count()).resolves.toBe(0)
    await expect(page.getByTestId('desk-projection').count()).resolves.toBe(0)
    expect(await axeViolations(page, { aaa: true })).toEqual([])
    await screenshot(page, 'desk-plan-refused')
    expect(errors).toEqual([])
    await page.close()
  })
})
