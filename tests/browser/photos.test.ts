// Recipe and step photos in the browser: the demo recipe's photo shows; a step photo is added and removed.
import { createPage, url } from '@nuxt/test-utils/e2e'
import sharp from 'sharp'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, screenshot, signInOnPage } from '../support/page'

describe.skipIf(!chromiumAvailable())('photos on the recipe page', async () => {
  await useBuiltApp({ browser: true })

  it('shows the seeded photo, adds a step photo from a file and removes it', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'host@brackenford.test')
    await page.goto(url('/recipes/1'), { waitUntil: 'networkidle' })
    const hero = page.getByRole('img', { name: 'Smoky butter bean and tomato stew' })
    await hero.waitFor()
    // The thumbnail really loaded (480 px WebP made at seeding).
    expect(await hero.evaluate(async (img: HTMLImageElement) => { await img.decode(); return img.naturalWidth })).toBe(480)

    const png = await sharp({ create: { width: 640, height: 400, channels: 3, background: '#c2572a' } }).png().toBuffer()
    const stepOne = page.getByTestId('step-1')
    await stepOne.locator('input[type=file]').setInputFiles({ name: 'onions.png', mimeType: 'image/png', buffer: png })
    const stepPhoto = stepOne.getByRole('img', { name: 'step 1' })
    await stepPhoto.waitFor()
    expect(await stepPhoto.evaluate(async (img: HTMLImageElement) => { await img.decode(); return img.naturalWidth })).toBe(480)
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'recipe-photos')

    // A text file is refused with the server's words, and nothing changes.
    await stepOne.locator('input[type=file]').setInputFiles({ name: 'notes.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('not an image at all') })
    await stepOne.getByRole('alert').waitFor()
    expect(await stepOne.getByRole('alert').textContent()).toMatch(/JPEG, PNG or WebP/)

    await stepOne.getByRole('button', { name: /Remove the photo/ }).click()
    await stepPhoto.waitFor({ state: 'detached' })
    expect(errors.filter((e) => !/415|Unsupported Media Type/.test(e))).toEqual([])
    await page.close()
  })
})
