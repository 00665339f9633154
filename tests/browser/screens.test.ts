// The three shoot screens on one shoot, as a crew uses them: the producer's control desk on a
// laptop makes join codes; the host's tablet and the camera's phone join with them and land on the
// prompter and the cue screen. Keys on the host's tablet move every screen; a timer started on the
// desk shows the same time everywhere; when it is due while the camera rolls, the desk rings aloud
// and the host's tablet only flashes (quiet on set); acknowledging on the tablet silences all; a
// reload and a dropped network lose nothing.
import { createPage, url } from '@nuxt/test-utils/e2e'
import { chromium, type Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { CHROMIUM_ARGS, CHROMIUM_PATH, chromiumAvailable } from '../support/chromium'
import { DEMO_PASSWORD, sameOrigin, screenshot, signInOnPage, startAtCooking, startTimerOnPage } from '../support/page'
import type { ShootSnapshot } from '../../shared/types/socket-events'
import { stepTimerLabel } from '../../shared/utils/key-map'

const LAPTOP = { width: 1280, height: 800 }
const TABLET = { width: 1024, height: 768 }
const PHONE = { width: 390, height: 844 }

interface Screen { page: Page; errors: string[] }

async function screen(viewport: { width: number; height: number }): Promise<Screen> {
  const page = await createPage(undefined, { viewport })
  const errors: string[] = []
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text())
  })
  page.on('pageerror', (e) => errors.push(String(e)))
  return { page, errors }
}

/** Online, joined, with a clock sample taken. */
async function ready(page: Page) {
  await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
  await page.waitForFunction(() => (document.querySelector('[data-testid="shoot-screen"]') as HTMLElement | null)?.dataset.delayMs !== '')
}

const stepOf = (page: Page) => page.locator('[data-testid="current-step"]').first().getAttribute('data-step')
const atStep = (page: Page, step: number) => page.locator(`[data-testid="current-step"][data-step="${step}"]`).first().waitFor()

/** Whether any of howler's sounds in the page is playing, read from howler itself. */
const howlerPlaying = (page: Page) => page.evaluate(() => {
  const howler = (window as unknown as { Howler?: { _howls: Array<{ playing(): boolean; _src: string | string[] }> } }).Howler
  return (howler?._howls ?? []).filter((h) => h.playing()).map((h) => String(h._src))
})
const alarmMode = (page: Page) => page.evaluate(() => document.documentElement.dataset.alarm ?? '')

/** Buttons, links and form controls on screen smaller than 44 × 44 CSS px (WCAG 2.2 SC 2.5.5, AAA). */
const smallTargets = (page: Page) => page.evaluate(() => [...document.querySelectorAll('button, a[href], input, select, summary')]
  .filter((el) => {
    const r = el.getBoundingClientRect()
    const style = getComputedStyle(el)
    return r.width > 0 && r.height > 0 && style.visibility !== 'hidden' && (r.width < 44 || r.height < 44)
  })
  .map((el) => `${el.tagName.toLowerCase()} "${(el.textContent ?? '').trim().slice(0, 30)}" ${Math.round(el.getBoundingClientRect().width)}×${Math.round(el.getBoundingClientRect().height)}`))

/** What a page draws for a timer, with the server time of that frame and its own clock reading. */
const drawn = (page: Page, selector: string, attr: string) => page.evaluate(([sel, a]) => {
  const el = document.querySelector(sel!) as HTMLElement
  const shell = document.querySelector('[data-testid="shoot-screen"]') as HTMLElement
  return { left: Number(el.dataset[a!]), drawnAt: Number(el.dataset.serverNow), estimate: Date.now() + Number(shell.dataset.offsetMs) }
}, [selector, attr])

describe.skipIf(!chromiumAvailable())('prompter, cue screen and control desk on one shoot', async () => {
  await useBuiltApp({ browser: true })

  it('joins devices, moves every screen from the host\'s keys, rings quietly on set and recovers', async () => {
    // The producer signs in on the laptop and starts a rehearsal of the demo episode.
    const desk = await screen(LAPTOP)
    await signInOnPage(desk.page, 'producer@brackenford.test')
    const created = await desk.page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    const shootId: number = (await created.json()).shoot.id
    // The beats of the cooking: the shoot starts there, past the demo show's intro.
    await startAtCooking(desk.page, shootId)
    await desk.page.goto(url(`/shoots/${shootId}/desk`), { waitUntil: 'networkidle' })
    await ready(desk.page)

    // Join codes for the tablet and the phone, made on the desk.
    const codes: Record<string, string> = {}
    for (const role of ['host', 'camera'] as const) {
      await desk.page.getByLabel('Device for').selectOption(role)
      await desk.page.getByRole('button', { name: 'Make a join code' }).click()
      await desk.page.getByTestId('join-code').nth(Object.keys(codes).length).waitFor()
      codes[role] = (await desk.page.getByTestId('join-code').first().textContent())!.trim()
    }
    await desk.page.getByRole('img', { name: /QR code that opens/ }).first().locator('svg').waitFor()

    // /join on each device goes straight to the screen of its role.
    const host = await screen(TABLET)
    await host.page.goto(url(`/join?code=${codes.host}`))
    await host.page.waitForURL(new RegExp(`/shoots/${shootId}/prompter$`))
    await ready(host.page)
    const camera = await screen(PHONE)
    await camera.page.goto(url('/join'), { waitUntil: 'networkidle' })
    await camera.page.getByLabel('Join code').fill(codes.camera!)
    await camera.page.getByRole('button', { name: 'Join the shoot' }).click()
    await camera.page.waitForURL(new RegExp(`/shoots/${shootId}/cue$`))
    await ready(camera.page)
    const all = [desk, host, camera]

    // The host starts the shoot from the tablet; PageDown (a clicker's key) moves every screen.
    await host.page.getByRole('button', { name: 'Start the shoot', exact: true }).click()
    await desk.page.locator('[data-testid="shoot-status"][data-status="running"]').waitFor()
    await expect(stepOf(host.page)).resolves.toBe('0')
    await host.page.keyboard.press('PageDown')
    for (const s of all) await atStep(s.page, 1)
    // The run order is the cook plan's: what each beat shows is read from the shoot the server made.
    const snapshot = async () => (await desk.page.request.get(url(`/api/shoots/${shootId}`))).json() as Promise<ShootSnapshot>
    const made = await snapshot()
    const order = made.state.runOrder.flatMap((r) => r.stepIds)
    const stepAt = (i: number) => made.steps[order[i]!]!
    // The step's amounts are scaled in the studio's units on the prompter (the first amount of the
    // first step that has one, as the server scaled it).
    const amounts = stepAt(1).segments.filter((x) => x.ingredientKey).map((x) => x.text)
    await expect(host.page.getByTestId('amount').allTextContents()).resolves.toEqual(amounts)
    // The camera sees the shot of this step and the next cue.
    await expect(camera.page.getByTestId('cue-shot').textContent()).resolves.toContain(stepAt(1).cameraShot ?? 'Wide, as set')
    await expect(camera.page.getByTestId('cue-next').textContent()).resolves.toContain(stepAt(2).cameraShot ?? 'Hold the shot')

    // Remap on the tablet: the pedal's key "j" now means next step.
    await host.page.getByRole('link', { name: 'This device' }).click()
    await host.page.getByTestId('device-settings').waitFor()
    await host.page.getByRole('button', { name: 'Assign a key to Next step' }).click()
    await host.page.keyboard.press('j')
    await expect(host.page.getByTestId('keys-next').textContent()).resolves.toContain('J')
    expect(await axeViolations(host.page, { aaa: true })).toEqual([])
    await host.page.getByRole('link', { name: 'Back to the shoot' }).click()
    await host.page.waitForURL(new RegExp(`/shoots/${shootId}/prompter$`))
    await ready(host.page)
    await host.page.keyboard.press('j')
    for (const s of all) await atStep(s.page, 2)

    // A 20-minute timer started on the desk: every screen draws the same time left (within 50 ms).
    await startTimerOnPage(desk.page, 'Beans simmer', '20')
    await host.page.getByTestId('tile-Beans simmer').waitFor()
    const deskTimer = await drawn(desk.page, '[data-testid="timer-Beans simmer"]', 'remainingMs')
    const hostTimer = await drawn(host.page, '[data-testid="tile-Beans simmer"]', 'remainingMs')
    const timerId = await camera.page.locator('[data-testid="stand-by"] li[data-kind="timer"]').first().getAttribute('data-id')
    expect(timerId).toBeTruthy()
    const camTimer = await drawn(camera.page, `[data-testid="stand-by"] li[data-id="${timerId}"]`, 'inMs')
    // left + drawnAt is the deadline each screen counts to; the three agree within 50 ms.
    const ends = [deskTimer, hostTimer, camTimer].map((d) => d.left + d.drawnAt)
    expect(Math.max(...ends) - Math.min(...ends)).toBeLessThan(50)
    expect(deskTimer.left).toBeGreaterThan(19 * 60_000)
    for (const d of [deskTimer, hostTimer, camTimer]) expect(Math.abs(d.estimate - Date.now())).toBeLessThan(1000)

    // Screens, then rolling: the camera rolls, all count in 3-2-1.
    await camera.page.getByTestId('roll-toggle').click()
    await host.page.getByTestId('count-in').waitFor()
    await host.page.getByTestId('count-in').waitFor({ state: 'detached', timeout: 5000 })
    for (const s of all) await expect(s.page.getByTestId('shoot-rolling').getAttribute('data-rolling')).resolves.toBe('true')

    // A 3-second timer falls due while rolling: the desk rings aloud; the tablet and phone flash only.
    await startTimerOnPage(desk.page, 'Flatbread flip', '0.05')
    // In its last minute the tile turns urgent; when due it shows done (and flashes).
    await host.page.locator('[data-testid="tile-Flatbread flip"][data-urgent="true"]').waitFor()
    await host.page.getByTestId('alarm-flash').waitFor({ timeout: 10_000 })
    await host.page.locator('[data-testid="tile-Flatbread flip"][data-state="due"]').waitFor()
    // Its own slot's sound (the waits the host reached hold slots of their own).
    const flip = (await snapshot()).state.timers.find((t) => t.label === 'Flatbread flip')!
    await expect.poll(() => howlerPlaying(desk.page), { timeout: 5000 }).toContainEqual(expect.stringContaining(`/sounds/alarm-slot-${flip.slot + 1}.wav`))
    await expect.poll(() => alarmMode(desk.page)).toBe('sound+flash')
    // At this device's volume (the default, 80 %).
    await expect(desk.page.evaluate(() => (window as unknown as { Howler: { volume(): number } }).Howler.volume())).resolves.toBeCloseTo(0.8, 5)
    await expect.poll(() => alarmMode(host.page)).toBe('flash')
    await expect.poll(() => alarmMode(camera.page)).toBe('flash')
    await expect(howlerPlaying(host.page)).resolves.toEqual([])
    await expect(howlerPlaying(camera.page)).resolves.toEqual([])
    await expect(host.page.getByTestId('alarm-reason').textContent()).resolves.toMatch(/^Quiet on set/)
    await screenshot(host.page, 'screens-prompter-alarm-while-rolling')

    // The host acknowledges with the key ("a"): every screen goes quiet and stops flashing.
    await host.page.keyboard.press('a')
    for (const s of all) {
      await s.page.getByTestId('alarm-flash').waitFor({ state: 'detached' })
      await expect.poll(() => alarmMode(s.page)).toBe('')
    }
    await expect.poll(() => howlerPlaying(desk.page)).toEqual([])

    // The host starts this step's timer with its key ("t"): the step's longest time, on every
    // screen, named after the step (the first words of its text).
    const here = stepAt(2)
    expect(here.durationMax ?? here.durationMin, 'the demo run order\'s third beat has a time').not.toBeNull()
    const longest = (here.durationMax ?? here.durationMin)! * 1000
    const words = stepTimerLabel(here.text).replace(/…$/, '').split(' ').slice(0, 3).join(' ')
    await host.page.keyboard.press('t')
    const stepTimer = desk.page.locator(`[data-testid^="timer-${words}"]`)
    await stepTimer.waitFor()
    expect(Number(await stepTimer.getAttribute('data-remaining-ms'))).toBeGreaterThan(longest - 10_000)
    expect(Number(await stepTimer.getAttribute('data-remaining-ms'))).toBeLessThanOrEqual(longest)
    await host.page.locator(`[data-testid^="tile-${words}"]`).waitFor()

    // A reload of the tablet returns to the same step and the same timer deadline.
    const deadline = await host.page.getByTestId('tile-Beans simmer').getAttribute('data-deadline')
    await host.page.reload({ waitUntil: 'networkidle' })
    await ready(host.page)
    await atStep(host.page, 2)
    await expect(host.page.getByTestId('tile-Beans simmer').getAttribute('data-deadline')).resolves.toBe(deadline)

    // The tablet drops off the network: it says so; the desk moves on; back online it catches up.
    await host.page.context().setOffline(true)
    await host.page.getByTestId('offline-banner').waitFor()
    await expect(host.page.getByTestId('offline-banner').textContent()).resolves.toMatch(/^\s*Offline\./)
    await desk.page.getByRole('button', { name: 'Next step' }).click()
    await atStep(desk.page, 3)
    await host.page.context().setOffline(false)
    await host.page.getByTestId('offline-banner').waitFor({ state: 'detached', timeout: 15_000 })
    await atStep(host.page, 3)

    // Markers from the phone land in the desk's take log.
    await camera.page.getByTestId('mark-flub').click()
    await desk.page.getByTestId('log-flub').waitFor()
    await host.page.keyboard.press('f')
    await expect.poll(() => desk.page.getByTestId('log-flub').count()).toBe(2)

    // Accessibility: no serious violations (AAA contrast on set screens); touch targets of 44 px.
    for (const s of all) expect(await axeViolations(s.page, { aaa: true })).toEqual([])
    expect(await smallTargets(host.page)).toEqual([])
    expect(await smallTargets(camera.page)).toEqual([])

    // The key help on every screen.
    for (const s of all) {
      await s.page.keyboard.press('?')
      await s.page.getByTestId('key-help').waitFor()
      expect(await axeViolations(s.page, { aaa: true })).toEqual([])
      await s.page.keyboard.press('Escape')
      await s.page.getByTestId('key-help').waitFor({ state: 'hidden' })
    }

    // Screenshots: each screen at laptop, tablet and phone sizes; the prompter mirrored as well.
    for (const [name, s] of [['desk', desk], ['prompter', host], ['cue', camera]] as const) {
      for (const [size, viewport] of [['laptop', LAPTOP], ['tablet', TABLET], ['phone', PHONE]] as const) {
        await s.page.setViewportSize(viewport)
        await screenshot(s.page, `screens-${name}-${size}`)
      }
    }
    await host.page.setViewportSize({ width: 768, height: 1024 })
    await screenshot(host.page, 'screens-prompter-tablet-portrait')
    await host.page.evaluate(() => {
      const key = 'hobline:device-settings'
      localStorage.setItem(key, JSON.stringify({ ...JSON.parse(localStorage.getItem(key) ?? '{}'), mirror: true }))
    })
    await host.page.reload({ waitUntil: 'networkidle' })
    await host.page.locator('[data-testid="prompter"][data-mirror="true"]').waitFor()
    const flipped = await host.page.getByTestId('prompter').evaluate((el) => getComputedStyle(el).transform)
    expect(flipped).toMatch(/^matrix\(-1, 0, 0, 1,/)
    for (const [size, viewport] of [['laptop', LAPTOP], ['tablet', TABLET], ['phone', PHONE]] as const) {
      await host.page.setViewportSize(viewport)
      await screenshot(host.page, `screens-prompter-${size}-mirrored`)
    }

    // Nothing due is silent everywhere: with the desk gone, no screen rings while rolling, so the
    // host's tablet rings after all, and says why.
    expect(desk.errors).toEqual([])
    await desk.page.close()
    const started = await host.page.request.post(url(`/api/shoots/${shootId}/commands`), { data: { type: 'timer.start', label: 'Lentils check', durationMs: 2000 }, headers: sameOrigin() })
    expect(started.status()).toBe(200)
    await expect.poll(() => howlerPlaying(host.page), { timeout: 8000 }).not.toEqual([])
    await expect.poll(() => alarmMode(host.page)).toBe('sound+flash')
    await expect(host.page.getByTestId('alarm-reason').textContent()).resolves.toMatch(/^No device on set is set to ring while rolling/)
    await expect(howlerPlaying(camera.page)).resolves.toEqual([])
    await host.page.keyboard.press('a')
    await expect.poll(() => howlerPlaying(host.page)).toEqual([])

    // Voice commands show only where the browser recognises speech: here it does; without it, not.
    await camera.page.getByTestId('voice').waitFor()
    const deaf = await createPage(undefined, { viewport: PHONE })
    await deaf.context().addCookies(await camera.page.context().cookies())
    await deaf.addInitScript(() => {
      delete (window as unknown as Record<string, unknown>).SpeechRecognition
      delete (window as unknown as Record<string, unknown>).webkitSpeechRecognition
    })
    await deaf.goto(url(`/shoots/${shootId}/cue`), { waitUntil: 'networkidle' })
    await ready(deaf)
    await expect(deaf.getByTestId('voice').count()).resolves.toBe(0)
    await deaf.close()

    for (const s of [host, camera]) expect(s.errors).toEqual([])
    for (const s of [host, camera]) await s.page.close()
  }, 120_000)

  it('asks for one tap where the browser keeps the page silent, and rings after it', async () => {
    // Chromium's own autoplay policy (no flag): an audio context stays suspended until the user acts.
    const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS.filter((a) => !a.startsWith('--autoplay-policy')) })
    try {
      const page = await browser.newPage({ viewport: LAPTOP })
      const errors: string[] = []
      page.on('console', (m) => m.type() === 'error' && errors.push(m.text()))
      expect((await page.request.post(url('/api/auth/login'), { data: { email: 'producer@brackenford.test', password: DEMO_PASSWORD }, headers: sameOrigin() })).status()).toBe(200)
      const shootId: number = (await (await page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'take' }, headers: sameOrigin() })).json()).shoot.id
      await page.goto(url(`/shoots/${shootId}/desk`), { waitUntil: 'networkidle' })
      await page.getByTestId('sound-blocked').waitFor({ timeout: 5000 })
      await expect(page.evaluate(() => (window as unknown as { Howler: { ctx: AudioContext } }).Howler.ctx.state)).resolves.toBe('suspended')
      expect(await axeViolations(page, { aaa: true })).toEqual([])
      await page.getByRole('button', { name: 'Let this screen ring' }).click()
      await page.getByTestId('sound-blocked').waitFor({ state: 'detached', timeout: 5000 })
      await expect(page.evaluate(() => (window as unknown as { Howler: { ctx: AudioContext } }).Howler.ctx.state)).resolves.toBe('running')
      expect(errors).toEqual([])
    } finally {
      await browser.close()
    }
  }, 60_000)
})
