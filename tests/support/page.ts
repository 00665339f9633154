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
