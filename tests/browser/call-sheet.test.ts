// The call sheet in the browser: the producer opens it from the episode page, moves the call time
// with the form and sees the run order's starts follow, sends it, and after a change sees what changed; printed, on A4 and on US Letter, every section
// fits the printable width, and the PDF (turned into images by poppler's pdftoppm, its text read by
// pdftotext) holds every crew name and every segment title.
import { execFileSync } from 'node:child_process'
import { mkdirSync, renameSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { demoCrew } from '../../server/db/demo'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { artifactsDir, consoleErrorsOf, openPage, screenshot, signInOnPage } from '../support/page'

// Paper sizes (ISO 216 A4: 210 × 297 mm; ANSI Letter: 8.5 × 11 in) less the sheet's 12 mm margins
// on each side, in CSS pixels (96 to the inch, 25.4 mm to the inch).
const px = (mm: number) => Math.floor((mm / 25.4) * 96)
const PAPER = { A4: px(210 - 24), Letter: px(8.5 * 25.4 - 24) } as const

async function printsWithin(page: Page, width: number) {
  await page.setViewportSize({ width, height: 1100 })
  await page.emulateMedia({ media: 'print' })
  return page.evaluate(() => [...document.querySelectorAll<HTMLElement>('[data-sheet-section], [data-sheet-section] table')].map((el) => {
    const box = el.getBoundingClientRect()
    return { what: el.dataset.sheetSection ?? el.tagName, left: box.left, right: box.right, overflow: el.scrollWidth - el.clientWidth }
  }))
}

function pdfPages(pdf: Buffer, name: string) {
  mkdirSync(artifactsDir, { recursive: true })
  const file = join(artifactsDir, `${name}.pdf`)
  writeFileSync(file, pdf)
  execFileSync('pdftoppm', ['-png', '-r', '72', '-f', '1', '-l', '1', file, join(artifactsDir, `${name}-page`)])
  renameSync(join(artifactsDir, `${name}-page-1.png`), join(artifactsDir, `${name}-1.png`))
  const text = execFileSync('pdftotext', [file, '-']).toString('utf8').replace(/\s+/g, ' ')
  const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [file]).toString('utf8'))?.[1])
  const size = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(execFileSync('pdfinfo', [file]).toString('utf8'))!
  return { text, pages, widthPt: Number(size[1]), heightPt: Number(size[2]) }
}

describe.skipIf(!chromiumAvailable())('call sheet in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('opens from the episode page, follows a new call time, and prints whole on A4 and on Letter', async () => {
    const { page } = await openPage('/signin')
    const consoleErrors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const { episodes } = await page.evaluate(() => fetch('/api/studios/1/episodes').then((r) => r.json())) as { episodes: { id: number; title: string }[] }
    const id = episodes.find((e) => e.title === 'Thursday supper special')!.id
    await page.goto(url(`/episodes/${id}`), { waitUntil: 'networkidle' })
    await page.getByRole('link', { name: 'Call sheet' }).click()
    await page.waitForURL(new RegExp(`/episodes/${id}/call-sheet$`))
    await page.locator('[data-call-sheet]').waitFor()
    expect(await axeViolations(page)).toEqual([])

    // The demo's call: 08:30 on Thursday 10 December, the hospital a blank line for the producer.
    await expect(page.locator('[data-fact="Date"]').textContent()).resolves.toBe('Thursday, 10 December 2026')
    await expect(page.locator('[data-fact="Call"]').textContent()).resolves.toBe('08:30 (Europe/London)')
    expect(await page.getByTestId('hospital-blank').count()).toBe(1)
    const starts = () => page.locator('[data-run-row] td:first-child').allTextContents()
    const first = await starts()
    expect(first[0]).toBe('08:30')

    // The producer moves the call to 08:45: every start moves by 15 minutes.
    await page.getByRole('textbox', { name: 'Call time' }).fill('08:45')
    await page.getByRole('button', { name: 'Save the call sheet' }).click()
    await page.getByRole('status').filter({ hasText: 'Saved.' }).waitFor()
    const moved = (t: string) => {
      const [h, m] = t.split(':').map(Number) as [number, number]
      const total = h * 60 + m + 15
      return `${String(Math.floor(total / 60)).padStart(2, '0')}:${String(total % 60).padStart(2, '0')}`
    }
    await expect.poll(starts).toEqual(first.map(moved))

    // Sent to the crew; then the call moves again, and the page says what changed before the next send.
    await page.getByRole('button', { name: 'Send to the crew' }).click()
    await page.getByRole('status').filter({ hasText: 'Sent to 4 crew members.' }).waitFor()
    await page.getByRole('textbox', { name: 'Call time' }).fill('09:00')
    await page.getByRole('button', { name: 'Save the call sheet' }).click()
    await expect.poll(() => page.getByTestId('call-sheet-changes').locator('li').allTextContents()).toEqual(['Call time: 08:45 → 09:00'])
    expect(await page.getByRole('button', { name: 'Send again to the crew' }).isVisible()).toBe(true)
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'call-sheet')

    // Printed: the form and the send box drop out, every section keeps inside the printable width.
    const segments = await page.locator('[data-run-row] td:nth-child(2)').allTextContents()
    expect(segments.length).toBe(6)
    for (const [format, width] of Object.entries(PAPER) as [keyof typeof PAPER, number][]) {
      const boxes = await printsWithin(page, width)
      expect(boxes.length).toBeGreaterThanOrEqual(8)
      for (const b of boxes) {
        expect(b.left, `${b.what} on ${format}`).toBeGreaterThanOrEqual(0)
        expect(b.right, `${b.what} on ${format}`).toBeLessThanOrEqual(width)
        expect(b.overflow, `${b.what} on ${format}`).toBeLessThanOrEqual(0)
      }
      expect(await page.getByRole('button', { name: 'Save the call sheet' }).isVisible()).toBe(false)
      expect(await page.getByTestId('call-sheet-send').isVisible()).toBe(false)
      const pdf = pdfPages(await page.pdf({ format, printBackground: true }), `call-sheet-${format.toLowerCase()}`)
      // PDF points (1 pt = 1/72 in): A4 is 595.28 × 841.89 pt, Letter 612 × 792 pt; Chromium rounds the page to its
      // own units, so within 2 pt.
      const [w, h] = format === 'A4' ? [595.28, 841.89] : [612, 792]
      expect(Math.abs(pdf.widthPt - w), `page width on ${format}`).toBeLessThanOrEqual(2)
      expect(Math.abs(pdf.heightPt - h), `page height on ${format}`).toBeLessThanOrEqual(2)
      expect(pdf.pages).toBeGreaterThanOrEqual(1)
      expect(pdf.pages).toBeLessThanOrEqual(3)
      for (const c of demoCrew) {
        expect(pdf.text, `${c.name} on ${format}`).toContain(c.name)
        expect(pdf.text, `${c.email} on ${format}`).toContain(c.email)
      }
      for (const s of segments) expect(pdf.text, `${s} on ${format}`).toContain(s)
      expect(pdf.text).toContain('Nearest hospital')
      expect(pdf.text).toContain('Thursday, 10 December 2026')
    }
    await page.emulateMedia({ media: 'screen' })
    expect(consoleErrors).toEqual([])
  })
})
