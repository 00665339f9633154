// A rehearsal of the demo episode at 32× with the three screens open, run from the cook plan: the
// host only presses Next when a hands-on beat's planned end comes, starts a wait when its cue says
// "now" and calls each timer done when it rings. The prompter records, with a MutationObserver and
// its own server clock, the moment each "start it" cue turns due; the test checks it against the
// live plan's start for that wait (within 1 s of shoot clock), that the cue screen's stand-by names
// the next timer, and that the shoot ends within 5 % of the plan's makespan. A second rehearsal
// overruns one hands-on step by 3 minutes: the later cues and the projected finish move on all
// three screens.
import { appendFileSync, writeFileSync } from 'node:fs'
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { beforeAll, describe, expect, it } from 'vitest'
import type { ShootState } from '../../shared/types/shoot'
import { dueTimersAt } from '../../shared/utils/alarm-policy'
import { shootPositions, shootCursorRef } from '../../shared/utils/shoot'
import { shootClockAt } from '../../shared/utils/shoot-clock'
import { upcomingWaits } from '../../shared/utils/shoot-cues'
import { isShootTimerLive } from '../../shared/utils/shoot-timers'
import { shootPlanStep, stepTimerOf } from '../../shared/utils/shoot-waits'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { DEMO_PASSWORD, consoleErrorsOf, sameOrigin, screenshot } from '../support/page'

const SPEED = 32
const MIN = 60_000

interface Screen { page: Page; errors: string[] }
interface CueFlip { id: string; atMs: number; serverMs: number }

/** A page signed in as `email` (through the sign-in route: the form is tested elsewhere), at `path`. */
async function signedIn(email: string, path: string | null, viewport: { width: number; height: number }): Promise<Screen> {
  const page = await createPage(undefined, { viewport })
  const errors = consoleErrorsOf(page)
  expect((await page.request.post(url('/api/auth/login'), { data: { email, password: DEMO_PASSWORD }, headers: sameOrigin() })).status()).toBe(200)
  if (path) await page.goto(url(path), { waitUntil: 'networkidle' })
  return { page, errors }
}

async function ready(page: Page) {
  await page.locator('[data-testid="connection"][data-online="true"]').waitFor()
  await page.waitForFunction(() => (document.querySelector('[data-testid="shoot-screen"]') as HTMLElement | null)?.dataset.delayMs !== '')
}

/** The producer's rehearsal of the demo episode at 32×, with the desk, the prompter and the cue screen open. */
async function rehearsal() {
  const producer = await signedIn('producer@brackenford.test', null, { width: 1280, height: 800 })
  const created = await producer.page.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'rehearsal' }, headers: sameOrigin() })
  expect(created.status()).toBe(201)
  const shootId: number = (await created.json()).shoot.id
  const base = `/shoots/${shootId}`
  await producer.page.goto(url(`${base}/desk`), { waitUntil: 'networkidle' })
  const host = await signedIn('host@brackenford.test', `${base}/prompter`, { width: 1280, height: 800 })
  const camera = await signedIn('camera@brackenford.test', `${base}/cue`, { width: 900, height: 1000 })
  for (const x of [producer, host, camera]) await ready(x.page)
  const command = async (data: Record<string, unknown>) => {
    const r = await producer.page.request.post(url(`/api/shoots/${shootId}/commands`), { data, headers: sameOrigin() })
    expect(r.status(), JSON.stringify(data)).toBe(200)
  }
  const state = async (): Promise<ShootState> => (await (await host.page.request.get(url(`/api/shoots/${shootId}`))).json()).state
  await command({ type: 'clock.speed', speed: SPEED })
  // The prompter notes each cue turning due, with its own server clock at that moment.
  await host.page.evaluate(() => {
    const w = window as unknown as { cueFlips: CueFlip[] }
    w.cueFlips = []
    const due = new Set<string>()
    const look = () => {
      const shell = document.querySelector('[data-testid="shoot-screen"]') as HTMLElement
      const serverMs = Date.now() + Number(shell.dataset.offsetMs)
      const now = new Set<string>()
      for (const el of document.querySelectorAll<HTMLElement>('[data-testid="prompter-cue"][data-due="true"]')) {
        const id = el.dataset.stepId!
        now.add(id)
        if (!due.has(id)) w.cueFlips.push({ id, atMs: Number(el.dataset.atMs), serverMs })
      }
      due.clear()
      for (const id of now) due.add(id)
    }
    new MutationObserver(look).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['data-due'] })
  })
  return { shootId, desk: producer, host, camera, command, state }

}

type Rehearsal = Awaited<ReturnType<typeof rehearsal>>

/** What the prompter shows that the host acts on: its state's sequence number and whether a cue says "now". */
const look = (page: Page) => page.evaluate(() => ({
  seq: Number((document.querySelector('[data-testid="shoot-screen"]') as HTMLElement).dataset.seq),
  dueCue: !!document.querySelector('[data-testid="prompter-cue"][data-due="true"]'),
}))

/**
 * What the host does now: call a ringing timer done ("a"), start a wait whose cue says "now" ("s"),
 * press Next at a hands-on beat's planned end (on a wait's beat, when the next beat's planned start
 * comes), and at the end of the cook ask the producer to end the shoot. Null: nothing yet.
 */
function hostAction(s: ShootState, dueCue: boolean, hold: number): string | null {
  const now = Date.now()
  const shootNow = shootClockAt(s.clock, now)
  if (dueTimersAt(s.timers, now).length) return 'a'
  if (dueCue) return 's'
  const live = s.plan!.live!
  const positions = shootPositions(s.runOrder)
  const here = shootCursorRef(s)
  const at = positions.findIndex((p) => p.segment === here.segment && p.step === here.step)
  // The beat Next goes to: a wait already started from its cue is gone past.
  const next = positions.slice(at + 1).find((p) => !(p.stepId && stepTimerOf(s, p.stepId)))
  const step = shootPlanStep(s, here.stepId)
  const end = step?.handsOn ? live.steps[step.id]!.endMs + hold : next?.stepId ? live.steps[next.stepId]?.startMs ?? 0 : 0
  if (!next) return shootNow >= Math.max(end, live.makespanMs) && !s.timers.some(isShootTimerLive) ? 'end' : null
  return shootNow >= end ? 'PageDown' : null
}

interface DriveOptions { hold?: (s: ShootState) => number; onLook?: (s: ShootState) => Promise<void> }

/** Runs the host until `stop` says so (or the shoot ends); `hold` keeps the host on a step longer. */
async function drive(r: Rehearsal, stop: (s: ShootState) => boolean, opts: DriveOptions = {}) {
  let s = await r.state()
  let sent: { act: string; seq: number; cursor: string; at: number } | null = null
  const cursorOf = (x: ShootState) => `${x.cursor.segment}:${x.cursor.step}`
  for (;;) {
    // A look every 15 ms or so (half a kitchen second at 32×): closer polling would load the page it measures.
    await new Promise((done) => setTimeout(done, 15))
    const seen = await look(r.host.page)
    if (seen.seq !== s.seq) s = await r.state()
    if (s.status === 'ended' || stop(s)) return s
    await opts.onLook?.(s)
    // After a key, wait for what it does (the cursor moving; any change for the others) before the
    // next, or a moment, in case it was refused.
    if (sent) {
      const done = sent.act === 'PageDown' ? cursorOf(s) !== sent.cursor : s.seq > sent.seq
      if (!done && Date.now() - sent.at < (sent.act === 'PageDown' ? 2000 : 400)) continue
      sent = null
    }
    const act = hostAction(s, seen.dueCue, opts.hold?.(s) ?? 0)
    if (!act) continue
    sent = { act, seq: s.seq, cursor: cursorOf(s), at: Date.now() }
    if (process.env.REHEARSAL_LOG) {
      appendFileSync(process.env.REHEARSAL_LOG, `${Math.round(Date.now() / 100) / 10} shoot ${Math.round(shootClockAt(s.clock, Date.now()) / 1000)} s `
        + `at ${shootCursorRef(s).stepId} ${act} makespan ${Math.round(s.plan!.live!.makespanMs / 1000)}\n`)
    }
    if (act === 'end') await r.command({ type: 'shoot.end' })
    else await r.host.page.keyboard.press(act)
  }
}

describe.skipIf(!chromiumAvailable())('a rehearsal run from the cook plan, on three screens', async () => {
  await useBuiltApp({ browser: true })
  // The three screens of the first rehearsal open before its test: on a busy two-core machine opening
  // them takes half a minute, and the 32× run itself (the 71-minute plan in about 135 s) fills the
  // rest of a test's 180 s.
  let opened: Rehearsal
  beforeAll(async () => {
    opened = await rehearsal()
  }, 240_000)

  it('cues each wait on time, names the next timer on the cue screen and ends within 5 % of the plan', async () => {
    const r = opened
    const first = (await r.state()).plan!.first!
    if (process.env.REHEARSAL_LOG) writeFileSync(`${process.env.REHEARSAL_LOG}.state.json`, JSON.stringify(await r.state()))
    expect(first.makespanMs).toBeGreaterThan(30 * MIN)
    await r.host.page.getByRole('button', { name: 'Start the shoot', exact: true }).click()
    await r.desk.page.locator('[data-testid="shoot-status"][data-status="running"]').waitFor()
    // The clock as it runs from the start: nobody pauses or changes the speed, so it holds throughout.
    const clock = (await r.state()).clock
    expect(clock).toMatchObject({ running: true, speed: SPEED })

    let standByChecked = false
    const ended = await drive(r, () => false, {
      onLook: async (s) => {
        const now = Date.now()
        // The cue screen's stand-by names the timer that ends next, once one runs.
        const running = s.timers.filter((t) => t.state === 'running').toSorted((a, b) => a.deadlineServerMs! - b.deadlineServerMs!)
        if (!standByChecked && running.length && running[0]!.deadlineServerMs! - now > 3000) {
          const item = r.camera.page.locator(`[data-testid="stand-by"] li[data-kind="timer"][data-id="${running[0]!.id}"]`)
          await expect(item.getByTestId('stand-by-label').textContent()).resolves.toBe(running[0]!.label)
          const timersListed = await r.camera.page.locator('[data-testid="stand-by"] li[data-kind="timer"]').first().getAttribute('data-id')
          expect(timersListed).toBe(running[0]!.id)
          standByChecked = true
        }
      },
    })
    expect(ended.status).toBe('ended')
    expect(standByChecked).toBe(true)
    // The desk at the end of the run (screenshots only now: taking one loads the machine the cues are timed on).
    await screenshot(r.desk.page, 'rehearsal-desk')

    // Every cue turned due within 1 s of shoot clock of its planned start (the live plan's, which the
    // prompter showed beside it): the page's own server clock at the flip, on the shoot's clock.
    const flips = await r.host.page.evaluate(() => (window as unknown as { cueFlips: CueFlip[] }).cueFlips)
    const waits = ended.plan!.steps.filter((p) => !p.handsOn && p.maxMs !== null)
    expect(flips.length).toBeGreaterThan(0)
    for (const f of flips) {
      const late = shootClockAt(clock, f.serverMs) - f.atMs
      expect(late, `${f.id} turned due ${late} ms after ${f.atMs}`).toBeGreaterThanOrEqual(-50)
      expect(late, `${f.id} turned due ${late} ms after ${f.atMs}`).toBeLessThanOrEqual(1000)
    }
    // Every wait got its timer, started from its cue or by reaching its beat, and was called done.
    for (const w of waits) expect(stepTimerOf(ended, w.id)?.state, w.id).toBe('acknowledged')
    // The shoot ends within 5 % of the first plan's makespan (the clock stopped when it ended).
    const endMs = ended.clock.anchorShootMs
    console.log(`[rehearsal] ended at ${Math.round(endMs / 1000)} s of ${Math.round(first.makespanMs / 1000)} s planned; ${flips.length} cues`)
    expect(Math.abs(endMs - first.makespanMs)).toBeLessThanOrEqual(0.05 * first.makespanMs)
    for (const s of [r.desk, r.host, r.camera]) expect(s.errors).toEqual([])
    for (const s of [r.desk, r.host, r.camera]) await s.page.close()
  }, Number(process.env.REHEARSAL_TIMEOUT ?? 180_000))

  it('moves the later cues and the projected finish on every screen when a step runs 3 minutes over', async () => {
    const r = await rehearsal()
    await r.command({ type: 'shoot.start' })
    // The host runs to plan up to the first hands-on step with a wait still to start after it.
    const onIt = (s: ShootState) => {
      const step = shootPlanStep(s, shootCursorRef(s).stepId)
      const waits = upcomingWaits(s, Date.now())
      // Once the plan has been computed again from the present (it is the first plan before that).
      // A step just begun (a minute or more to its planned end), so the overrun is all its own.
      const fresh = !!step && s.plan!.live!.steps[step.id]!.endMs - shootClockAt(s.clock, Date.now()) > MIN
      return !!step?.handsOn && fresh && s.plan!.live!.atShootMs > 0 && waits.length > 0 && waits.every((w) => w.inMs > 10_000)
        && !dueTimersAt(s.timers, Date.now()).length
    }
    let s = await drive(r, onIt)
    const overrun = shootCursorRef(s).stepId!
    const screens = [r.desk, r.host, r.camera]
    const finishShown = (page: Page, ms: number) => page.locator(`[data-testid="projected-finish"][data-projected-ms="${ms}"]`).waitFor()
    const cueShown = (id: string, ms: number) => r.host.page.locator(`[data-testid="prompter-cue"][data-step-id="${id}"][data-at-ms="${Math.round(ms)}"]`).waitFor()
    const before = { finish: s.plan!.live!.makespanMs, cues: Object.fromEntries(upcomingWaits(s, Date.now()).map((w) => [w.stepId, w.atMs])) }
    for (const x of screens) await finishShown(x.page, before.finish)
    for (const [id, at] of Object.entries(before.cues)) await cueShown(id, at)
    const standByBefore = await standByTimes(r.camera.page, s.clock)
    await screenshot(r.host.page, 'rehearsal-prompter-cue')

    // Three kitchen minutes over on this step, then Next.
    s = await drive(r, (x) => shootCursorRef(x).stepId !== overrun, { hold: () => 3 * MIN })
    const live = s.plan!.live!
    console.log(`[overrun] ${overrun}: finish ${before.finish} → ${live.makespanMs}; cues ${JSON.stringify(before.cues)}`)
    expect(live.steps[overrun]!.endMs - s.plan!.first!.steps[overrun]!.endMs).toBeGreaterThanOrEqual(3 * MIN)
    // The projected finish moved later by the overrun (the cook has one pair of hands), on all three screens.
    expect(live.makespanMs - before.finish).toBeGreaterThanOrEqual(2.5 * MIN)
    for (const x of screens) await finishShown(x.page, live.makespanMs)
    // (The prompter's own "running late" line compares with the first plan, which the live plan had beaten
    // by more than the overrun here; the toolbar's finish above is the one every screen shares.)
    // The later cues moved on the prompter, to the live plan's new starts.
    const still = Object.keys(before.cues).filter((id) => live.steps[id]!.state === 'pending' && !stepTimerOf(s, id))
    expect(still.length).toBeGreaterThan(0)
    // (Each within a kitchen second of the plan's start: the server computes the plan again on later changes too.)
    const cueAt = (id: string) => r.host.page.getByTestId('prompter-cue').and(r.host.page.locator(`[data-step-id="${id}"]`)).getAttribute('data-at-ms')
    for (const id of still) await expect.poll(async () => Math.abs(Number(await cueAt(id)) - live.steps[id]!.startMs)).toBeLessThanOrEqual(1000)
    expect(still.some((id) => live.steps[id]!.startMs - before.cues[id]! >= 2.5 * MIN), JSON.stringify({ before: before.cues, live: live.steps })).toBe(true)
    // And on the cue screen's stand-by: each wait stands at the new start (to 2 kitchen s: a row is
    // drawn up to one frame, 50 ms = 1.6 kitchen s at 32×, before it is read).
    const standBy = await standByTimes(r.camera.page, s.clock)
    const waitsThere = still.filter((id) => standBy[id] !== undefined && standByBefore[id] !== undefined)
    expect(waitsThere.length).toBeGreaterThan(0)
    for (const id of waitsThere) expect(Math.abs(standBy[id]! - live.steps[id]!.startMs), id).toBeLessThan(2000)
    expect(waitsThere.some((id) => standBy[id]! - standByBefore[id]! >= 2.5 * MIN)).toBe(true)
    await screenshot(r.host.page, 'rehearsal-prompter-after-overrun')
    await screenshot(r.desk.page, 'rehearsal-desk-after-overrun')
    for (const x of screens) expect(await axeViolations(x.page, { aaa: true })).toEqual([])
    for (const x of screens) expect(x.errors).toEqual([])
    for (const x of screens) await x.page.close()
  }, 180_000)
})

/** When each wait on the cue screen's stand-by will start, on the shoot clock: the page's server clock
 * when it drew the row, on the shoot's clock, plus the row's real countdown × the speed. */
async function standByTimes(page: Page, clock: ShootState['clock']): Promise<Record<string, number>> {
  const seen = await page.evaluate(() => [...document.querySelectorAll<HTMLElement>('[data-testid="stand-by"] li[data-kind="wait"]')]
    .map((el) => ({ id: el.dataset.id!, inMs: Number(el.dataset.inMs), serverNow: Number(el.dataset.serverNow) })))
  return Object.fromEntries(seen.filter((e) => e.inMs > 0).map((e) => [e.id, shootClockAt(clock, e.serverNow) + e.inMs * clock.speed]))
}
