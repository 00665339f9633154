// The episode builder in real Chromium: the demo producer builds a show from an empty episode (an
// intro, two recipe segments and a sign-off), drags a segment into place with the mouse and moves
// one with Alt+↑ / Alt+↓, writes the intro with live fields from the picker, reads the prompter's
// preview with the figures filled and a false claim flagged, sees the planned length grow with the
// words (150 words a minute by default: show-runtime.ts), and undoes a removal. Every saved state
// is read back from the server. The demo episode's builder and a host's read-only view close it.
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { axeViolations } from '../support/axe'
import { chromiumAvailable } from '../support/chromium'
import { consoleErrorsOf, sameOrigin, screenshot, signInOnPage } from '../support/page'

const STEW = 'Smoky butter bean and tomato stew'
const BREADS = 'Pan flatbreads with mint yoghurt'

interface Stored { version: number; segments: { id: string; kind: string; title: string; recipeId: number | null; script: unknown[] }[] }
interface Show {
  segments: { id: string; script: { text: string; missing: string[] }; claims: { text: string; verdict: string; detail: string }[]; readMs: number }[]
  runtime: { totalMs: number }
}

const get = async <T>(page: Page, path: string) => (await (await page.request.get(url(path))).json()) as T
/** Waits until the builder says every change is saved. */
const allSaved = (page: Page) => page.locator('[data-testid="save-status"][data-state="saved"]').waitFor()

describe.skipIf(!chromiumAvailable())('the episode builder, in the browser', async () => {
  await useBuiltApp({ browser: true })

  it('builds a show from scratch: segments added, dragged and moved by keyboard, a scripted intro with live fields, Undo', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const me = await get<{ memberships: { studioId: number }[] }>(page, '/api/me')
    const studioId = me.memberships[0]!.studioId
    const created = await page.request.post(url(`/api/studios/${studioId}/episodes`), { data: { title: 'Builder trial' }, headers: sameOrigin() })
    expect(created.status()).toBe(201)
    const { id } = await created.json() as { id: number }
    const stored = () => get<Stored>(page, `/api/episodes/${id}`)

    await page.goto(url(`/episodes/${id}`), { waitUntil: 'networkidle' })
    await page.getByRole('heading', { level: 1, name: 'Builder trial' }).waitFor()
    await page.getByText('No segments yet').waitFor()

    // Four segments, added at the end one after another.
    const kind = page.getByLabel('Kind of segment')
    await kind.selectOption({ label: 'Intro' })
    await page.getByRole('button', { name: 'Add the segment' }).click()
    for (const title of [STEW, BREADS]) {
      await kind.selectOption({ label: 'Recipe' })
      await page.getByLabel('Recipe it cooks').selectOption({ label: title })
      await page.getByRole('button', { name: 'Add the segment' }).click()
    }
    await kind.selectOption({ label: 'Outro' })
    await page.getByRole('button', { name: 'Add the segment' }).click()
    await allSaved(page)
    const added = await stored()
    expect(added.segments.map((s) => [s.kind, s.title])).toEqual([['intro', 'Welcome'], ['recipe', STEW], ['recipe', BREADS], ['outro', 'Sign-off']])
    const [intro, stew, breads, outro] = added.segments.map((s) => s.id)

    // A real mouse drag by the grip: the flatbreads above the stew.
    const grip = page.locator(`[data-segment="${breads}"] [data-drag]`)
    const target = await page.locator(`[data-segment="${stew}"] [data-drag]`).boundingBox()
    const from = await grip.boundingBox()
    await page.mouse.move(from!.x + from!.width / 2, from!.y + from!.height / 2)
    await page.mouse.down()
    await page.mouse.move(from!.x + from!.width / 2, from!.y - 20, { steps: 5 })
    await page.mouse.move(target!.x + target!.width / 2, target!.y + 2, { steps: 25 })
    await page.mouse.up()
    await allSaved(page)
    expect((await stored()).segments.map((s) => s.id)).toEqual([intro, breads, stew, outro])

    // The keyboard: the sign-off focused, Alt+↑ moves it above the stew, Alt+↓ back; the focus stays on it.
    const signOff = page.locator(`[data-segment="${outro}"]`)
    await signOff.focus()
    await page.keyboard.press('Alt+ArrowUp')
    await page.getByRole('status').filter({ hasText: 'Sign-off moved to position 3 of 4.' }).waitFor()
    await allSaved(page)
    expect((await stored()).segments.map((s) => s.id)).toEqual([intro, breads, outro, stew])
    expect(await signOff.evaluate((el) => el === document.activeElement)).toBe(true)
    await page.keyboard.press('Alt+ArrowDown')
    await allSaved(page)
    expect((await stored()).segments.map((s) => s.id)).toEqual([intro, breads, stew, outro])
    // And the buttons, named for the segment.
    await page.getByRole('button', { name: 'Move Sign-off up' }).click()
    await page.getByRole('button', { name: 'Move Sign-off down' }).click()
    await allSaved(page)
    expect((await stored()).segments.map((s) => s.id)).toEqual([intro, breads, stew, outro])

    // The intro's words with two live fields from the picker, each put at the caret.
    const showBefore = await get<Show>(page, `/api/episodes/${id}/show`)
    expect(showBefore.segments[0]!.readMs).toBe(0)
    const totalBefore = Number(await page.getByTestId('runtime-total').getAttribute('data-ms'))
    expect(totalBefore).toBe(showBefore.runtime.totalMs)
    const card = page.locator(`[data-segment="${intro}"]`)
    await card.getByLabel('Script of Welcome', { exact: true }).fill('Welcome to the kitchen. Tonight we cook for ')
    await card.getByLabel('Script of Welcome', { exact: true }).press('End')
    await card.getByRole('button', { name: 'Insert a live field in Script of Welcome' }).click()
    const dialog = page.getByRole('dialog', { name: 'Insert a live field in Script of Welcome' })
    await dialog.getByRole('radio', { name: /^Servings/ }).check()
    await dialog.getByRole('button', { name: 'Insert' }).click()
    await card.locator('[data-chip]').filter({ hasText: 'Servings' }).waitFor()
    // The caret is now just after the chip.
    await page.keyboard.type(' people, each under 10p a serving. The stew comes to ')
    await card.getByRole('button', { name: 'Insert a live field in Script of Welcome' }).click()
    await dialog.getByRole('radio', { name: /^Cost per serving/ }).check()
    await dialog.getByLabel('Recipe', { exact: true }).selectOption({ label: STEW })
    await dialog.getByRole('button', { name: 'Insert' }).click()
    await card.locator('[data-chip]').filter({ hasText: `Cost per serving: ${STEW}` }).waitFor()
    await page.keyboard.type(' a serving.')
    await allSaved(page)

    // Saved as words and fields, never as typed code.
    const script = (await stored()).segments[0]!.script
    expect(script).toEqual([
      { text: 'Welcome to the kitchen. Tonight we cook for ' }, { field: { kind: 'servings' } },
      { text: ' people, each under 10p a serving. The stew comes to ' }, { field: { kind: 'cost', recipeId: added.segments[1]!.recipeId, withOptional: false } },
      { text: ' a serving.' },
    ])
    // The preview reads as the server renders it: the figures filled in, the false claim flagged with why.
    const preview = card.getByTestId('script-preview').first()
    const show = await get<Show>(page, `/api/episodes/${id}/show`)
    const rendered = show.segments[0]!.script.text
    expect(rendered).toMatch(/^Welcome to the kitchen\. Tonight we cook for \d+ people, each under 10p a serving\. The stew comes to £\d+\.\d\d a serving\.$/)
    expect(show.segments[0]!.script.missing).toEqual([])
    await expect.poll(() => preview.getByTestId('preview-text').innerText()).toContain(rendered.slice(-30))
    const claim = show.segments[0]!.claims.find((c) => c.text.includes('under 10p a serving'))
    expect(claim?.verdict).toBe('false')
    await preview.locator('[data-claim="false"]').filter({ hasText: 'under 10p a serving' }).waitFor()
    await expect(preview.getByTestId('claim-false').innerText()).resolves.toContain(claim!.detail)
    // The runtime bar's total grew by the intro's reading time.
    expect(show.segments[0]!.readMs).toBeGreaterThan(0)
    await expect.poll(async () => Number(await page.getByTestId('runtime-total').getAttribute('data-ms'))).toBe(show.runtime.totalMs)
    expect(show.runtime.totalMs).toBe(totalBefore + show.segments[0]!.readMs)

    // A chip removed: the words either side join again.
    await card.getByRole('button', { name: `Remove the live field Cost per serving: ${STEW}` }).click()
    await allSaved(page)
    expect((await stored()).segments[0]!.script).toEqual([
      { text: 'Welcome to the kitchen. Tonight we cook for ' }, { field: { kind: 'servings' } },
      { text: ' people, each under 10p a serving. The stew comes to  a serving.' },
    ])

    // Undo: the chip comes back; then a removed segment comes back, in its place.
    await page.getByRole('button', { name: 'Undo the last change' }).click()
    await allSaved(page)
    expect((await stored()).segments[0]!.script).toEqual(script)
    await page.getByRole('button', { name: 'Remove Sign-off' }).click()
    await allSaved(page)
    expect((await stored()).segments.map((s) => s.id)).toEqual([intro, breads, stew])
    await page.getByRole('button', { name: 'Undo the last change' }).click()
    await allSaved(page)
    const back = await stored()
    expect(back.segments.map((s) => s.id)).toEqual([intro, breads, stew, outro])
    expect(back.segments[0]!.script).toEqual(script)

    // Settings: a 20-minute target puts the show over it, in words.
    await page.getByLabel('Target length (minutes)').fill('20')
    await allSaved(page)
    expect((await stored() as Stored & { targetSeconds: number }).targetSeconds).toBe(1200)
    await expect.poll(() => page.getByTestId('runtime-total').innerText()).toMatch(/(over|under|on) the 20 min target/)

    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'episode-builder')
    expect(errors).toEqual([])
    await page.close()
  })

  it('says a refusal in words and keeps the draft; someone else\'s save: load theirs or keep mine; a host\'s reading pace times the scripts', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const created = await page.request.post(url('/api/studios/1/episodes'), { data: { title: 'Clash trial' }, headers: sameOrigin() })
    const { id } = await created.json() as { id: number }
    const stored = () => get<Stored & { title: string; servings: number | null; hostId: number | null }>(page, `/api/episodes/${id}`)
    await page.goto(url(`/episodes/${id}`), { waitUntil: 'networkidle' })
    await allSaved(page)

    // Servings as words: refused, said beside the box and in the saved state; fixed, saved.
    await page.getByLabel('Servings on set').fill('lots')
    const status = page.getByTestId('save-status')
    await page.locator('[data-testid="save-status"][data-state="failed"]').waitFor()
    await expect(status.innerText()).resolves.toMatch(/Not saved: Servings on set: write a whole number of servings/)
    await page.getByText(/^Servings on set: write a whole number of servings/).waitFor()
    expect((await stored()).servings).toBeNull()
    await page.getByLabel('Servings on set').fill('6')
    await allSaved(page)
    expect((await stored()).servings).toBe(6)

    // Someone else saves first: the banner, nothing lost; their version loaded.
    const theirs = async (title: string) => {
      const current = await stored()
      const r = await page.request.patch(url(`/api/episodes/${id}`), { data: { version: current.version, title }, headers: sameOrigin() })
      expect(r.status()).toBe(200)
    }
    await theirs('Their title')
    await page.getByLabel('Episode title').fill('My title')
    const banner = page.getByTestId('conflict-banner')
    await banner.getByText('Their version').waitFor()
    await expect(status.innerText()).resolves.toMatch(/^\W*Not saved: Someone else saved this episode/)
    expect(await page.getByLabel('Episode title').inputValue()).toBe('My title')
    await banner.getByRole('button', { name: 'Load theirs (discard mine)' }).click()
    await allSaved(page)
    expect(await page.getByLabel('Episode title').inputValue()).toBe('Their title')
    // Again, and this time mine is kept over theirs.
    await theirs('Their second title')
    await page.getByLabel('Episode title').fill('My second title')
    await banner.getByRole('button', { name: 'Keep mine (save over theirs)' }).click()
    await allSaved(page)
    expect((await stored()).title).toBe('My second title')

    // The host's reading pace, set on the crew page, times the scripts once they present.
    const { members } = await get<{ members: { userId: number; name: string; role: string; readingWpm: number | null }[] }>(page, '/api/studios/1/members')
    const host = members.find((m) => m.role === 'host')!
    await page.goto(url('/studios/1/crew'), { waitUntil: 'networkidle' })
    await page.getByLabel(`Reading pace of ${host.name} (words a minute)`).fill('175')
    await page.getByLabel(`Reading pace of ${host.name} (words a minute)`).press('Tab')
    await page.getByText(`Reading pace of ${host.name}: 175 words a minute.`).waitFor()
    await expect.poll(async () => (await get<{ members: typeof members }>(page, '/api/studios/1/members'))
      .members.find((m) => m.userId === host.userId)!.readingWpm).toBe(175)
    expect(await axeViolations(page)).toEqual([])
    await page.goto(url(`/episodes/${id}`), { waitUntil: 'networkidle' })
    await page.getByLabel('Presenter').selectOption({ label: `${host.name} (175 words a minute)` })
    await allSaved(page)
    expect((await stored()).hostId).toBe(host.userId)
    await expect.poll(() => page.getByTestId('pace').innerText()).toContain(`${host.name}'s reading pace: 175 words a minute`)
    expect(errors.filter((e) => !/status of (400|409)/.test(e))).toEqual([])
    await page.close()
  })

  it('opens the demo episode as a full show; a host reads it without the editing controls', async () => {
    const page = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const errors = consoleErrorsOf(page)
    await signInOnPage(page, 'producer@brackenford.test')
    const { episodes } = await get<{ episodes: { id: number; title: string }[] }>(page, '/api/studios/1/episodes')
    const demo = episodes.find((e) => e.title === 'Thursday supper special')!
    const show = await get<Show>(page, `/api/episodes/${demo.id}/show`)
    await page.goto(url(`/episodes/${demo.id}`), { waitUntil: 'networkidle' })
    await allSaved(page)
    expect(await page.locator('[data-segment]').count()).toBe(show.segments.length)
    expect(await page.locator('[data-chip]').count()).toBeGreaterThan(5)
    // The sign-off reads with its servings and budget filled.
    const last = show.segments.at(-1)!
    await expect(page.locator(`[data-segment="${last.id}"] [data-testid="preview-text"]`).first().innerText()).resolves.toBe(last.script.text)
    await expect(page.getByTestId('pace').innerText()).resolves.toMatch(/reading pace: \d+ words a minute/)
    expect(await axeViolations(page)).toEqual([])
    await screenshot(page, 'episode-builder-demo')
    expect(errors).toEqual([])
    await page.close()

    const host = await createPage(undefined, { viewport: { width: 1280, height: 900 } })
    const hostErrors = consoleErrorsOf(host)
    await signInOnPage(host, 'host@brackenford.test')
    await host.goto(url(`/episodes/${demo.id}`), { waitUntil: 'networkidle' })
    await host.getByRole('heading', { name: 'Run order' }).waitFor()
    await host.getByTestId('runtime-bar').waitFor()
    expect(await host.getByRole('button', { name: 'Add the segment' }).count()).toBe(0)
    expect(await host.getByRole('textbox').count()).toBe(0)
    expect(await host.getByTestId('preview-text').count()).toBeGreaterThanOrEqual(show.segments.length)
    expect(await axeViolations(host)).toEqual([])
    expect(hostErrors).toEqual([])
    await host.close()
  })
})
