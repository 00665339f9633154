// Fault: a shoot screen off the network for a whole minute while timers run. The host's prompter
// in real Chromium loses its network (Playwright's context.setOffline: the browser's own offline
// emulation, navigator.onLine false, no socket can reconnect) for 60 s. Meanwhile the producer
// adds a minute to the running timer, starts another and moves on. The prompter must keep counting
// down on its own clock, refuse a key pressed while offline at once (never keeping it to send
// later), and once back resync to the server's state; the event log (shoot_events) then holds the
// offline key press zero times, and the same key pressed online once. The file passes SQLite's
// check (https://www.sqlite.org/pragma.html#pragma_integrity_check).
import { createPage } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { chromiumAvailable } from '../support/chromium'
import { demo, signedIn } from '../support/client'
import { consoleErrorsOf, signInOnPage } from '../support/page'
import { integrityCheck, queryFile } from '../support/sqlite'

const OFFLINE_MS = 60_000
const OFFLINE_MESSAGE = 'Offline: this was not sent. Wait for the connection to come back.'

/** What the page draws for a timer tile, and when (its own server-clock reading). */
const tile = (page: Page, label: string) => page.getByTestId(`tile-${label}`).evaluate((el: HTMLElement) => ({
  remaining: Number(el.dataset.remainingMs), drawnAt: Number(el.dataset.serverNow), deadline: Number(el.dataset.deadline),
}))

describe.skipIf(!chromiumAvailable())('a screen offline for a minute while timers run', async () => {
  const { databasePath } = await useBuiltApp({ browser: true })

  it('keeps counting, refuses what is pressed offline, resyncs, and applies no command twice', async () => {
    const producer = await signedIn(demo.producer)
    const episodes = (await producer.get('/api/studios/1/episodes')).body.episodes
    const shootId: number = (await producer.post(`/api/episodes/${episodes[0].id}/shoots`, { mode: 'rehearsal' })).body.shoot.id
    const command = async (body: Record<string, unknown>) => {
      const r = await producer.post(`/api/shoots/${shootId}/commands`, body)
      expect(r.status, JSON.stringify(r.body)).toBe(200)
      return r.body.seq as number
    }
    await command({ type: 'shoot.start' })
    await command({ type: 'timer.start', timerId: 'stock', label: 'Stock reduce', durationMs: 4 * 60_000 })
    const hostMarkers = async () => (await queryFile<{ seq: number; command: string }>(databasePath,
      `SELECT seq, command FROM shoot_events WHERE shoot_id = ${shootId} AND type = 'marker.add' AND json_extract(actor, '$.role') = 'host'`))

    const page = await createPage(undefined, { viewport: { width: 1024, height: 768 } })
    const errors = consoleErrorsOf(page)
    const prompter = `/shoots/${shootId}/prompter`
    await signInOnPage(page, demo.host, { path: `/signin?next=${encodeURIComponent(prompter)}`, landing: (u) => u.pathname === prompter })
    await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
    await page.waitForFunction(() => (document.querySelector('[data-testid="shoot-screen"]') as HTMLElement | null)?.dataset.delayMs !== '')
    await page.getByTestId('tile-Stock reduce').waitFor()

    // The network goes.
    await page.context().setOffline(true)
    const offAt = Date.now()
    await page.getByTestId('offline-banner').waitFor()
    const first = await tile(page, 'Stock reduce')
    const samples = [{ at: Date.now(), ...first }]

    // 20 s in, the producer changes things the prompter cannot hear.
    await page.waitForTimeout(20_000)
    samples.push({ at: Date.now(), ...(await tile(page, 'Stock reduce')) })
    await command({ type: 'timer.addTime', timerId: 'stock', deltaMs: 60_000 })
    await command({ type: 'timer.start', timerId: 'onion', label: 'Onion sweat', durationMs: 3 * 60_000 })
    const serverSeq = await command({ type: 'step.next' })

    // 30 s in, the host presses "f" (mark a flub): refused at once, nothing kept to send later.
    await page.waitForTimeout(10_000)
    await page.keyboard.press('f')
    await expect(page.getByTestId('command-error').textContent()).resolves.toBe(OFFLINE_MESSAGE)
    await expect(page.getByTestId('command-error').getAttribute('data-code')).resolves.toBe('offline')
    samples.push({ at: Date.now(), ...(await tile(page, 'Stock reduce')) })

    // The rest of the minute.
    await page.waitForTimeout(Math.max(0, OFFLINE_MS - (Date.now() - offAt)))
    samples.push({ at: Date.now(), ...(await tile(page, 'Stock reduce')) })
    await expect(page.getByTestId('offline-banner').count()).resolves.toBe(1)
    await expect(page.getByTestId('tile-Onion sweat').count()).resolves.toBe(0)

    // It kept counting on its own clock: each reading is down by the real time passed (±1.5 s; a
    // frame is drawn at most 20 times a second), with the deadline it had.
    for (const s of samples.slice(1)) {
      expect(s.deadline).toBe(first.deadline)
      expect(Math.abs((first.remaining - s.remaining) - (s.at - samples[0]!.at))).toBeLessThan(1500)
    }
    console.log(`[faults] offline ${Math.round((Date.now() - offAt) / 1000)} s: the prompter's countdown went ${first.remaining} → ${samples.at(-1)!.remaining} ms`)

    // Back online: it resyncs to the server's state (the minute added, the new timer, the next step).
    await page.context().setOffline(false)
    await page.getByTestId('offline-banner').waitFor({ state: 'detached', timeout: 20_000 })
    await page.locator(`[data-testid="shoot-screen"][data-seq="${serverSeq}"]`).waitFor()
    await page.getByTestId('tile-Onion sweat').waitFor()
    const server = (await producer.get(`/api/shoots/${shootId}`)).body.state
    const stock = server.timers.find((t: { id: string }) => t.id === 'stock')
    const after = await tile(page, 'Stock reduce')
    expect(after.deadline).toBe(stock.deadlineServerMs)
    expect(after.deadline - first.deadline).toBe(60_000)
    expect(Math.abs(after.remaining - (stock.deadlineServerMs - after.drawnAt))).toBeLessThanOrEqual(1)
    expect(Math.abs(after.remaining - (stock.deadlineServerMs - Date.now()))).toBeLessThan(1500)

    // The key pressed offline was never applied; pressed again online, it is applied once.
    expect(await hostMarkers()).toEqual([])
    await page.keyboard.press('f')
    await expect.poll(async () => (await hostMarkers()).length, { timeout: 10_000 }).toBe(1)
    await page.waitForTimeout(2000)
    const marks = await hostMarkers()
    expect(marks).toHaveLength(1)
    expect(JSON.parse(marks[0]!.command)).toMatchObject({ type: 'marker.add', kind: 'flub' })
    const events = await queryFile<{ seq: number }>(databasePath, `SELECT seq FROM shoot_events WHERE shoot_id = ${shootId} ORDER BY seq`)
    expect(events.map((e) => e.seq)).toEqual(Array.from({ length: events.length }, (_, i) => i + 1))

    // While offline the browser logs its failed reconnection attempts; nothing else went wrong.
    expect(errors.filter((e) => !/ERR_INTERNET_DISCONNECTED|net::ERR_|WebSocket connection/.test(e))).toEqual([])
    await page.close()
    expect(await integrityCheck(databasePath)).toBe('ok')
  })
})
