// The publish kit in the browser: a recording of the demo episode is chosen on the kit page, the
// description shows its chapters, the stew is published at a chosen address; a signed-out browser
// opens that page (photo, cost, allergens, JSON-LD with the video's Clips); an address nothing is
// published at answers 404.
import { createPage, url } from '@nuxt/test-utils/e2e'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, sameOrigin, screenshot, signInOnPage } from '../support/page'

describe.skipIf(!chromiumAvailable())('the publish kit', async () => {
  await useBuiltApp({ browser: true })

  it('chooses a recording, publishes the stew, and a signed-out browser opens its page; an unpublished address is 404', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const me = await (await page.request.get(url('/api/me'))).json()
    const episodes = (await (await page.request.get(url(`/api/studios/${me.memberships[0].studioId}/episodes`))).json()).episodes
    const episodeId = episodes.find((e: { title: string }) => e.title === 'Thursday supper special').id
    // A short recording: roll, start, a few steps, stop, end.
    const made = await (await page.request.post(url(`/api/episodes/${episodeId}/shoots`), { data: { mode: 'take' }, headers: sameOrigin() })).json()
    const shootId = made.shoot.id
    const command = async (data: object) => {
      const r = await page.request.post(url(`/api/shoots/${shootId}/commands`), { data, headers: sameOrigin() })
      expect(r.status(), await r.text()).toBe(200)
    }
    await command({ type: 'rolling.set', rolling: true })
    await command({ type: 'shoot.start' })
    for (let i = 0; i < 10; i++) {
      await page.waitForTimeout(150)
      await command({ type: 'step.next' })
    }
    await command({ type: 'rolling.set', rolling: false })
    await command({ type: 'shoot.end', cancelTimers: true })

    await page.goto(url(`/episodes/${episodeId}`), { waitUntil: 'networkidle' })
    await page.getByRole('link', { name: 'Publish kit' }).click()
    await page.waitForURL(/\/publish$/)
    await page.getByLabel('Recording', { exact: true }).selectOption(String(shootId))
    await page.getByLabel('Video address').fill('https://video.example/watch?v=thursday')
    await page.getByRole('button', { name: 'Save', exact: true }).click()
    const description = page.getByTestId('video-description')
    await expect.poll(() => description.inputValue()).toContain('Chapters\n0:00 ')
    expect(await description.inputValue()).toMatch(/Smoky butter bean and tomato stew\n£0\.92 a serving \(£1\.11 with the optional parsley\)/)

    const stew = page.locator('[data-publish-recipe]').filter({ hasText: 'Smoky butter bean and tomato stew' })
    await stew.getByLabel('Address').fill('thursday-stew')
    await stew.getByRole('button', { name: 'Publish' }).click()
    await stew.getByTestId('published-at').waitFor()
    expect(await stew.getByTestId('published-at').textContent()).toContain('/r/thursday-stew')
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'publish-kit')

    // Signed out: a new browser context with no session.
    const visitor = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const visitorErrors = consoleErrorsOf(visitor)
    const opened = await visitor.goto(url('/r/thursday-stew'), { waitUntil: 'networkidle' })
    expect(opened?.status()).toBe(200)
    await visitor.getByRole('heading', { level: 1, name: 'Smoky butter bean and tomato stew' }).waitFor()
    expect(await visitor.getByTestId('public-cost').textContent()).toBe('£0.92 a serving (£1.11 with the optional parsley)')
    const photo = visitor.getByRole('img', { name: /as served/ })
    expect(await photo.evaluate(async (img: HTMLImageElement) => { await img.decode(); return img.naturalWidth })).toBeGreaterThan(0)
    const ld = JSON.parse(await visitor.locator('script[type="application/ld+json"]').first().textContent() ?? '{}')
    expect(ld['@type']).toBe('Recipe')
    expect(ld.video.hasPart.length).toBeGreaterThan(0)
    expect(ld.video.hasPart[0].url).toMatch(/^https:\/\/video\.example\/watch\?v=thursday&t=\d+$/)
    expect(await visitor.getByText(/Follow your local food-safety rules/).count()).toBe(1)
    expect(await axeViolations(visitor)).toEqual([])
    await screenshot(visitor, 'public-recipe')

    const missing = await visitor.goto(url('/r/nothing-published-here'), { waitUntil: 'networkidle' })
    expect(missing?.status()).toBe(404)
    await visitor.getByRole('heading', { name: 'This page is not on the run order' }).waitFor()
    expect(visitorErrors.filter((e) => !/404|Not Found/.test(e))).toEqual([])
    expect(errors).toEqual([])
    await visitor.close()
    await page.close()
  })
})
