// Browser-test helpers: open a page of the built app, record where it sends requests, screenshot it.
import { mkdirSync } from 'node:fs'
import { resolve } from 'node:path'
import { createPage, url } from '@nuxt/test-utils/e2e'
import type { Page } from 'playwright-core'
import { rootDir } from './app'

export const artifactsDir = resolve(rootDir, 'tests/.artifacts')

export async function openPage(path: string, viewport = { width: 1280, height: 800 }) {
  const requests: string[] = []
  const page = await createPage(undefined, { viewport })
  page.on('request', (req) => requests.push(req.url()))
  const response = await page.goto(url(path), { waitUntil: 'networkidle' })
  return { page, response, requests }
}

/**
 * Headers for a change sent with `page.request` (Playwright's API client, which sends the page's
 * cookies but no Origin): the app's own Origin, as the page itself would send (server/utils/same-origin.ts).
 */
export function sameOrigin(): { origin: string } {
  return { origin: new URL(url('/')).origin }
}

/** The demo studio's password for every seeded member (server/db/demo data). */
export const DEMO_PASSWORD = 'hob-demo-2026'

/**
 * Signs in through the sign-in form and waits for the page it lands on (a member's studio page by
 * default); `path` is where the form is opened, e.g. `/signin?next=…`.
 */
export async function signInOnPage(
  page: Page,
  email: string,
  { password = DEMO_PASSWORD, path = '/signin', landing = /\/studios\/\d+$/ }: { password?: string; path?: string; landing?: RegExp | ((u: URL) => boolean) } = {},
) {
  await page.goto(url(path), { waitUntil: 'networkidle' })
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(landing)
}

/** Starts a timer through a shoot screen's timer form (ShootTimerForm); minutes as typed, e.g. "0.05". */
export async function startTimerOnPage(page: Page, label: string, minutes: string) {
  await page.getByLabel('What is cooking').fill(label)
  await page.getByRole('textbox', { name: /^How long/ }).fill(minutes)
  await page.getByRole('button', { name: 'Start timer' }).click()
}

/** The console errors and uncaught errors a page reports from now on. */
export function consoleErrorsOf(page: Page): string[] {
  const errors: string[] = []
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text())
  })
  page.on('pageerror', (e) => errors.push(String(e)))
  return errors
}

export function offHost(requests: string[]): string[] {
  return requests.filter((r) => {
    const { hostname, protocol } = new URL(r)
    if (protocol === 'data:' || protocol === 'blob:') return false
    return !['127.0.0.1', 'localhost', '[::1]'].includes(hostname)
  })
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(artifactsDir, { recursive: true })
  const path = resolve(artifactsDir, `${name}.png`)
  await page.screenshot({ path, fullPage: true })
  return path
}

/**
 * Puts a new shoot of the demo episode at the start of its cooking (the one segment with steps),
 * past the intro, as the tests about the cooking's beats expect; returns that segment's index.
 */
export async function startAtCooking(page: Page, shootId: number): Promise<number> {
  const shoot = await (await page.request.get(url(`/api/shoots/${shootId}`))).json()
  const cook = (shoot.state.runOrder as { stepIds: string[] }[]).findIndex((s) => s.stepIds.length > 0)
  const r = await page.request.post(url(`/api/shoots/${shootId}/commands`), { data: { type: 'step.jump', segment: cook, step: 0 }, headers: sameOrigin() })
  if (r.status() !== 200) throw new Error(`could not move the shoot to its cooking: ${await r.text()}`)
  return cook
}
