// Every page as a first-time user meets it: the planning pages at laptop size and the three shoot
// screens at the sizes they are used at (the desk on a laptop, the prompter on a tablet, the cue
// screen on a phone). Each page loads without a console error, has its heading, speaks the crew's
// words (no step-text notation, no dotted field names, no codes or settings names to decode, none
// of the retired names) and leaves a screenshot in tests/.artifacts/ to look at.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { chromiumAvailable } from '../support/chromium'
import { sameOrigin, screenshot, signInOnPage } from '../support/page'

const LAPTOP = { width: 1366, height: 768 }
const TABLET = { width: 1024, height: 768 }
const PHONE = { width: 390, height: 844 }

/** What a crew should never have to read. */
const JARGON: [string, RegExp][] = [
  ['step-text notation', /\{\{|\}\}/],
  ['a dotted field name', /\b[a-z]+[A-Z]?[a-z]*\.\d+\.[a-zA-Z]+\b/],
  ['a settings variable', /\bNUXT_[A-Z_]+|HOBLINE_[A-Z_]+/],
  ['a standard\'s number instead of words', /ISO 4217|language tag/i],
  ['a scheduling textbook\'s name', /critical chain|lower bound|\bslack\b/i],
  ['a retired shoot word', /\bAcknowledge\b|Timer due|\bHeld\b|Start a take/],
]

async function visit(page: Page, path: string, name: string) {
  const errors: string[] = []
  const onConsole = (m: { type(): string; text(): string }) => {
    if (m.type() === 'error') errors.push(m.text())
  }
  page.on('console', onConsole)
  const response = await page.goto(url(path), { waitUntil: 'networkidle' })
  expect(response?.status(), path).toBeLessThan(400)
  await page.locator('h1').first().waitFor()
  const text = await page.evaluate(() => document.body.innerText)
  for (const [what, pattern] of JARGON) expect(text.match(pattern)?.[0], `${path} shows ${what}`).toBeUndefined()
  await screenshot(page, `tour-${name}`)
  page.off('console', onConsole)
  expect(errors, path).toEqual([])
}

describe.skipIf(!chromiumAvailable())('every page, as a first-time user meets it', async () => {
  await useBuiltApp({ browser: true })

  it('public pages at laptop size', async () => {
    const page = await createPage(undefined, { viewport: LAPTOP })
    for (const [path, name] of [['/', 'home'], ['/signin', 'signin'], ['/signup', 'signup'], ['/forgot-password', 'forgot-password'],
      ['/join', 'join'], ['/screen-check', 'screen-check']] as const) await visit(page, path, name)
    await page.close()
  })

  it('the producer\'s planning pages at laptop size, and the three shoot screens at their device sizes', async () => {
    const page = await createPage(undefined, { viewport: LAPTOP })
    await signInOnPage(page, 'producer@brackenford.test')
    const studio = new URL(page.url()).pathname
    const pages: [string, string][] = [
      [studio, 'studio'], ['/studio', 'studio-picker'], [`${studio}/recipes`, 'recipes'], [`${studio}/recipes/new`, 'recipe-new'],
      [`${studio}/recipes/import`, 'recipe-import'], ['/recipes/1', 'recipe'], ['/recipes/1/edit', 'recipe-edit'], [`${studio}/episodes`, 'episodes'],
      ['/episodes/1', 'episode'], ['/episodes/1/plan', 'plan'], [`${studio}/prices`, 'prices'], [`${studio}/crew`, 'crew'],
      [`${studio}/settings`, 'settings'], [`${studio}/outbox`, 'outbox'],
    ]
    for (const [path, name] of pages) await visit(page, path, name)

    const created = await page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const { shoot } = await created.json() as { shoot: { id: number } }
    await visit(page, `/shoots/${shoot.id}`, 'shoot-console')
    await visit(page, `/shoots/${shoot.id}/devices`, 'shoot-devices')
    await visit(page, `/shoots/${shoot.id}/screen`, 'shoot-device-settings')
    await visit(page, `/shoots/${shoot.id}/desk`, 'desk-laptop')
    await page.setViewportSize(TABLET)
    await visit(page, `/shoots/${shoot.id}/prompter`, 'prompter-tablet')
    await page.setViewportSize(PHONE)
    await visit(page, `/shoots/${shoot.id}/cue`, 'cue-phone')
    await page.close()
  })
})
