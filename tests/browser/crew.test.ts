// A producer opens a studio, invites a camera operator, reads the invite in the outbox, and the
// camera operator accepts it in a second browser and signs in — all in real Chromium.
import { createPage, url } from '@nuxt/test-utils/e2e'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { uniqueEmail } from '../support/client'
import { offHost, screenshot } from '../support/page'

describe.skipIf(!chromiumAvailable())('crew in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('sign up → invite → outbox → accept in a second browser → sign in as the new member', async () => {
    const producerEmail = uniqueEmail('producer')
    const cameraEmail = uniqueEmail('camera')
    const requests: string[] = []

    const producer = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    producer.on('request', (r) => requests.push(r.url()))
    const consoleErrors: string[] = []
    producer.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()))
    await producer.goto(url('/signup'), { waitUntil: 'networkidle' })
    await producer.getByLabel('Your name').fill('Oona Revell')
    await producer.getByLabel('E-mail').fill(producerEmail)
    await producer.getByLabel('Password').fill('a steady long password')
    await producer.getByLabel('Studio name').fill('Larchmere Kitchen')
    await producer.getByRole('button', { name: 'Open the studio' }).click()
    await producer.waitForURL(/\/studios\/\d+$/)
    await expect(producer.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Larchmere Kitchen')

    await producer.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Crew' }).click()
    await producer.waitForURL(/\/crew$/)
    await producer.getByLabel('E-mail to invite').fill(cameraEmail)
    await producer.getByLabel('Role', { exact: true }).selectOption('camera')
    await producer.getByRole('button', { name: 'Send invite' }).click()
    await producer.getByText(`Invite sent to ${cameraEmail}.`).waitFor()
    await producer.getByTestId(`invite-${cameraEmail}`).waitFor()
    expect(await axeViolations(producer)).toEqual([])
    await screenshot(producer, 'crew')
    // "Your sessions": ending every other session keeps this one signed in (the outbox below still opens).
    await producer.getByRole('button', { name: 'Sign out everywhere else' }).click()
    await producer.getByRole('status').filter({ hasText: 'Signed out on every other browser and device. This one stays signed in.' }).waitFor()

    await producer.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click()
    await producer.waitForURL(/\/outbox/)
    await producer.getByText(`To ${cameraEmail}`).first().waitFor()
    await producer.getByRole('button', { name: 'Plain text' }).click()
    const text = await producer.getByLabel('The plain-text part of the mail').textContent()
    const link = /https?:\/\/\S+\/invite\/[\w-]+/.exec(text ?? '')?.[0]
    expect(link, 'the invite link in the mail').toBeTruthy()
    await producer.getByRole('button', { name: 'As the recipient sees it' }).click()
    await producer.locator('iframe').waitFor()
    expect(await axeViolations(producer)).toEqual([])
    await screenshot(producer, 'outbox')

    // The camera operator, in a browser of their own (no shared cookies).
    const camera = await createPage(undefined, { viewport: { width: 820, height: 1180 } })
    camera.on('request', (r) => requests.push(r.url()))
    await camera.goto(new URL(new URL(link!).pathname, url('/')).toString(), { waitUntil: 'networkidle' })
    await camera.getByText('Larchmere Kitchen').first().waitFor()
    await camera.getByLabel('Your name').fill('Jory Tamsett')
    await camera.getByLabel('Password').fill('framing the shot')
    await camera.getByRole('button', { name: 'Join Larchmere Kitchen' }).click()
    await camera.waitForURL(/\/studios\/\d+$/)
    await camera.getByText('Camera', { exact: true }).first().waitFor()

    // Sign out and back in with the new account.
    await camera.getByRole('button', { name: 'Sign out' }).click()
    await camera.waitForURL(/\/signin/)
    expect(await axeViolations(camera)).toEqual([])
    await screenshot(camera, 'signin')
    await camera.getByLabel('E-mail').fill(cameraEmail)
    await camera.getByLabel('Password').fill('framing the shot')
    await camera.getByRole('button', { name: 'Sign in' }).click()
    await camera.waitForURL(/\/studios\/\d+$/)
    await expect(camera.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Larchmere Kitchen')
    // A camera operator sees the crew but not the invites, and no outbox link.
    await camera.goto(url(new URL(camera.url()).pathname + '/crew'), { waitUntil: 'networkidle' })
    await camera.getByTestId(`member-${cameraEmail}`).waitFor()
    expect(await camera.getByRole('heading', { name: 'Invites' }).count()).toBe(0)
    expect(await camera.getByRole('link', { name: 'Outbox' }).count()).toBe(0)

    // The producer's crew list now shows them.
    await producer.goto(url(new URL(producer.url()).pathname.replace(/\/outbox.*/, '/crew')), { waitUntil: 'networkidle' })
    await producer.getByTestId(`member-${cameraEmail}`).waitFor()
    expect(offHost(requests)).toEqual([])
    // Server and browser render the same page: no hydration mismatch, no other error.
    expect(consoleErrors).toEqual([])
    await producer.close()
    await camera.close()
  })
})
