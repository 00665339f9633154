// The built server's start-up rules, each in a process of its own: it refuses to start without its
// public address; /api/health never shows an internal error's text; without the image library a
// photo is refused and nothing is stored (it could not be cleaned of its GPS position).
import { existsSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import sharp from 'sharp'
import { describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '../../server/db/demo'
import { rootDir } from '../support/app'
import { demo } from '../support/client'
import { spawnBuiltApp, waitForHealth } from '../support/spawned'

describe('start-up rules of the built server', () => {
  it.each([
    ['not set', '', /\[hobline\] not starting: NUXT_PUBLIC_SITE_URL is not set\. Set NUXT_PUBLIC_SITE_URL to the address people open Hobline at/],
    ['not an address', 'hobline.example', /\[hobline\] not starting: NUXT_PUBLIC_SITE_URL \(hobline\.example\) is not an absolute address\./],
  ])('refuses to start when NUXT_PUBLIC_SITE_URL is %s, saying so in its log', async (_label, value, line) => {
    const app = await spawnBuiltApp({ NUXT_PUBLIC_SITE_URL: value })
    try {
      expect(await app.exited).toBe(1)
      expect(app.log()).toMatch(line)
    } finally {
      await app.stop()
    }
  }, 60_000)

  it('answers health with a broken database without the error\'s text (the log has it)', async () => {
    // The database's folder is a file: SQLite cannot open it.
    const notAFolder = join(mkdtempSync(join(tmpdir(), 'hobline-broken-')), 'not-a-folder')
    writeFileSync(notAFolder, 'a file where the database folder should be')
    const app = await spawnBuiltApp({ NUXT_DATABASE_PATH: join(notAFolder, 'hobline.sqlite') })
    try {
      const health = await waitForHealth(app, (_status, body) => body.status === 'failed')
      expect(health.status).toBe(503)
      expect(health.body).toEqual({ status: 'failed', database: { file: 'hobline.sqlite' }, message: 'The database did not start. The reason is in the server log.' })
      expect(app.log()).toMatch(/\[hobline\] database failed to start: Error: (EEXIST|ENOTDIR|SQLITE_CANTOPEN)/)
    } finally {
      await app.stop()
    }
  }, 60_000)

  it('refuses a photo upload (503) and stores nothing when the image library cannot load', async () => {
    const photoDir = mkdtempSync(join(tmpdir(), 'hobline-photos-nosharp-'))
    const app = await spawnBuiltApp({ NUXT_PHOTOS_DIR: photoDir }, { nodeArgs: ['--import', resolve(rootDir, 'tests/fixtures/no-sharp.mjs')] })
    try {
      await waitForHealth(app, (status) => status === 200)
      const headers = { 'content-type': 'application/json', 'accept': 'application/json', 'origin': app.base }
      const login = await fetch(`${app.base}/api/auth/login`, { method: 'POST', headers, body: JSON.stringify({ email: demo.producer, password: DEMO_PASSWORD }) })
      expect(login.status).toBe(200)
      const cookie = login.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))!.split(';')[0]!
      const studioId = (await (await fetch(`${app.base}/api/me`, { headers: { cookie } })).json()).memberships[0].studioId
      const made = await fetch(`${app.base}/api/studios/${studioId}/recipes`, { method: 'POST', headers: { ...headers, cookie }, body: JSON.stringify({ title: 'No library', servings: 2 }) })
      const recipe = await made.json()

      // A JPEG carrying a GPS position (an invented spot), as a phone camera writes it.
      const exif = { IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 3230/100', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 4366/100' } }
      const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#a3301a' } }).withExif(exif).jpeg().toBuffer()
      const form = new FormData()
      form.append('photo', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'dish.jpg')
      const res = await fetch(`${app.base}/api/recipes/${recipe.id}/photo`, { method: 'POST', body: form, headers: { cookie, accept: 'application/json', origin: app.base } })
      const body = await res.json()
      expect(res.status).toBe(503)
      expect(body.data.code).toBe('unavailable')
      expect(body.statusMessage).toMatch(/^Photos cannot be taken right now: the server's image library did not load\. Nothing was stored;/)

      // Nothing under the recipe's folder, and the recipe has no photo.
      const studioFolder = join(photoDir, `studio-${studioId}`)
      const recipeFolders = existsSync(studioFolder) ? readdirSync(studioFolder).filter((f) => f === `recipe-${recipe.id}`) : []
      expect(recipeFolders).toEqual([])
      const after = await (await fetch(`${app.base}/api/recipes/${recipe.id}`, { headers: { cookie } })).json()
      expect(after.photo ?? null).toBeNull()
      expect(app.log()).toMatch(/\[hobline\] sharp could not load \(Cannot find package 'sharp'\): photo uploads are refused until it does/)
    } finally {
      await app.stop()
    }
  }, 60_000)
})
