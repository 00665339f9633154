// "Open a studio" for someone already signed in, in real Chromium: a crew member whose only studio
// let them go finds "No studio yet", opens a studio of their own with the form (a wrong currency is
// marked on its field first, nothing typed is lost) and lands in it as its producer; a member of the
// demo studio opens a second one from the studio page and the header switches between them.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { Client, demo, linkIn, signedIn, uniqueEmail } from '../support/client'
import { screenshot, signInOnPage } from '../support/page'

/** A crew member the demo producer invited and then removed: an account with no studio. */
async function memberWithNoStudio(password: string): Promise<string> {
  const producer = await signedIn(demo.producer)
  const email = uniqueEmail('between-shows')
  expect((await producer.post('/api/studios/1/invites', { email, role: 'camera' })).status).toBe(201)
  const outbox = await producer.get('/api/studios/1/outbox')
  const item = outbox.body.mails.find((m: { to: string }) => m.to.includes(email))
  const mail = (await producer.get(`/api/studios/1/outbox/${item.id}`)).body
  const token = linkIn(mail.text, '/invite/').split('/').pop()
  const guest = new Client()
  const accepted = await guest.post(`/api/invites/${token}/accept`, { name: 'Rosalind Achterberg', password })
  expect(accepted.status).toBe(200)
  const userId = (await guest.get('/api/me')).body.user.id
  expect((await producer.delete(`/api/studios/1/members/${userId}`)).status).toBe(204)
  return email
}

async function fillStudioForm(page: Page, name: string, locale: string, currency: string, timeZone?: string) {
  await page.getByLabel('Studio name').fill(name)
  await page.getByLabel('Language and country').selectOption(locale)
  await page.getByLabel('Currency').selectOption(currency)
  if (timeZone) await page.getByLabel('Time zone').selectOption(timeZone)
}

describe.skipIf(!chromiumAvailable())('opening a studio when signed in', async () => {
  await useBuiltApp({ browser: true })

  it('from "No studio yet": the form, a refused name on its field, then the new studio', async () => {
    const password = 'a kitchen of my own'
    const email = await memberWithNoStudio(password)
    const page = await createPage(undefined, { viewport: { width: 1280, height: 800 } })
    await signInOnPage(page, email, { password, landing: /\/studio$/ })
    await page.getByRole('heading', { name: 'No studio yet' }).waitFor()
    await page.getByRole('link', { name: 'Open a studio' }).click()
    await page.waitForURL(/\/studios\/new$/)
    // The sign-up form is not where a signed-in member is sent.
    await expect(page.getByLabel('Password').count()).resolves.toBe(0)
    await expect(page.getByLabel('Language and country').inputValue()).resolves.toBe('en-GB')
    await expect(page.getByLabel('Currency').inputValue()).resolves.toBe('GBP')
    // Named in words, not codes.
    await expect(page.getByLabel('Currency').locator('option[value="EUR"]').textContent()).resolves.toBe('Euro (EUR)')

    await fillStudioForm(page, '   ', 'nl-NL', 'EUR', 'Europe/Amsterdam')
    await page.getByRole('button', { name: 'Open the studio' }).click()
    const name = page.getByLabel('Studio name')
    await expect.poll(() => name.getAttribute('aria-invalid')).toBe('true')
    await page.getByText(/studio name/i).first().waitFor()
    await expect(page.getByLabel('Currency').inputValue()).resolves.toBe('EUR')
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'open-studio-refused')

    await name.fill('Achterberg Night Kitchen')
    await page.getByRole('button', { name: 'Open the studio' }).click()
    await page.waitForURL(/\/studios\/\d+$/)
    await page.getByRole('heading', { name: 'Achterberg Night Kitchen' }).waitFor()
    await expect(page.getByText('Producer', { exact: true }).count()).resolves.toBeGreaterThan(0)
    await expect(page.locator('header').innerText()).resolves.toContain('Achterberg Night Kitchen')
    const settings = await page.request.get(url(`/api/studios/${page.url().split('/').pop()}`))
    expect(await settings.json()).toMatchObject({ name: 'Achterberg Night Kitchen', locale: 'nl-NL', currency: 'EUR', timeZone: 'Europe/Amsterdam' })
    await screenshot(page, 'open-studio-done')
    await page.close()
  })

  it('from a studio page: a member opens a second studio and the header offers both', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 800 } })
    await signInOnPage(page, demo.host)
    await page.getByRole('link', { name: 'Open another studio' }).click()
    await page.waitForURL(/\/studios\/new$/)
    await fillStudioForm(page, 'Quill Weekend Bakes', 'en-GB', 'GBP')
    await page.getByRole('button', { name: 'Open the studio' }).click()
    await page.waitForURL(/\/studios\/\d+$/)
    await page.getByRole('heading', { name: 'Quill Weekend Bakes' }).waitFor()
    const switcher = page.getByLabel('Studio', { exact: true })
    await expect(switcher.locator('option').allInnerTexts()).resolves.toEqual(['Brackenford Test Kitchen · Host', 'Quill Weekend Bakes · Producer'])
    await page.close()
  })
})
