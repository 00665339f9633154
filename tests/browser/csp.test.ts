// Every screen runs under the content security policy (DEVELOPERS.md, "Security headers") with no
// violation: the planning pages (with a recipe photo and a mail in the outbox's frame), the control
// desk, the prompter with voice commands and full screen, the cue screen and the join page, in real Chromium. A violation is caught twice: the
// `securitypolicyviolation` event (W3C CSP Level 3, §5.3), reported from every document the page
// opens, and the console message Chromium writes for it. The Permissions-Policy is read back from the
// document (microphone and full screen for the app itself, no camera), and full screen really opens.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { chromiumAvailable } from '../support/chromium'
import { sameOrigin, signInOnPage, startAtCooking } from '../support/page'

const LAPTOP = { width: 1280, height: 800 }
const TABLET = { width: 1024, height: 768 }

interface Watched { page: Page; violations: string[]; websockets: string[] }

/** A page that records every CSP violation (event and console) and every WebSocket it opens. */
async function watchedPage(viewport: { width: number; height: number }): Promise<Watched> {
  const page = await createPage(undefined, { viewport })
  const violations: string[] = []
  const websockets: string[] = []
  await page.exposeFunction('__reportCspViolation', (text: string) => violations.push(text))
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      const report = (window as unknown as { __reportCspViolation: (t: string) => void }).__reportCspViolation
      void report(`${location.pathname}: ${e.effectiveDirective} blocked ${e.blockedURI || '(inline)'} at ${e.sourceFile}:${e.lineNumber}`)
    })
  })
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect|frame|evaluate|create)/i.test(m.text())) violations.push(`console: ${m.text()}`)
  })
  page.on('websocket', (ws) => websockets.push(ws.url()))
  return { page, violations, websockets }
}

/** Opens a path and waits for it to settle; the answer must carry the app's policy. */
async function visit(page: Page, path: string) {
  const response = await page.goto(url(path), { waitUntil: 'networkidle' })
  expect(response?.status(), path).toBe(200)
  expect(response?.headers()['content-security-policy'], path).toMatch(/frame-ancestors 'none'/)
}

/** Online, joined, with a clock sample taken (as in screens.test.ts). */
async function ready(page: Page) {
  await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
  await page.waitForFunction(() => (document.querySelector('[data-testid="shoot-screen"]') as HTMLElement | null)?.dataset.delayMs !== '')
}

/** What the document's permissions policy allows this page (Chromium's document.featurePolicy). */
const allows = (page: Page, features: string[]) => page.evaluate((names) => {
  const policy = (document as unknown as { featurePolicy: { allowsFeature(f: string): boolean } }).featurePolicy
  return Object.fromEntries(names.map((n) => [n, policy.allowsFeature(n)]))
}, features)

describe.skipIf(!chromiumAvailable())('no screen breaks the content security policy', async () => {
  await useBuiltApp({ browser: true })

  it('planning pages, desk, prompter with voice and full screen, cue and join: no violation', async () => {
    const producer = await watchedPage(LAPTOP)
    await signInOnPage(producer.page, 'producer@brackenford.test')
    const studioPath = new URL(producer.page.url()).pathname
    // An invite, so that the outbox shows a mail in its sandboxed frame (inline styles, under the policy).
    const studioId = Number(studioPath.split('/').pop())
    const invited = await producer.page.request.post(url(`/api/studios/${studioId}/invites`), { data: { email: 'csp-check@example.test', role: 'camera' }, headers: sameOrigin() })
    expect(invited.status()).toBe(201)
    // The planning pages (the recipe page shows the demo photo, through /api/photos).
    for (const path of ['/', '/studio', studioPath, `${studioPath}/recipes`, '/recipes/1', '/episodes/1', '/episodes/1/plan', `${studioPath}/crew`, `${studioPath}/outbox`]) {
      await visit(producer.page, path)
    }
    await producer.page.goto(url(`${studioPath}/outbox`), { waitUntil: 'networkidle' })
    const mailFrame = producer.page.frameLocator('iframe[title^="The mail"]')
    // The mail's button keeps its inline style (white text on paprika; server/mail/templates.ts).
    await expect.poll(() => mailFrame.locator('a').first().evaluate((a) => getComputedStyle(a).color)).toBe('rgb(255, 255, 255)')
    await producer.page.goto(url('/recipes/1'), { waitUntil: 'networkidle' })
    const hero = producer.page.getByRole('img', { name: 'Smoky butter bean and tomato stew' })
    expect(await hero.evaluate(async (img: HTMLImageElement) => { await img.decode(); return img.naturalWidth })).toBeGreaterThan(0)

    // The control desk of a new rehearsal: the socket, the sounds, a join code with its QR code.
    const created = await producer.page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    expect(created.ok()).toBe(true)
    const shootId: number = (await created.json()).shoot.id
    // The beats of the cooking: the shoot starts there, past the demo show's intro.
    await startAtCooking(producer.page, shootId)
    await visit(producer.page, `/shoots/${shootId}/desk`)
    await ready(producer.page)
    const codes: string[] = []
    for (const role of ['host', 'camera'] as const) {
      await producer.page.getByLabel('Device for').selectOption(role)
      await producer.page.getByRole('button', { name: 'Make a join code' }).click()
      await producer.page.getByTestId('join-code').nth(codes.length).waitFor()
      codes.push((await producer.page.getByTestId('join-code').first().textContent())!.trim())
    }
    await producer.page.getByRole('img', { name: /QR code that opens/ }).first().locator('svg').waitFor()
    // socket.io went on from long-polling to a WebSocket on the app's own host (connect-src 'self').
    await expect.poll(() => producer.websockets.filter((w) => new URL(w).host === new URL(url('/')).host && w.includes('/socket.io/'))).not.toEqual([])

    // The host's tablet: the join page, then the prompter; voice commands on, then full screen.
    const host = await watchedPage(TABLET)
    await visit(host.page, '/join')
    await host.page.getByLabel('Join code').fill(codes[0]!)
    await host.page.getByRole('button', { name: 'Join the shoot' }).click()
    await host.page.waitForURL(new RegExp(`/shoots/${shootId}/prompter$`))
    await ready(host.page)
    expect(await allows(host.page, ['microphone', 'fullscreen', 'camera', 'geolocation'])).toEqual({ microphone: true, fullscreen: true, camera: false, geolocation: false })
    const voice = host.page.getByTestId('voice-toggle')
    await voice.click()
    await expect.poll(() => voice.getAttribute('aria-pressed')).toBe('true')
    await host.page.getByRole('button', { name: 'Full screen' }).click()
    await expect.poll(() => host.page.evaluate(() => document.fullscreenElement !== null)).toBe(true)
    await host.page.getByRole('button', { name: 'Leave full screen' }).click()
    await expect.poll(() => host.page.evaluate(() => document.fullscreenElement === null)).toBe(true)

    // The camera's phone: the cue screen.
    const camera = await watchedPage(TABLET)
    await camera.page.goto(url(`/join?code=${codes[1]}`))
    await camera.page.waitForURL(new RegExp(`/shoots/${shootId}/cue$`))
    await ready(camera.page)

    // The host starts the shoot and moves a step: every screen redraws under the policy.
    await host.page.getByRole('button', { name: 'Start the shoot', exact: true }).click()
    await producer.page.locator('[data-testid="shoot-status"][data-status="running"]').waitFor()
    await host.page.keyboard.press('PageDown')
    for (const s of [producer, host, camera]) await s.page.locator('[data-testid="current-step"][data-step="1"]').first().waitFor()

    for (const s of [producer, host, camera]) {
      expect(s.violations).toEqual([])
      await s.page.close()
    }
  }, 180_000)

  it('notices a violation when there is one (the listener works)', async () => {
    const probe = await watchedPage(LAPTOP)
    await visit(probe.page, '/')
    // What injected markup would try: an inline event handler, and an image from another site.
    await probe.page.evaluate(() => {
      document.body.insertAdjacentHTML('beforeend', '<img alt="" src="data:," onerror="window.__injected = true">')
      new Image().src = 'https://images-elsewhere.example/pixel.png'
    })
    await expect.poll(() => probe.violations.filter((v) => !v.startsWith('console:')).length).toBeGreaterThanOrEqual(2)
    const reported = probe.violations.join('\n')
    expect(reported).toMatch(/script-src-attr blocked/)
    expect(reported).toMatch(/img-src blocked https:\/\/images-elsewhere\.example/)
    await expect(probe.page.evaluate(() => (window as unknown as { __injected?: boolean }).__injected)).resolves.toBeUndefined()
    await probe.page.close()
  })
})
