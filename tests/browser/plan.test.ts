// The producer opens the demo episode's cook plan: the timeline is drawn lane by lane, and a kitchen
// with one burner instead of four makes the whole cook longer, re-planned on the spot. Printed, the
// plan drops the controls and fits the page.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, offHost, screenshot, signInOnPage } from '../support/page'

/** A page signed in as a member of the demo studio, on their studio page, its console errors watched. */
async function signedIn(email: string) {
  const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
  const consoleErrors = consoleErrorsOf(page)
  await signInOnPage(page, email)
  return { page, consoleErrors }
}

async function makespan(page: Page) {
  return Number(await page.getByTestId('makespan').getAttribute('data-seconds'))
}

describe.skipIf(!chromiumAvailable())('cook plan timeline in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('draws the demo episode; one burner instead of four lengthens the cook; prints without controls', async () => {
    const { page, consoleErrors } = await signedIn('producer@brackenford.test')
    const requests: string[] = []
    page.on('request', (r) => requests.push(r.url()))

    // The episode list, reached from the main navigation.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Episodes' }).click()
    await page.waitForURL(/\/studios\/1\/episodes$/)
    await page.getByRole('link', { name: 'Thursday supper special', exact: true }).waitFor()
    expect(await axeViolations(page)).toEqual([])

    const { episodes } = await page.evaluate(() => fetch('/api/studios/1/episodes').then((r) => r.json())) as { episodes: { id: number; title: string; recipes: unknown[] }[] }
    const demo = episodes.find((e) => e.title === 'Thursday supper special')
    expect(demo, 'the seeded demo episode').toBeTruthy()
    expect(demo!.recipes.length).toBeGreaterThan(1)

    // The episode page: its run order (the recipes among its segments) and the way to the plan.
    await page.goto(url(`/episodes/${demo!.id}`), { waitUntil: 'networkidle' })
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Thursday supper special')
    const full = await page.evaluate((id) => fetch(`/api/episodes/${id}`).then((r) => r.json()), demo!.id) as { segments: { kind: string }[] }
    expect(full.segments.filter((s) => s.kind === 'recipe').length).toBe(demo!.recipes.length)
    expect(await page.getByRole('button', { name: /^Move .* down$/ }).count()).toBe(full.segments.length)
    expect(await axeViolations(page)).toEqual([])
    await page.getByRole('link', { name: 'Open the cook plan' }).click()
    await page.waitForURL(new RegExp(`/episodes/${demo!.id}/plan$`))
    await page.getByTestId('plan-timeline').waitFor()

    // The plan as the server computed it for the studio's kitchen (four burners in the demo studio).
    const served = await page.evaluate((id) => fetch(`/api/episodes/${id}/plan`).then((r) => r.json()), demo!.id) as {
      makespan: number; lanes: string[]; steps: { stepId: number; critical: boolean; handsOn: boolean }[]; kitchen: { burners: number }
    }
    expect(served.kitchen.burners).toBe(4)
    const before = await makespan(page)
    expect(before).toBe(served.makespan)
    expect(before).toBeGreaterThan(0)
    await expect(page.getByLabel('Burners', { exact: true }).inputValue()).resolves.toBe('4')

    // One lane label per lane, one focusable named bar per step, critical steps marked on the bar.
    const timeline = page.getByTestId('plan-timeline')
    expect(await timeline.locator('[role="list"]').count()).toBeGreaterThan(1)
    const bars = timeline.locator('[role="listitem"]')
    expect(await bars.count()).toBe(served.steps.length)
    expect(await timeline.locator('[role="listitem"][data-critical="true"]').count()).toBe(served.steps.filter((s) => s.critical).length)
    for (const lane of ['Burner 1', 'Burner 4']) expect(await timeline.locator('text', { hasText: lane }).count()).toBe(1)
    // Waits overlap hands-on work: some unattended step runs while the cook's hands are busy.
    const spans = await page.evaluate((id) => fetch(`/api/episodes/${id}/plan`).then((r) => r.json()).then((p: { steps: { start: number; end: number; handsOn: boolean }[] }) => p.steps), demo!.id)
    const waits = spans.filter((s) => !s.handsOn)
    expect(waits.some((w) => spans.some((h) => h.handsOn && h.start < w.end && w.start < h.end))).toBe(true)

    // Keyboard focus on a bar shows its times and slack.
    await bars.first().focus()
    const tip = page.getByTestId('plan-tooltip')
    await tip.waitFor()
    await expect(tip.textContent()).resolves.toMatch(/\d+:\d\d–\d+:\d\d/)
    await expect(tip.textContent()).resolves.toMatch(/Spare time: |Sets the finish time: a delay here/)
    await expect(bars.first().getAttribute('aria-label')).resolves.toMatch(/ to .*(to spare|sets the finish time)/)
    await page.keyboard.press('Escape')
    await tip.waitFor({ state: 'detached' })

    // Zoom: + widens the drawing past the box; "Fit to width" brings it back.
    const fitted = Number(await timeline.getAttribute('width'))
    await page.getByRole('button', { name: 'Zoom in' }).click()
    expect(Number(await timeline.getAttribute('width'))).toBeGreaterThan(fitted * 1.4)
    await page.getByRole('button', { name: 'Fit to width' }).click()
    expect(Number(await timeline.getAttribute('width'))).toBe(fitted)

    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'plan-timeline-4-burners')

    // One burner: the stew, the lentils and the flatbreads queue for it, so the cook gets longer.
    await page.getByLabel('Burners', { exact: true }).fill('1')
    await page.getByRole('status').filter({ hasText: /Re-planned and saved/ }).waitFor()
    await page.waitForFunction((b) => Number(document.querySelector('[data-testid="makespan"]')?.getAttribute('data-seconds')) !== b, before)
    const after = await makespan(page)
    expect(after).toBeGreaterThan(before)
    expect(await timeline.locator('text', { hasText: 'Burner 4' }).count()).toBe(0)
    // The producer saved it as the studio's kitchen: the server plans the same.
    const reread = await page.evaluate((id) => fetch(`/api/episodes/${id}/plan`).then((r) => r.json()), demo!.id) as { makespan: number; kitchen: { burners: number } }
    expect(reread.kitchen.burners).toBe(1)
    expect(reread.makespan).toBe(after)
    console.info(`demo episode total cook time: ${before} s with 4 burners, ${after} s with 1 burner`)

    // A value out of range is named beside its field and not sent.
    await page.getByLabel('Burners', { exact: true }).fill('40')
    await page.getByText('Enter a whole number from 0 to 16.').waitFor()
    expect(await makespan(page)).toBe(after)
    await page.getByLabel('Burners', { exact: true }).fill('1')

    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'plan-timeline')

    // Printed: no header, no controls, the drawing no wider than the page.
    await page.emulateMedia({ media: 'print' })
    expect(await page.locator('header').isVisible()).toBe(false)
    expect(await page.getByRole('button', { name: 'Zoom in' }).isVisible()).toBe(false)
    expect(await page.getByLabel('Burners', { exact: true }).isVisible()).toBe(false)
    const fit = await page.evaluate(() => {
      const svg = document.querySelector('[data-testid="plan-timeline"]')!.getBoundingClientRect()
      return { svg: svg.right, page: document.documentElement.clientWidth }
    })
    expect(fit.svg).toBeLessThanOrEqual(fit.page)
    await screenshot(page, 'plan-print')
    await page.emulateMedia({ media: 'screen' })

    expect(offHost(requests)).toEqual([])
    expect(consoleErrors).toEqual([])
    await page.close()
  })

  it('names the steps in words when the kitchen cannot cook them (no burner)', async () => {
    const { page, consoleErrors } = await signedIn('producer@brackenford.test')
    const { episodes } = await page.evaluate(() => fetch('/api/studios/1/episodes').then((r) => r.json())) as { episodes: { id: number; title: string }[] }
    const demo = episodes.find((e) => e.title === 'Thursday supper special')!
    await page.goto(url(`/episodes/${demo.id}/plan`), { waitUntil: 'networkidle' })
    await page.getByLabel('Burners', { exact: true }).fill('0')
    const problem = page.getByTestId('plan-problem')
    await problem.waitFor()
    await expect(problem.textContent()).resolves.toMatch(/burner/i)
    expect(await problem.locator('li').count()).toBeGreaterThan(0)
    expect(await page.getByTestId('plan-timeline').count()).toBe(0)
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'plan-no-burner')
    // Saved as the studio's kitchen, the refusal is there on a fresh load too, never a blank page.
    await page.reload({ waitUntil: 'networkidle' })
    await problem.waitFor()
    await expect(problem.textContent()).resolves.toMatch(/need a burner/)
    expect(await problem.locator('li').count()).toBeGreaterThan(0)
    // Back to four burners: the plan returns.
    await page.getByLabel('Burners', { exact: true }).fill('4')
    await page.getByTestId('plan-timeline').waitFor()
    expect(consoleErrors.filter((e) => !/status of 422/.test(e))).toEqual([])
    await page.close()
  })

  it('makes an episode from two recipes, reorders them and saves with its version', async () => {
    const { page, consoleErrors } = await signedIn('producer@brackenford.test')
    await page.getByRole('link', { name: 'Episodes', exact: true }).first().click()
    await page.waitForURL(/\/episodes$/)
    // No title: said beside the field, nothing sent.
    await page.getByRole('button', { name: 'Create the episode' }).click()
    await page.getByText('Give the episode a title.').waitFor()
    await page.getByLabel('Episode title').fill('Sunday lunch trial')
    for (const title of ['Pan flatbreads with mint yoghurt', 'Smoky butter bean and tomato stew']) {
      await page.getByLabel('Recipe to add').selectOption({ label: title })
      await page.getByRole('button', { name: 'Add to the episode' }).click()
    }
    expect(await axeViolations(page)).toEqual([])
    await page.getByRole('button', { name: 'Create the episode' }).click()
    await page.waitForURL(/\/episodes\/\d+$/)
    const id = Number(new URL(page.url()).pathname.split('/').at(-1))
    await page.getByRole('heading', { level: 1, name: 'Sunday lunch trial' }).waitFor()
    // The builder saves each change by itself.
    await page.getByRole('button', { name: 'Move Pan flatbreads with mint yoghurt down' }).click()
    await page.locator('[data-testid="save-status"][data-state="saved"]').waitFor()
    const saved = await page.evaluate((e) => fetch(`/api/episodes/${e}`).then((r) => r.json()), id) as { version: number; segments: { title: string }[] }
    expect(saved.version).toBe(2)
    expect(saved.segments.map((s) => s.title)).toEqual(['Smoky butter bean and tomato stew', 'Pan flatbreads with mint yoghurt'])
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'episode-edit')
    expect(consoleErrors).toEqual([])
    await page.close()
  })

  it('a host tries another kitchen on the page only; the studio keeps its own', async () => {
    const { page, consoleErrors } = await signedIn('host@brackenford.test')
    const { episodes } = await page.evaluate(() => fetch('/api/studios/1/episodes').then((r) => r.json())) as { episodes: { id: number; title: string }[] }
    const demo = episodes.find((e) => e.title === 'Thursday supper special')!
    // A host reads the run order but does not change it.
    await page.goto(url(`/episodes/${demo.id}`), { waitUntil: 'networkidle' })
    expect(await page.getByRole('button', { name: 'Save the episode' }).count()).toBe(0)
    await page.getByRole('heading', { name: 'Run order' }).waitFor()
    expect(await page.getByRole('button', { name: 'Add the segment' }).count()).toBe(0)
    expect(await axeViolations(page)).toEqual([])

    await page.goto(url(`/episodes/${demo.id}/plan`), { waitUntil: 'networkidle' })
    const studioBefore = await page.evaluate(() => fetch('/api/studios/1').then((r) => r.json())) as { kitchen: { burners: number } }
    const before = await makespan(page)
    await page.getByText('the plan changes on this page only').waitFor()
    await page.getByLabel('Burners', { exact: true }).fill('1')
    await page.getByRole('status').filter({ hasText: /^Re-planned: total cook time/ }).waitFor()
    await page.waitForFunction((b) => Number(document.querySelector('[data-testid="makespan"]')?.getAttribute('data-seconds')) !== b, before)
    expect(await makespan(page)).toBeGreaterThan(before)
    const studioAfter = await page.evaluate(() => fetch('/api/studios/1').then((r) => r.json())) as { kitchen: { burners: number } }
    expect(studioAfter.kitchen.burners).toBe(studioBefore.kitchen.burners)
    expect(await axeViolations(page)).toEqual([])
    expect(consoleErrors).toEqual([])
    await page.close()
  })
})
