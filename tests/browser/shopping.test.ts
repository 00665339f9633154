// The demo episode's shopping list on two devices: a producer and a host (two browser contexts) tick
// items and each sees the other's tick within a few seconds (the page polls every 2 s). Printed on
// A4 and on US Letter (Chromium's PDF, pages turned into images with poppler's pdftoppm): no
// navigation, and every line's text is in the PDF, none cut off at the page's edge.
import { execFileSync } from 'node:child_process'
import { mkdirSync, writeFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { artifactsDir, consoleErrorsOf, sameOrigin, signInOnPage } from '../support/page'

async function member(email: string) {
  const page = await createPage(undefined, { viewport: { width: 1100, height: 900 } })
  const errors = consoleErrorsOf(page)
  await signInOnPage(page, email)
  return { page, errors }
}

const row = (page: Page, key: string) => page.locator(`[data-line="${key}"]`)
const tickedState = (page: Page, key: string) => row(page, key).getAttribute('data-ticked')

async function waitTicked(page: Page, key: string, state: 'yes' | 'no', within = 6000) {
  await page.locator(`[data-line="${key}"][data-ticked="${state}"]`).waitFor({ timeout: within })
}

/** A4 and Letter in CSS pixels (96 per inch), less the page's 12 mm margins on each side. */
const PRINTABLE_WIDTH = { A4: (210 - 24) / 25.4 * 96, Letter: 8.5 * 96 - (24 / 25.4) * 96 }

describe.skipIf(!chromiumAvailable())('shopping list in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('two devices tick items and see each other; prints on A4 and Letter without cut-off rows', async () => {
    const producer = await member('producer@brackenford.test')
    const host = await member('host@brackenford.test')
    const { episodes } = await producer.page.evaluate(() => fetch('/api/studios/1/episodes').then((r) => r.json())) as { episodes: { id: number; title: string }[] }
    const id = episodes.find((e) => e.title === 'Thursday supper special')!.id

    // From the episode page's link row to the list.
    await producer.page.goto(url(`/episodes/${id}`), { waitUntil: 'networkidle' })
    await producer.page.getByRole('link', { name: 'Shopping list' }).click()
    await producer.page.waitForURL(new RegExp(`/episodes/${id}/shopping$`))
    await host.page.goto(url(`/episodes/${id}/shopping`), { waitUntil: 'networkidle' })
    for (const p of [producer.page, host.page]) {
      await expect(p.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Shopping list: Thursday supper special')
      expect(await tickedState(p, 'garlic')).toBe('no')
    }
    expect(await axeViolations(producer.page)).toEqual([])
    await expect(producer.page.getByTestId('basket-total').textContent()).resolves.toBe('£20.85')

    // The producer ticks garlic: the host's page shows it within a few seconds, and the reverse for the lemon.
    const started = Date.now()
    await producer.page.getByLabel(/^garlic/).check()
    await waitTicked(producer.page, 'garlic', 'yes')
    await waitTicked(host.page, 'garlic', 'yes')
    expect(Date.now() - started).toBeLessThan(6000)
    await host.page.getByLabel(/^lemon/).check()
    await waitTicked(producer.page, 'lemon', 'yes')
    await expect(host.page.getByTestId('ticked-count').textContent()).resolves.toBe('2 of 16 ticked')
    await expect(producer.page.getByTestId('ticked-count').textContent()).resolves.toBe('2 of 16 ticked')
    await host.page.getByLabel(/^garlic/).uncheck()
    await waitTicked(producer.page, 'garlic', 'no')

    // Printed: the header and buttons are gone, every row lies within the printable width.
    const keys = await producer.page.locator('[data-line]').evaluateAll((els) => els.map((e) => e.getAttribute('data-line')!))
    expect(keys).toHaveLength(16)
    const items = await producer.page.locator('[data-line] label').evaluateAll((els) => els.map((e) => e.textContent!.split('—')[0]!.trim()))
    mkdirSync(artifactsDir, { recursive: true })
    for (const format of ['A4', 'Letter'] as const) {
      await producer.page.setViewportSize({ width: Math.floor(PRINTABLE_WIDTH[format]), height: 1000 })
      await producer.page.emulateMedia({ media: 'print' })
      expect(await producer.page.locator('header').first().isVisible()).toBe(false)
      expect(await producer.page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false)
      for (const key of keys) {
        const box = (await row(producer.page, key).boundingBox())!
        expect(box.x).toBeGreaterThanOrEqual(0)
        expect(box.x + box.width, `${key} within the ${format} width`).toBeLessThanOrEqual(PRINTABLE_WIDTH[format] + 0.5)
      }
      const pdf = await producer.page.pdf({ format, printBackground: true })
      const name = `shopping-${format === 'A4' ? 'a4' : 'letter'}`
      const file = resolve(artifactsDir, `${name}.pdf`)
      writeFileSync(file, pdf)
      execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', '-singlefile', file, resolve(artifactsDir, `${name}-1`)])
      const text = execFileSync('pdftotext', ['-layout', file, '-']).toString().replace(/\s+/g, ' ')
      for (const item of items) expect(text, `${item} printed on ${format}`).toContain(item)
      expect(text).toContain('Basket (whole packages): £20.85')
      expect(text).not.toContain('Download CSV')
      await producer.page.emulateMedia({ media: 'screen' })
    }

    // Leave the demo as it was.
    await producer.page.request.put(url(`/api/episodes/${id}/shopping/checks/lemon`), { data: { ticked: false }, headers: sameOrigin() })
    expect([...producer.errors, ...host.errors]).toEqual([])
  })

  it('the prep list opens from the shopping list, in the cook plan\'s order', async () => {
    const { page, errors } = await member('camera@brackenford.test')
    const { episodes } = await page.evaluate(() => fetch('/api/studios/1/episodes').then((r) => r.json())) as { episodes: { id: number; title: string }[] }
    const id = episodes.find((e) => e.title === 'Thursday supper special')!.id
    await page.goto(url(`/episodes/${id}/shopping`), { waitUntil: 'networkidle' })
    expect(await page.getByLabel(/^garlic/).isDisabled()).toBe(true) // camera reads, does not tick
    await page.getByRole('link', { name: 'Prep list' }).click()
    await page.waitForURL(new RegExp(`/episodes/${id}/prep$`))
    const api = await page.evaluate((e) => fetch(`/api/episodes/${e}/prep`).then((r) => r.json()), id) as { tasks: { key: string; neededAt: number }[] }
    const shown = await page.locator('[data-prep]').evaluateAll((els) => els.map((e) => e.getAttribute('data-prep')))
    expect(shown).toEqual(api.tasks.map((t) => t.key))
    expect(api.tasks[0]!.neededAt).toBe(0)
    expect(shown).toContain('onion')
    expect(await axeViolations(page)).toEqual([])
    expect(errors).toEqual([])
  })
})
