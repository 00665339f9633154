// The take log in a browser: during a recording the camera operator, on the cue screen of a phone,
// rolls and marks a flub and a good take; the producer's control desk shows both as they happen; the
// take-log page lists them at 25 fps and, after the producer adds a 29.97 drop-frame camera on the
// page, at that camera's labels (SMPTE ST 12-1, timecode.ts, checked against FFmpeg's
// libavutil/timecode.c in tests/unit/timecode*.test.ts); the CSV and WebVTT downloads hold them,
// read back by papaparse and webvtt-parser.
import { readFileSync } from 'node:fs'
import { createPage, url } from '@nuxt/test-utils/e2e'
import Papa from 'papaparse'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { WebVTTParser } from 'webvtt-parser'
import type { ShootState } from '../../shared/types/shoot'
import { timecodeAfter } from '../../shared/utils/timecode'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, sameOrigin, screenshot, signInOnPage, startAtCooking } from '../support/page'

const online = (page: Page) => page.locator('[data-testid="connection"][data-online="true"]').waitFor()

async function download(page: Page, testId: string): Promise<string> {
  const [file] = await Promise.all([page.waitForEvent('download'), page.getByTestId(testId).click()])
  return readFileSync((await file.path())!, 'utf8')
}

describe.skipIf(!chromiumAvailable())('the take log', async () => {
  await useBuiltApp({ browser: true })

  it('camera marks show live on the desk, at each camera\'s timecode on the take-log page, and in the downloads', async () => {
    const desk = await createPage(undefined, { viewport: { width: 1280, height: 800 } })
    const deskErrors = consoleErrorsOf(desk)
    await signInOnPage(desk, 'producer@brackenford.test')
    const created = await desk.request.post(url('/api/episodes/1/shoots'), { data: { mode: 'take' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const shootId = (await created.json()).shoot.id as number
    const command = async (data: object) => {
      const r = await desk.request.post(url(`/api/shoots/${shootId}/commands`), { data, headers: sameOrigin() })
      expect(r.status(), JSON.stringify(data)).toBe(200)
    }
    await startAtCooking(desk, shootId)
    await command({ type: 'camera.set', cameraId: 'cam-a', name: 'Camera A', rate: '25' })
    await command({ type: 'shoot.start' })
    await desk.goto(url(`/shoots/${shootId}/desk`), { waitUntil: 'networkidle' })
    await online(desk)

    const phone = await createPage(undefined, { viewport: { width: 390, height: 844 } })
    const phoneErrors = consoleErrorsOf(phone)
    await signInOnPage(phone, 'camera@brackenford.test')
    await phone.goto(url(`/shoots/${shootId}/cue`), { waitUntil: 'networkidle' })
    await online(phone)
    await phone.getByTestId('roll-toggle').click()
    await desk.locator('[data-testid="shoot-rolling"][data-rolling="true"]').waitFor()
    await phone.waitForTimeout(700)
    await phone.getByTestId('mark-flub').click()
    await phone.getByText('Marked: Flub').waitFor()
    await phone.waitForTimeout(1300)
    await phone.getByTestId('mark-good').click()
    await phone.getByText('Marked: Good take').waitFor()

    // The desk shows both as they come, with Camera A's timecode.
    await desk.getByTestId('log-flub').waitFor()
    await desk.getByTestId('log-good').waitFor()
    const state = (await (await desk.request.get(url(`/api/shoots/${shootId}`))).json()).state as ShootState
    const flub = state.markers.find((m) => m.kind === 'flub')!
    const good = state.markers.find((m) => m.kind === 'good')!
    expect(flub.recordingMs).toBeGreaterThan(500)
    expect(good.recordingMs! - flub.recordingMs!).toBeGreaterThan(1000)
    const at25 = (ms: number) => timecodeAfter('01:00:00:00', ms, { fps: 25 })
    const atDf = (ms: number) => timecodeAfter('01:00:00;00', ms, { fps: 29.97, drop: true })
    await expect(desk.getByTestId('log-flub').getByTestId('log-timecode').textContent()).resolves.toBe(at25(flub.recordingMs!))
    await expect(desk.getByTestId('log-good').getByTestId('log-timecode').textContent()).resolves.toBe(at25(good.recordingMs!))
    await expect(desk.getByTestId('take-log-camera').textContent()).resolves.toMatch(/Camera A, 25 fps from 01:00:00:00/)
    await screenshot(desk, 'take-log-desk')

    // From the desk to the take log: grouped by segment and step, at Camera A.
    await desk.getByTestId('open-take-log').click()
    await desk.waitForURL(`**/shoots/${shootId}/takes`)
    const list = desk.getByTestId('take-log-list')
    await list.getByTestId('take-flub').waitFor()
    await desk.locator('[data-testid="take-log-page"][data-online="true"]').waitFor()
    await expect(list.getByTestId('take-flub').getByTestId('timecode').textContent()).resolves.toBe(at25(flub.recordingMs!))
    await expect(list.getByTestId('take-good').getByTestId('timecode').textContent()).resolves.toBe(at25(good.recordingMs!))
    const cookTitle = state.runOrder[flub.stepRef.segment]!.title!
    await expect(desk.getByTestId('take-segment').filter({ hasText: cookTitle }).getByTestId('take-flub').count()).resolves.toBe(1)

    // The producer adds a 29.97 drop-frame camera on the page; the list follows it.
    await desk.getByTestId('add-camera').click()
    await desk.getByTestId('camera-name').fill('Camera B')
    await desk.getByTestId('camera-rate').selectOption('29.97df')
    await expect(desk.getByTestId('camera-start').inputValue()).resolves.toBe('01:00:00;00')
    await desk.getByRole('button', { name: 'Save camera' }).click()
    await expect.poll(() => desk.getByTestId('shown-at').textContent()).toMatch(/Camera B, 29\.97 fps drop-frame from 01:00:00;00/)
    await expect.poll(() => list.getByTestId('take-flub').getByTestId('timecode').textContent()).toBe(atDf(flub.recordingMs!))
    await expect(list.getByTestId('take-good').getByTestId('timecode').textContent()).resolves.toBe(atDf(good.recordingMs!))
    expect(atDf(good.recordingMs!)).toMatch(/^01:00:\d\d;\d\d$/)
    // Filtering by kind.
    await desk.getByTestId('show-flub').uncheck()
    await expect(list.getByTestId('take-flub').count()).resolves.toBe(0)
    await desk.getByTestId('show-flub').check()
    // A pickup marked on set shows live as still to record; the producer changes the flub's note and
    // deletes the pickup on the page: kept in the log, gone from the list and the downloads.
    await phone.getByTestId('mark-pickup').click()
    await list.getByTestId('take-pickup').waitFor()
    await expect(desk.getByTestId('open-pickups').textContent()).resolves.toMatch(/1 pickup\s+still to record/)
    await expect(list.getByTestId('take-pickup').textContent()).resolves.toContain('still to record')
    expect(await axeViolations(desk)).toEqual([])
    await screenshot(desk, 'take-log-page')
    await list.getByTestId('take-flub').getByRole('button', { name: 'Change this marker' }).click()
    await list.getByTestId('edit-text').fill('lid fell: use the second take')
    await list.getByRole('button', { name: 'Save marker' }).click()
    await expect.poll(() => list.getByTestId('take-flub').getByTestId('note').textContent()).toBe('lid fell: use the second take')
    await expect(list.getByTestId('take-flub').locator('summary').textContent()).resolves.toBe('Changed once')
    await list.getByTestId('take-pickup').getByRole('button', { name: 'Delete this marker' }).click()
    await expect.poll(() => list.getByTestId('take-pickup').count()).toBe(0)
    await expect(desk.getByTestId('deleted-markers').textContent()).resolves.toMatch(/1 deleted marker/)
    const tidied = (await (await desk.request.get(url(`/api/shoots/${shootId}`))).json()).state as ShootState
    expect(tidied.markers.find((m) => m.kind === 'flub')!.changes).toEqual([expect.objectContaining({ before: { kind: 'flub', text: null }, after: { kind: 'flub', text: 'lid fell: use the second take' } })])
    expect(tidied.markers.find((m) => m.kind === 'pickup')).toMatchObject({ deleted: true })

    // The downloads hold both, at Camera B's labels; cue times are the recording times to the ms.
    const csv = Papa.parse<Record<string, string>>(await download(desk, 'download-csv'), { header: true, skipEmptyLines: true })
    expect(csv.errors).toEqual([])
    expect(csv.data.filter((r) => r.Kind !== 'Chapter').map((r) => [r.Kind, r.Timecode]))
      .toEqual([['Flub', atDf(flub.recordingMs!)], ['Good take', atDf(good.recordingMs!)]])
    expect(csv.data.find((r) => r.Kind === 'Flub')!.Note).toBe('lid fell: use the second take')
    const vtt = new WebVTTParser().parse(await download(desk, 'download-vtt-markers'), 'metadata')
    expect(vtt.errors).toEqual([])
    expect(vtt.cues.map((c) => [c.id, Math.round(c.startTime * 1000)])).toEqual([[flub.id, flub.recordingMs], [good.id, good.recordingMs]])
    const chapters = new WebVTTParser().parse(await download(desk, 'download-vtt-chapters'), 'chapters')
    expect(chapters.errors).toEqual([])
    // The take opened on a chapter at the step on screen: "recipe: step".
    const firstStep = state.plan!.steps.find((p) => p.id === flub.stepRef.stepId)!
    expect(chapters.cues[0]!.text).toBe(`${firstStep.recipeTitle}: ${firstStep.name ?? `Step ${flub.stepRef.step + 1}`}`)
    expect(Math.round(chapters.cues[0]!.startTime * 1000)).toBe(0)

    expect(deskErrors).toEqual([])
    expect(phoneErrors).toEqual([])
  })
})
