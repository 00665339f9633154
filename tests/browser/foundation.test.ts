// The look in real Chromium: shipped font, nothing fetched from outside, no serious axe violations.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { offHost, openPage, screenshot } from '../support/page'

describe.skipIf(!chromiumAvailable())('foundation screens in Chromium', async () => {
  await useBuiltApp({ browser: true })

  it('home page renders in Atkinson Hyperlegible from the app itself, with no outside request', async () => {
    const { page, response, requests } = await openPage('/')
    expect(response?.status()).toBe(200)
    const fonts = await page.evaluate(async () => {
      await document.fonts.ready
      return {
        check: document.fonts.check('700 16px "Atkinson Hyperlegible"') && document.fonts.check('16px "Atkinson Hyperlegible"'),
        loaded: [...document.fonts].filter((f) => f.family.replace(/"/g, '') === 'Atkinson Hyperlegible' && f.status === 'loaded').length,
        body: getComputedStyle(document.body).fontFamily,
      }
    })
    expect(fonts.check).toBe(true)
    expect(fonts.loaded).toBeGreaterThanOrEqual(1)
    expect(fonts.body).toContain('Atkinson Hyperlegible')
    expect(requests.some((r) => /atkinson-hyperlegible.*\.woff2/.test(r))).toBe(true)
    expect(offHost(requests)).toEqual([])
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'home')
    await page.close()
  })

  it('screen check page uses the set look and meets AAA contrast', async () => {
    const { page, requests } = await openPage('/screen-check', { width: 1024, height: 768 })
    const bg = await page.evaluate(() => getComputedStyle(document.querySelector('main')!.parentElement!).backgroundColor)
    expect(bg).toBe('rgb(15, 19, 24)')
    expect(offHost(requests)).toEqual([])
    expect(await axeViolations(page, { aaa: true })).toEqual([])
    await screenshot(page, 'screen-check')
    // The same size names and every contrast theme the device settings offer.
    for (const name of ['Large', 'Larger', 'Very large', 'Huge']) await page.locator('[data-testid^="size-"]', { hasText: name }).first().waitFor()
    await expect(page.locator('[data-testid^="size-"]').count()).resolves.toBe(4)
    await expect(page.locator('input[name="theme"]').count()).resolves.toBe(3)
    // Running is mint on the check page, as it is on every running timer.
    await expect(page.getByTestId('colour-mint').textContent()).resolves.toContain('Running')
    await page.getByLabel('Light (daylight)').check()
    await expect.poll(() => page.evaluate(() => document.documentElement.dataset.setTheme)).toBe('day')
    expect(await axeViolations(page, { aaa: true })).toEqual([])
    await screenshot(page, 'screen-check-day')
    await page.close()
  })

  it('404 page is in the same look and offers the way back', async () => {
    const { page, response } = await openPage('/no-such-page')
    expect(response?.status()).toBe(404)
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('not on the run order')
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'not-found')
    await page.getByRole('button', { name: 'Back to the start page' }).click()
    await page.waitForURL((u) => u.pathname === '/')
    await page.close()
  })
})
