// A rehearsal of the demo episode at 32×, driven through the commands route (the host moving on
// every second of real time, about 32 s of kitchen time a step, far quicker than the demo's written
// times), then its report in Chromium: the chart drawn by chart.js under the content security policy
// (no violation, caught as csp.test.ts catches them), screenshotted; the producer adopts the actuals
// and the episode's plan page shows another makespan; Undo puts it back. The episode's and the
// studio's shoot lists list the rehearsal with its report.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { DEMO_PASSWORD, consoleErrorsOf, sameOrigin, screenshot, startAtCooking } from '../support/page'

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

/** A signed-in page that records CSP violations (event and console) as csp.test.ts does. */
async function producerPage() {
  const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
  const errors = consoleErrorsOf(page)
  const violations: string[] = []
  await page.exposeFunction('__reportCspViolation', (text: string) => violations.push(text))
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      const report = (window as unknown as { __reportCspViolation: (t: string) => void }).__reportCspViolation
      void report(`${location.pathname}: ${e.effectiveDirective} blocked ${e.blockedURI || '(inline)'}`)
    })
  })
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect|frame|evaluate|create)/i.test(m.text())) violations.push(`console: ${m.text()}`)
  })
  const login = await page.request.post(url('/api/auth/login'), { data: { email: 'producer@brackenford.test', password: DEMO_PASSWORD }, headers: sameOrigin() })
  expect(login.status()).toBe(200)
  return { page, errors, violations }
}

async function makespanOnPlan(page: Page): Promise<number> {
  await page.goto(url('/episodes/1/plan'), { waitUntil: 'networkidle' })
  return Number(await page.getByTestId('makespan').getAttribute('data-seconds'))
}

describe.skipIf(!chromiumAvailable())('the rehearsal report', async () => {
  await useBuiltApp({ browser: true })

  it('a rehearsal at 32× gives a report with a chart; adopting its actuals changes the plan\'s makespan; the lists show it', async () => {
    const { page, errors, violations } = await producerPage()
    const makespanBefore = await makespanOnPlan(page)

    const created = await page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const shootId: number = (await created.json()).shoot.id
    const command = async (data: Record<string, unknown>) => {
      const r = await page.request.post(url(`/api/shoots/${shootId}/commands`), { data, headers: sameOrigin() })
      expect(r.status(), `${JSON.stringify(data)}: ${await r.text()}`).toBe(200)
    }
    await command({ type: 'clock.speed', speed: 32 })
    const cook = await startAtCooking(page, shootId)
    const state = (await (await page.request.get(url(`/api/shoots/${shootId}`))).json()).state
    const steps: string[] = state.runOrder[cook].stepIds
    // The shortest hands-on step is held 5 s (160 s of kitchen time), past the long end of its range.
    const handsOn = (state.plan.steps as { id: string; handsOn: boolean; maxMs: number }[]).filter((p) => p.handsOn)
    const held = handsOn.reduce((a, b) => (b.maxMs < a.maxMs ? b : a))
    expect(held.maxMs).toBeLessThan(160_000)
    await command({ type: 'shoot.start' })
    for (const id of steps) {
      await sleep(id === held.id ? 5000 : 1000)
      await command({ type: 'step.next' }) // the last one goes past the cooking
    }
    await command({ type: 'shoot.end', cancelTimers: true })

    await page.goto(url(`/shoots/${shootId}/report`), { waitUntil: 'networkidle' })
    await page.getByTestId('report-chart-steps').locator('canvas').waitFor()
    await page.waitForTimeout(300)
    const rows = page.getByTestId('report-steps').locator('tbody tr')
    expect(await rows.count()).toBe(steps.length)
    // Hands-on steps were measured by the script; every measured one is a figure of kitchen time.
    const measured = await page.getByTestId('report-steps').locator('tbody tr[data-actual-ms]:not([data-actual-ms=""])').count()
    expect(measured).toBeGreaterThan(0)
    const overruns = page.getByTestId('overruns').locator('li')
    expect(await overruns.count()).toBe(1)
    expect(await overruns.first().textContent()).toMatch(/over$/)
    // The canvas has been drawn on (chart.js ran: not a blank canvas).
    const inked = await page.getByTestId('report-chart-steps').locator('canvas').evaluate((c: HTMLCanvasElement) => {
      const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data
      let n = 0
      for (let i = 3; i < d.length; i += 4) if (d[i]! > 0) n++
      return n
    })
    expect(inked).toBeGreaterThan(1000)
    await page.getByTestId('report-chart-segments').locator('canvas').waitFor()
    await expect(page.getByTestId('range-rule').textContent()).resolves.toMatch(/1 rehearsal has measured/)
    const shot = await screenshot(page, 'rehearsal-report')
    expect(shot).toMatch(/rehearsal-report\.png$/)
    expect(await axeViolations(page)).toEqual([])

    await page.getByTestId('adopt').click()
    await expect(page.getByTestId('adopt-status').filter({ hasText: /^Adopted: \d+ steps? ha(s|ve) a new planned range\.$/ }).waitFor()).resolves.toBeUndefined()
    await page.getByTestId('undo-adopt').waitFor()
    const makespanAfter = await makespanOnPlan(page)
    expect(makespanAfter).not.toBe(makespanBefore)

    await page.goto(url(`/shoots/${shootId}/report`), { waitUntil: 'networkidle' })
    await page.getByTestId('undo-adopt').click()
    await page.getByTestId('adopt-status').filter({ hasText: /^Undone: / }).waitFor()
    expect(await makespanOnPlan(page)).toBe(makespanBefore)

    for (const path of ['/episodes/1/shoots', '/studios/1/shoots']) {
      await page.goto(url(path), { waitUntil: 'networkidle' })
      const row = page.locator(`[data-testid="shoots"] tr[data-shoot-id="${shootId}"]`)
      await row.waitFor()
      expect(await row.getAttribute('data-mode')).toBe('rehearsal')
      expect(await row.getByRole('link', { name: /^Report/ }).getAttribute('href')).toBe(`/shoots/${shootId}/report`)
      expect(await row.getByRole('link', { name: /^Take log/ }).getAttribute('href')).toBe(`/shoots/${shootId}/takes`)
      expect(await axeViolations(page)).toEqual([])
      await screenshot(page, `shoots-list-${path.split('/')[1]}`)
    }
    await page.goto(url('/episodes/1'), { waitUntil: 'networkidle' })
    expect(await page.getByRole('link', { name: 'Shoots', exact: true }).first().getAttribute('href')).toMatch(/\/shoots$/)
    await screenshot(page, 'episode-with-shoots-link')
    expect(violations).toEqual([])
    expect(errors).toEqual([])
  }, 120_000)
})
