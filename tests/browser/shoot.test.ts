// The live shoot in two browsers: the producer starts a rehearsal of the demo episode and drives
// it, the host follows on a device whose clock is ten minutes off; both show the same time left on
// a timer; a screen that loses the network says so, keeps counting, refuses commands and resyncs.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, sameOrigin, screenshot, signInOnPage, startAtCooking, startTimerOnPage } from '../support/page'

const SKEW_MS = 10 * 60_000
const OFFLINE_MESSAGE = 'Offline: this was not sent. Wait for the connection to come back.'

interface Screen {
  page: Page
  errors: string[]
}

async function signedInScreen(email: string, next: string, viewport: { width: number; height: number }, clockSkewMs = 0): Promise<Screen> {
  const page = await createPage(undefined, { viewport })
  const errors = consoleErrorsOf(page)
  // A device whose own clock is wrong: time still flows, from a start ten minutes ahead.
  if (clockSkewMs) await page.clock.install({ time: Date.now() + clockSkewMs })
  await signInOnPage(page, email, {
    path: `/signin?next=${encodeURIComponent(next)}`,
    landing: (u) => u.pathname === next || (next === '/studio' && u.pathname.startsWith('/studio')),
  })
  return { page, errors }
}

/** Waits until the screen is online with a clock sample taken. */
async function ready(page: Page) {
  await page.locator('[data-testid="connection"]', { hasText: 'Online' }).waitFor()
  await page.waitForFunction(() => (document.querySelector('[data-testid="clock-offset"]') as HTMLElement | null)?.dataset.delayMs !== '')
}

/**
 * What a screen draws for a timer and where its server clock stands, read in one go, with the
 * test's own clock just before and after. The server runs on this machine, so the test's clock is
 * the server clock.
 */
async function probe(page: Page, label: string) {
  const before = Date.now()
  const seen = await page.evaluate((testId) => {
    const row = document.querySelector(`[data-testid="${testId}"]`) as HTMLElement
    const clock = document.querySelector('[data-testid="clock-offset"]') as HTMLElement
    return {
      local: Date.now(),
      offset: Number(clock.dataset.offsetMs),
      deadline: Number(row.dataset.deadline),
      remaining: Number(row.dataset.remainingMs),
      drawnAt: Number(row.dataset.serverNow),
      speed: Number(row.dataset.speed),
    }
  }, `timer-${label}`)
  const after = Date.now()
  return { ...seen, before, after, estimate: seen.local + seen.offset }
}

const attr = (page: Page, testId: string, name: string) => page.getByTestId(testId).first().getAttribute(name)

describe.skipIf(!chromiumAvailable())('the live shoot in two browsers', async () => {
  await useBuiltApp({ browser: true })

  it('drives a rehearsal from one screen, follows it on another, and survives a dropped network', async () => {
    const producer = await signedInScreen('producer@brackenford.test', '/studio', { width: 1280, height: 900 })
    const episodes = await (await producer.page.request.get(url('/api/studios/1/episodes'))).json()
    const created = await producer.page.request.post(url(`/api/episodes/${episodes.episodes[0].id}/shoots`), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const shootId: number = (await created.json()).shoot.id
    // The beats of the cooking: the shoot starts there, past the demo show's intro.
    await startAtCooking(producer.page, shootId)
    const path = `/shoots/${shootId}`

    await producer.page.goto(url(path))
    await ready(producer.page)
    await expect(attr(producer.page, 'shoot-status', 'data-status')).resolves.toBe('ready')
    await expect(producer.page.getByTestId('shoot-mode').textContent()).resolves.toMatch(/Rehearsal\s+at 1×/)

    const host = await signedInScreen('host@brackenford.test', path, { width: 1024, height: 768 }, SKEW_MS)
    await ready(host.page)
    // The host's device is ten minutes fast; its offset says so (RFC 5905 §8, lowest delay of 8, §10).
    const hostOffset = Number(await attr(host.page, 'clock-offset', 'data-offset-ms'))
    expect(hostOffset).toBeGreaterThan(-SKEW_MS - 1000)
    expect(hostOffset).toBeLessThan(-SKEW_MS + 1000)

    // The producer starts the shoot and a 20-minute timer; the host's screen follows.
    await producer.page.getByRole('button', { name: 'Start the shoot' }).click()
    await host.page.locator('[data-testid="shoot-status"][data-status="running"]').waitFor()
    await startTimerOnPage(producer.page, 'Stew simmer', '20')
    await host.page.getByTestId('timer-Stew simmer').waitFor()
    await producer.page.getByTestId('timer-Stew simmer').waitFor()
    // The host has no controls the role may not use: no speed, no end.
    await expect(host.page.getByRole('button', { name: 'End the shoot' }).count()).resolves.toBe(0)
    await expect(host.page.getByRole('group', { name: 'Rehearsal speed' }).count()).resolves.toBe(0)

    // Same time left on both screens within 50 ms, though the host's clock is ten minutes off: each
    // screen draws deadline − (its clock + its offset), and its clock + offset is the server clock.
    const p = await probe(producer.page, 'Stew simmer')
    const h = await probe(host.page, 'Stew simmer')
    expect(h.deadline).toBe(p.deadline)
    expect(p.deadline).toBeGreaterThan(p.before + 19 * 60_000)
    expect(Math.abs(h.local - h.before - SKEW_MS)).toBeLessThan(1000)
    for (const s of [p, h]) {
      // What is drawn comes from the deadline at the server time of the frame (speed 1×), never more
      // than the 20 minutes set.
      expect(s.speed).toBe(1)
      expect(Math.abs(s.remaining - Math.min(20 * 60_000, (s.deadline - s.drawnAt) * s.speed))).toBeLessThanOrEqual(1)
      expect(s.estimate).toBeGreaterThanOrEqual(s.before - 50)
      expect(s.estimate).toBeLessThanOrEqual(s.after + 50)
    }
    const errorOf = (s: typeof p) => s.estimate - (s.before + s.after) / 2
    expect(Math.abs(errorOf(p) - errorOf(h))).toBeLessThan(50)
    await expect(host.page.getByTestId('timer-Stew simmer').getByRole('timer').textContent()).resolves.toMatch(/^\s*(20:00|19:[0-5]\d)\s*$/)

    // The host moves on; the producer's screen follows.
    await host.page.getByRole('button', { name: 'Next step' }).click()
    await producer.page.locator('[data-testid="current-step"][data-step="1"]').waitFor()
    await expect(producer.page.getByTestId('current-step').textContent()).resolves.toBe(await host.page.getByTestId('current-step').textContent())
    await producer.page.getByRole('button', { name: 'Good take' }).click()
    await host.page.getByTestId('marker-good').waitFor()

    // A short timer falls due on every screen and stays due until someone acknowledges it.
    await startTimerOnPage(host.page, 'Flatbread rest', '0.05')
    await producer.page.locator('[data-testid="timer-Flatbread rest"][data-state="due"]').waitFor()
    await host.page.locator('[data-testid="timer-Flatbread rest"][data-state="due"]').waitFor()
    await expect(producer.page.getByTestId('timer-Flatbread rest').getByTestId('timer-state').textContent()).resolves.toMatch(/^\s*Ringing/)
    expect(await axeViolations(producer.page, { aaa: true })).toEqual([])
    expect(await axeViolations(host.page, { aaa: true })).toEqual([])
    await screenshot(producer.page, 'shoot-producer-due')
    await screenshot(host.page, 'shoot-host-due')
    // Nothing runs off the side of the screen.
    for (const page of [producer.page, host.page]) {
      await expect(page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).resolves.toBe(0)
    }
    await host.page.getByRole('button', { name: /^Done\W+Flatbread rest$/ }).click()
    await producer.page.locator('[data-testid="done-timer-Flatbread rest"][data-state="acknowledged"]').waitFor({ state: 'attached' })
    await expect(producer.page.getByTestId('timer-Flatbread rest').count()).resolves.toBe(0)

    // The producer's network drops: the screen says so, keeps counting down, refuses a command.
    const errorsBefore = producer.errors.length
    await producer.page.context().setOffline(true)
    await producer.page.locator('[data-testid="offline-banner"]', { hasText: 'Offline' }).waitFor()
    const stepBefore = await attr(producer.page, 'current-step', 'data-step')
    const first = Number(await attr(producer.page, 'timer-Stew simmer', 'data-remaining-ms'))
    await producer.page.waitForTimeout(1200)
    const second = Number(await attr(producer.page, 'timer-Stew simmer', 'data-remaining-ms'))
    expect(second).toBeLessThan(first)
    await producer.page.getByRole('button', { name: 'Next step' }).click()
    await expect(producer.page.getByTestId('command-error').textContent()).resolves.toBe(OFFLINE_MESSAGE)
    await expect(attr(producer.page, 'command-error', 'data-code')).resolves.toBe('offline')
    await expect(attr(producer.page, 'current-step', 'data-step')).resolves.toBe(stepBefore)
    expect(await axeViolations(producer.page, { aaa: true })).toEqual([])
    await screenshot(producer.page, 'shoot-producer-offline')

    // Meanwhile the host moves on twice; back online, the producer's screen catches up.
    await host.page.getByRole('button', { name: 'Next step' }).click()
    await host.page.locator('[data-testid="current-step"][data-step="2"]').waitFor()
    await host.page.getByRole('button', { name: 'Next step' }).click()
    await host.page.locator('[data-testid="current-step"][data-step="3"]').waitFor()
    await producer.page.context().setOffline(false)
    await producer.page.locator('[data-testid="connection"]', { hasText: 'Online' }).waitFor()
    await producer.page.locator('[data-testid="current-step"][data-step="3"]').waitFor()
    const server = await (await host.page.request.get(url(`/api/shoots/${shootId}`))).json()
    await producer.page.locator(`[data-testid="shoot-seq"]`, { hasText: new RegExp(`^${server.state.seq}$`) }).waitFor({ state: 'attached' })
    await expect(producer.page.getByTestId('offline-banner').count()).resolves.toBe(0)
    await expect(attr(producer.page, 'timer-Stew simmer', 'data-deadline')).resolves.toBe(String(server.state.timers.find((t: { label: string }) => t.label === 'Stew simmer').deadlineServerMs))
    // While offline the browser logs its failed reconnection attempts; nothing else went wrong.
    const offlineErrors = producer.errors.splice(errorsBefore)
    expect(offlineErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|net::ERR_|WebSocket connection/.test(e))).toEqual([])

    // The server's refusal is shown in its own words, and nothing changes: a live timer keeps the
    // shoot from ending.
    await producer.page.getByRole('button', { name: 'End the shoot' }).click()
    // The waits the host reached started their own timers (the run order is the cook plan's), so
    // "Stew simmer" is one of several that still need attention.
    await expect(producer.page.getByTestId('command-error').textContent()).resolves.toMatch(/^\d+ timers still need attention: .*"Stew simmer" \(\d+:\d\d left\)/)
    await expect(attr(producer.page, 'command-error', 'data-code')).resolves.toBe('timers-active')
    await expect(attr(producer.page, 'shoot-status', 'data-status')).resolves.toBe('running')
    // A time the form cannot send is named on the form, not sent.
    await producer.page.getByRole('button', { name: 'Dismiss' }).click()
    await startTimerOnPage(producer.page, 'Squash roast', '0')
    await expect(producer.page.locator('#timer-problem').textContent()).resolves.toMatch(/^How long: write minutes such as 12/)
    await expect(producer.page.getByTestId('timer-Squash roast').count()).resolves.toBe(0)

    expect(producer.errors).toEqual([])
    expect(host.errors).toEqual([])
    await producer.page.close()
    await host.page.close()
  })
})
