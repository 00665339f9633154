// A producer makes a join code for a shoot; a tablet opens /join, types it, and lands on that shoot.
import { createPage, url } from '@nuxt/test-utils/e2e'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { insertShoot } from '../support/shoot-row'
import { screenshot, signInOnPage } from '../support/page'

describe.skipIf(!chromiumAvailable())('joining a shoot on a tablet', async () => {
  const { databasePath } = await useBuiltApp({ browser: true })

  it('code with QR and countdown on the desk; typed on the tablet; the tablet sees that shoot only', async () => {
    const shootId = await insertShoot(databasePath, 1, 'Saturday braise rehearsal')
    const desk = await createPage(undefined, { viewport: { width: 1280, height: 800 } })
    await signInOnPage(desk, 'producer@brackenford.test')
    await expect(desk.locator('header').innerText()).resolves.toContain('Brackenford Test Kitchen')
    await desk.goto(url(`/shoots/${shootId}/devices`), { waitUntil: 'networkidle' })
    await desk.getByLabel('Role on the device').selectOption('camera')
    await desk.getByRole('button', { name: 'Make a join code' }).click()
    const code = (await desk.getByTestId('join-code').first().textContent())!.trim()
    expect(code).toMatch(/^[A-Z2-9]{3}-[A-Z2-9]{3}$/)
    await desk.getByRole('img', { name: /QR code that opens/ }).locator('svg').waitFor()
    await desk.getByText(/Expires in (29|30):\d\d/).waitFor()
    // The whole address to type on the device, not "/join".
    await expect(desk.getByTestId('join-address').textContent()).resolves.toBe(url('/join'))
    expect(await axeViolations(desk)).toEqual([])
    await screenshot(desk, 'join-codes')

    const tablet = await createPage(undefined, { viewport: { width: 1024, height: 768 } })
    await tablet.goto(url('/join'), { waitUntil: 'networkidle' })
    await tablet.getByLabel('Join code').fill(code.toLowerCase())
    await tablet.getByRole('button', { name: 'Join the shoot' }).click()
    await tablet.waitForURL(new RegExp(`/shoots/${shootId}/cue$`))
    await expect(tablet.getByTestId('shoot-role').textContent()).resolves.toMatch(/This device is on this shoot as\s+Camera/)
    expect(await axeViolations(tablet)).toEqual([])
    await screenshot(tablet, 'joined-tablet')
    // The tablet has no studio pages.
    const crew = await tablet.goto(url('/api/studios/1/members'))
    expect(crew?.status()).toBe(403)
    await desk.close()
    await tablet.close()
  })
})
