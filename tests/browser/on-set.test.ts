// On set over the studio's own network, in real Chromium reaching the laptop by a name that is not
// localhost (hobline.test, mapped to 127.0.0.1 by Chromium's host resolver rules). Over plain http a
// prompter says it holds no wake lock and hears no voice, and why (W3C Secure Contexts: the Screen
// Wake Lock API, getUserMedia and service workers are [SecureContext]). Over https with a certificate
// from the studio's own authority (trusted here by its key's SPKI hash, as a device that installed the
// root would) the wake lock is held, voice is offered, the service worker controls the page, and the
// web app manifest passes Chromium's own installability check (DevTools protocol
// Page.getAppManifest / Page.getInstallabilityErrors). With the server stopped for 20 s the prompter
// shows its last state under the reconnecting banner, also after a reload served by the service
// worker, and takes the server's state again when it is back.
import { mkdtempSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { serverPort, tempDatabasePath } from '../support/app'
import { axeViolations } from '../support/axe'
import { CHROMIUM_ARGS, CHROMIUM_PATH, chromiumAvailable } from '../support/chromium'
import { DEMO_PASSWORD, screenshot } from '../support/page'
import { startOnSetServer, TEST_HOST, type OnSetServer } from '../support/on-set-server'
import { certificateFingerprint, ensureLocalCertificates, spkiHash } from '../../server/tls/local-ca'

const LAPTOP = { width: 1280, height: 800 }
const TABLET = { width: 1024, height: 768 }
const OUTAGE_MS = 20_000

const tls = ensureLocalCertificates(mkdtempSync(join(tmpdir(), 'hobline-tls-')), [TEST_HOST])

/** A request sent by the page itself (Node's side cannot resolve the test host name): status and body. */
async function inPage(page: Page, path: string, body?: unknown): Promise<{ status: number; type: string; text: string }> {
  return page.evaluate(async ({ path, body }) => {
    const init = body === undefined ? {} : { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }
    const r = await fetch(path, init)
    return { status: r.status, type: r.headers.get('content-type') ?? '', text: await r.text() }
  }, { path, body })
}

/** The producer signs in on the laptop, makes a rehearsal of the demo episode at its cooking, and a host join code. */
async function shootWithHostCode(browser: Browser, base: string) {
  const laptop = await browser.newContext({ viewport: LAPTOP })
  const page = await laptop.newPage()
  await page.goto(`${base}/signin`, { waitUntil: 'networkidle' })
  await page.getByLabel('E-mail').fill('producer@brackenford.test')
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(/\/studios\/\d+$/)
  const created = await inPage(page, '/api/episodes/1/shoots', { mode: 'rehearsal' })
  expect(created.status, created.text).toBe(201)
  const shootId: number = JSON.parse(created.text).shoot.id
  const snapshot = JSON.parse((await inPage(page, `/api/shoots/${shootId}`)).text)
  const cook = (snapshot.state.runOrder as { stepIds: string[] }[]).findIndex((s) => s.stepIds.length > 0)
  const jump = async (step: number) => {
    const r = await inPage(page, `/api/shoots/${shootId}/commands`, { type: 'step.jump', segment: cook, step })
    expect(r.status, r.text).toBe(200)
  }
  await jump(0)
  const code = await inPage(page, `/api/shoots/${shootId}/join-codes`, { role: 'host' })
  expect(code.status, code.text).toBe(201)
  return { laptop, shootId, jump, code: JSON.parse(code.text).code as string }
}

/** A tablet joins with the code and lands on the prompter. */
async function hostTablet(browser: Browser, base: string, shootId: number, code: string) {
  const context = await browser.newContext({ viewport: TABLET })
  const page = await context.newPage()
  const errors: string[] = []
  page.on('pageerror', (e) => errors.push(String(e)))
  await page.goto(`${base}/join?code=${code}`)
  await page.waitForURL(new RegExp(`/shoots/${shootId}/prompter$`))
  await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
  return { context, page, errors }
}

/** The test host name maps to 127.0.0.1, and the device trusts the studio's certificate (Chromium accepts this key's certificate as valid). */
const chromiumArgs = () => [
  ...CHROMIUM_ARGS,
  `--host-resolver-rules=MAP ${TEST_HOST} 127.0.0.1`,
  `--ignore-certificate-errors-spki-list=${spkiHash(readFileSync(tls.key, 'utf8'))}`,
]

const atStep = (page: Page, step: number) => page.locator(`[data-testid="current-step"][data-step="${step}"]`).first().waitFor({ timeout: 20_000 })

describe.skipIf(!chromiumAvailable())('on set over the studio network', () => {
  let browser: Browser
  const servers: OnSetServer[] = []
  const contexts: BrowserContext[] = []

  beforeAll(async () => {
    browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: chromiumArgs() })
  })
  afterAll(async () => {
    for (const c of contexts) await c.close().catch(() => {})
    await browser?.close()
    for (const s of servers) await s.stop()
  })

  it('over plain http: the prompter says it holds no wake lock and hears no voice, and why', async () => {
    const server = await startOnSetServer({ port: await serverPort(), databasePath: tempDatabasePath('on-set-http') })
    servers.push(server)
    const { laptop, shootId, code } = await shootWithHostCode(browser, server.base)
    contexts.push(laptop)
    const host = await hostTablet(browser, server.base, shootId, code)
    contexts.push(host.context)
    const page = host.page
    expect(await page.evaluate(() => ({ secure: window.isSecureContext, wakeLock: 'wakeLock' in navigator, sw: 'serviceWorker' in navigator })))
      .toEqual({ secure: false, wakeLock: false, sw: false })
    const awake = page.getByTestId('awake')
    await expect.poll(() => awake.getAttribute('data-way')).not.toBe('starting')
    expect(await awake.getAttribute('data-way')).not.toBe('wake-lock')
    // The way it is kept awake (nosleep.js's video, played without a touch under the test's autoplay flag) and why.
    expect(await awake.textContent()).toMatch(/silent looping video, as the browser gives the screen wake lock only on a secure \(https\) address/)
    const notice = page.getByTestId('insecure-notice')
    await expect(notice.textContent()).resolves.toMatch(/not secure \(plain http\)/)
    await expect(page.getByTestId('insecure-wake-lock').textContent()).resolves.toMatch(/screen wake lock/)
    await expect(page.getByTestId('insecure-voice').textContent()).resolves.toMatch(/microphone only on a secure address/)
    await expect(page.getByTestId('insecure-install').textContent()).resolves.toMatch(/installed on the home screen/)
    await expect(page.getByTestId('voice-unavailable').textContent()).resolves.toMatch(/only on a secure \(https\) address/)
    expect(await page.getByTestId('voice').count()).toBe(0)
    expect(await axeViolations(page, { aaa: true })).toEqual([])
    await screenshot(page, 'on-set-http-prompter')

    // The trust page is linked from the notice and says this server hands out no certificate.
    await page.getByRole('link', { name: 'How to put this device on the secure address' }).click()
    await page.waitForURL(/\/on-set$/)
    await page.getByTestId('no-root').waitFor()
    expect(await axeViolations(page)).toEqual([])
    expect(host.errors).toEqual([])
  }, 120_000)

  describe('over the studio https address', () => {
    let server: OnSetServer
    let port: number
    let databasePath: string

    beforeAll(async () => {
      port = await serverPort()
      databasePath = tempDatabasePath('on-set-https')
      server = await startOnSetServer({ port, databasePath, tls })
      servers.push(server)
    })

    it('holds the wake lock, offers voice, registers the service worker; the manifest is installable; the root is offered', async () => {
      const { laptop, shootId, code } = await shootWithHostCode(browser, server.base)
      contexts.push(laptop)
      const host = await hostTablet(browser, server.base, shootId, code)
      contexts.push(host.context)
      const page = host.page
      expect(await page.evaluate(() => window.isSecureContext)).toBe(true)
      await page.locator('[data-testid="awake"][data-way="wake-lock"][data-held="true"]').waitFor()
      await expect(page.getByTestId('awake').textContent()).resolves.toMatch(/stays awake \(screen wake lock\)/)
      await page.getByTestId('voice-toggle').waitFor()
      expect(await page.getByTestId('insecure-notice').count()).toBe(0)
      expect(await page.getByTestId('voice-unavailable').count()).toBe(0)
      const worker = await page.evaluate(async () => (await navigator.serviceWorker.ready).active?.scriptURL)
      expect(worker).toBe(`${server.base}/sw.js`)

      expect(await axeViolations(page, { aaa: true })).toEqual([])
      await screenshot(page, 'on-set-https-prompter')

      // Chromium's installability check runs in a profile of its own (an incognito context is never installable).
      const profile = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'hobline-profile-')), { executablePath: CHROMIUM_PATH, args: chromiumArgs() })
      const installed = profile.pages()[0] ?? await profile.newPage()
      await installed.goto(`${server.base}/join`, { waitUntil: 'networkidle' })
      await installed.evaluate(async () => navigator.serviceWorker.ready)
      const cdp = await profile.newCDPSession(installed)
      const manifest = await cdp.send('Page.getAppManifest') as { url: string; errors: unknown[]; data?: string; parsed?: unknown }
      expect(manifest.url).toBe(`${server.base}/manifest.webmanifest`)
      expect(manifest.errors).toEqual([])
      expect(JSON.parse(manifest.data!)).toMatchObject({ name: 'Hobline', display: 'fullscreen', start_url: '/join' })
      const installability = await cdp.send('Page.getInstallabilityErrors')
      expect(installability.installabilityErrors).toEqual([])
      // The icons the manifest names are there, in their sizes.
      for (const icon of JSON.parse(manifest.data!).icons as { src: string; sizes: string }[]) {
        expect((await inPage(installed, icon.src)).type, icon.src).toBe('image/png')
      }
      await profile.close()

      // The trust page offers the studio root, with the fingerprint the laptop printed.
      await page.goto(`${server.base}/on-set`, { waitUntil: 'networkidle' })
      await expect(page.getByTestId('root-fingerprint').textContent()).resolves.toBe(certificateFingerprint(readFileSync(tls.rootCert, 'utf8')))
      await expect(page.getByTestId('on-set-status').textContent()).resolves.toMatch(/already trusts this address/)
      const root = await inPage(page, '/api/trust/root')
      expect(root.type).toBe('application/x-x509-ca-cert')
      expect(root.text).toBe(readFileSync(tls.rootCert, 'utf8'))
      expect(await axeViolations(page)).toEqual([])
      expect(host.errors).toEqual([])
    }, 120_000)

    it('with the server stopped for 20 s the prompter shows its last state and reconnects, then resyncs', async () => {
      const { laptop, shootId, code, jump } = await shootWithHostCode(browser, server.base)
      contexts.push(laptop)
      const host = await hostTablet(browser, server.base, shootId, code)
      contexts.push(host.context)
      const page = host.page
      // Controlled by the service worker, and the prompter taken once through it (so it is kept).
      await page.evaluate(async () => navigator.serviceWorker.ready)
      await page.reload({ waitUntil: 'networkidle' })
      expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL)).toBe(`${server.base}/sw.js`)
      await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
      await jump(1)
      await atStep(page, 1)
      // The state is kept on the device (written at most once a second).
      await page.waitForTimeout(1500)

      await server.stop()
      const stoppedAt = Date.now()
      const banner = page.locator('[data-testid="offline-banner"][data-reconnecting="true"]')
      await banner.waitFor({ timeout: 10_000 })
      await expect(banner.textContent()).resolves.toMatch(/Reconnecting to the laptop… This screen shows the last state it had, from \d+:\d\d ago/)
      await atStep(page, 1)
      // The API is never answered from a cache: with the server gone, a request fails.
      expect(await page.evaluate(() => fetch('/api/health').then((r) => `answered ${r.status}`, () => 'failed'))).toBe('failed')

      // Reopened while the laptop is unreachable: the kept page, the last state kept on the device, the banner.
      await page.reload()
      await banner.waitFor({ timeout: 15_000 })
      await atStep(page, 1)
      await screenshot(page, 'on-set-reconnecting')
      await page.waitForTimeout(Math.max(0, OUTAGE_MS - (Date.now() - stoppedAt)))
      await atStep(page, 1)
      expect(await banner.count()).toBe(1)

      server = await startOnSetServer({ port, databasePath, tls })
      servers.push(server)
      await page.locator('[data-testid="connection"][data-online="true"]').waitFor({ timeout: 30_000 })
      await page.getByTestId('offline-banner').waitFor({ state: 'detached' })
      // Live again: a step moved on the laptop reaches the prompter.
      await jump(2)
      await atStep(page, 2)
      expect(host.errors).toEqual([])
    }, 180_000)
  })
})
