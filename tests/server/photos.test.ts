// Photos of recipes and steps: checked by their bytes, capped, cleaned of camera metadata, served
// back with their type and a thumbnail, readable by the studio's crew only; and the same through an
// S3-compatible bucket when one is configured.
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync } from 'node:fs'
import { request as httpRequest, createServer, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { url } from '@nuxt/test-utils/e2e'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { rootDir, tempDatabasePath, useBuiltApp } from '../support/app'
import { Client, demo, signedIn, uniqueEmail } from '../support/client'
import { DEMO_PASSWORD } from '../../server/db/demo'
import type { Json } from '../support/client'

interface Upload {
  status: number
  body: Json
}

/** A multipart upload, as a browser form sends it, with the client's session cookie and the app's Origin. */
async function upload(base: (path: string) => string, cookie: string, path: string, bytes: Uint8Array, filename = 'dish.jpg', type = 'image/jpeg', field = 'photo'): Promise<Upload> {
  const form = new FormData()
  form.append(field, new Blob([new Uint8Array(bytes)], { type }), filename)
  const res = await fetch(base(path), { method: 'POST', body: form, headers: { cookie, accept: 'application/json', origin: new URL(base('/')).origin } })
  const text = await res.text()
  return { status: res.status, body: text ? JSON.parse(text) : null }
}

async function getBytes(base: (path: string) => string, cookie: string, path: string) {
  const res = await fetch(base(path), { headers: { cookie } })
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) }
}

/** A test picture: left half paprika red, right half sky blue, so a turn shows which way it went. */
function halves(width: number, height: number) {
  return sharp({ create: { width, height, channels: 3, background: '#a3301a' } })
    .composite([{ input: { create: { width: Math.ceil(width / 2), height, channels: 3, background: '#9fd4ff' } }, left: Math.floor(width / 2), top: 0 }])
}

/** RGB of one pixel. */
async function pixel(bytes: Buffer, x: number, y: number) {
  const { data, info } = await sharp(bytes).removeAlpha().raw().toBuffer({ resolveWithObject: true })
  const i = (y * info.width + x) * info.channels
  return { r: data[i]!, g: data[i + 1]!, b: data[i + 2]! }
}
const isRed = (p: { r: number; b: number }) => p.r > 130 && p.b < 90
const isBlue = (p: { r: number; b: number }) => p.b > 200 && p.r < 200

// EXIF with a GPS position (an invented spot) and a camera make. sharp writes IFD3 as the GPS IFD.
const gpsExif = {
  IFD0: { Make: 'Brackenford Test Camera', Copyright: 'Brackenford Test Kitchen' },
  IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 3230/100', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 4366/100', GPSMapDatum: 'WGS-84' },
}

describe('photos in the photo folder', async () => {
  const photoDir = mkdtempSync(join(tmpdir(), 'hobline-photos-'))
  await useBuiltApp({ env: { NUXT_PHOTOS_DIR: photoDir } })
  let producer: Client
  let studioId: number

  beforeAll(async () => {
    producer = await signedIn(demo.producer)
    studioId = (await producer.get('/api/me')).body.memberships[0].studioId
  })

  async function newRecipe(steps: string[] = []) {
    const made = await producer.post(`/api/studios/${studioId}/recipes`, { title: 'Photo test', servings: 2, steps: steps.map((text) => ({ text })) })
    expect(made.status).toBe(201)
    return made.body as { id: number; steps: { id: number }[] }
  }
  const send = (client: Client, path: string, bytes: Uint8Array, filename?: string, type?: string) => upload(url, client.cookie, path, bytes, filename, type)
  const fetchBytes = (client: Client, path: string) => getBytes(url, client.cookie, path)
  const stored = (photoUrl: string) => join(photoDir, photoUrl.replace(/^\/api\/photos\//, '').replace(/\?.*$/, ''))

  it('takes a JPEG, serves it back with its type and size, and a smaller WebP thumbnail', async () => {
    const recipe = await newRecipe()
    const jpeg = await halves(1000, 600).jpeg({ quality: 92 }).toBuffer()
    const res = await send(producer, `/api/recipes/${recipe.id}/photo`, jpeg)
    expect(res.status).toBe(201)
    expect(res.body.photo.url).toMatch(new RegExp(`^/api/photos/studio-${studioId}/recipe-${recipe.id}/[A-Za-z0-9_-]+\\.jpg$`))
    expect(res.body.photo.thumbUrl).toBe(`${res.body.photo.url}?size=thumb`)
    expect((await producer.get(`/api/recipes/${recipe.id}`)).body.photo).toEqual(res.body.photo)

    const full = await fetchBytes(producer, res.body.photo.url)
    expect(full.status).toBe(200)
    expect(full.headers.get('content-type')).toBe('image/jpeg')
    expect(full.headers.get('cache-control')).toBe('private, max-age=86400')
    expect(full.headers.get('x-content-type-options')).toBe('nosniff')
    expect(await sharp(full.bytes).metadata()).toMatchObject({ format: 'jpeg', width: 1000, height: 600 })
    expect(isRed(await pixel(full.bytes, 100, 300))).toBe(true)
    expect(isBlue(await pixel(full.bytes, 900, 300))).toBe(true)
    // What is served is what is kept in the folder.
    expect(readFileSync(stored(res.body.photo.url)).equals(full.bytes)).toBe(true)

    const thumb = await fetchBytes(producer, res.body.photo.thumbUrl)
    expect(thumb.status).toBe(200)
    expect(thumb.headers.get('content-type')).toBe('image/webp')
    // 480 wide, the height in proportion: 600 × 480 / 1000 = 288.
    expect(await sharp(thumb.bytes).metadata()).toMatchObject({ format: 'webp', width: 480, height: 288 })
    expect(thumb.bytes.length).toBeLessThan(full.bytes.length)
  })

  it('takes a PNG (transparency kept) and a WebP, each stored as what it is', async () => {
    const recipe = await newRecipe()
    const png = await sharp({ create: { width: 800, height: 500, channels: 4, background: { r: 44, g: 97, b: 72, alpha: 0.5 } } }).png().toBuffer()
    const res = await send(producer, `/api/recipes/${recipe.id}/photo`, png, 'plating.png', 'image/png')
    expect(res.status).toBe(201)
    expect(res.body.photo.url).toMatch(/\.png$/)
    const full = await fetchBytes(producer, res.body.photo.url)
    expect(full.headers.get('content-type')).toBe('image/png')
    expect(await sharp(full.bytes).metadata()).toMatchObject({ format: 'png', width: 800, height: 500, hasAlpha: true })
    const thumb = await fetchBytes(producer, res.body.photo.thumbUrl)
    expect(await sharp(thumb.bytes).metadata()).toMatchObject({ format: 'webp', width: 480, height: 300, hasAlpha: true })
    expect(thumb.bytes.length).toBeLessThan(full.bytes.length)

    // A WebP sent under a misleading name and type is still taken for what its bytes are.
    const webp = await halves(300, 200).webp().toBuffer()
    const again = await send(producer, `/api/recipes/${recipe.id}/photo`, webp, 'dish.jpg', 'image/jpeg')
    expect(again.status).toBe(201)
    expect(again.body.photo.url).toMatch(/\.webp$/)
    const served = await fetchBytes(producer, again.body.photo.url)
    expect(served.headers.get('content-type')).toBe('image/webp')
    // Never enlarged: a photo narrower than 480 keeps its width in the thumbnail.
    expect(await sharp((await fetchBytes(producer, again.body.photo.thumbUrl)).bytes).metadata()).toMatchObject({ width: 300, height: 200 })
  })

  it('strips EXIF and its GPS position from what it keeps, and turns the photo upright first', async () => {
    const recipe = await newRecipe()
    // 60 wide, 40 high as stored, with orientation 6: per Exif (CIPA DC-008, tag 0x0112 Orientation)
    // "the 0th row is the visual right-hand side and the 0th column is the visual top", so it shows
    // 40 wide and 60 high, the red left half of the stored picture on top.
    const jpeg = await halves(60, 40).withExif(gpsExif).withMetadata({ orientation: 6 }).jpeg().toBuffer()
    const sent = await sharp(jpeg).metadata()
    expect(sent.orientation).toBe(6)
    expect(sent.exif?.includes('WGS-84')).toBe(true) // the GPS IFD really went out
    expect(sent.exif?.includes('Brackenford Test Camera')).toBe(true)

    const res = await send(producer, `/api/recipes/${recipe.id}/photo`, jpeg)
    expect(res.status).toBe(201)
    for (const bytes of [readFileSync(stored(res.body.photo.url)), (await fetchBytes(producer, res.body.photo.url)).bytes]) {
      const kept = await sharp(bytes).metadata()
      expect(kept.exif).toBeUndefined()
      expect(kept.orientation).toBeUndefined()
      expect(bytes.includes('WGS-84')).toBe(false)
      expect(bytes.includes('Brackenford')).toBe(false)
      expect(bytes.includes('Exif\0\0')).toBe(false)
      expect([kept.width, kept.height]).toEqual([40, 60])
      expect(isRed(await pixel(bytes, 20, 10))).toBe(true)
      expect(isBlue(await pixel(bytes, 20, 50))).toBe(true)
    }
    const thumb = (await fetchBytes(producer, res.body.photo.thumbUrl)).bytes
    expect((await sharp(thumb).metadata()).exif).toBeUndefined()
    expect(thumb.includes('WGS-84')).toBe(false)
  })

  it('refuses what is not a JPEG, PNG or WebP by its bytes, whatever its name (415)', async () => {
    const recipe = await newRecipe()
    const refusals = [
      [Buffer.from('Two onions, finely chopped.\n'), 'onions.jpg', 'image/jpeg'],
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'logo.svg', 'image/svg+xml'],
      [await sharp({ create: { width: 20, height: 20, channels: 3, background: '#fff' } }).gif().toBuffer(), 'spin.gif', 'image/gif'],
      // A JPEG cut short after its first bytes: it starts right but cannot be read.
      [(await halves(400, 300).jpeg().toBuffer()).subarray(0, 40), 'cut.jpg', 'image/jpeg'],
    ] as const
    for (const [bytes, name, type] of refusals) {
      const res = await send(producer, `/api/recipes/${recipe.id}/photo`, bytes, name, type)
      expect(res.status, name).toBe(415)
      expect(res.body.statusMessage, name).toMatch(/^Photo: .*JPEG, PNG or WebP/)
    }
    expect((await producer.get(`/api/recipes/${recipe.id}`)).body.photo).toBeNull()
  })

  it('refuses a photo over 8 MB with the limit in words (413), and a form without the photo (400)', async () => {
    const recipe = await newRecipe()
    const big = Buffer.alloc(8 * 1024 * 1024 + 1, 0x41)
    big.set([0xff, 0xd8, 0xff, 0xe0])
    const res = await send(producer, `/api/recipes/${recipe.id}/photo`, big)
    expect(res.status).toBe(413)
    expect(res.body.statusMessage).toMatch(/up to 8 MB/)

    const wrongField = await upload(url, producer.cookie, `/api/recipes/${recipe.id}/photo`, await halves(40, 40).jpeg().toBuffer(), 'a.jpg', 'image/jpeg', 'file')
    expect(wrongField.status).toBe(400)
    expect(wrongField.body.statusMessage).toMatch(/^Photo: attach it in a form field named "photo"/)
    const json = await producer.post(`/api/recipes/${recipe.id}/photo`, { photo: 'dish.jpg' })
    expect(json.status).toBe(400)
    expect(json.body.statusMessage).toMatch(/multipart\/form-data/)

    // An upload that does not say how big it is (chunked) is not read at all.
    const chunked = await new Promise<{ status: number; body: string }>((done, fail) => {
      const base = new URL(url('/'))
      const req = httpRequest({
        host: base.hostname, port: base.port, method: 'POST', path: `/api/recipes/${recipe.id}/photo`,
        headers: { cookie: producer.cookie, origin: base.origin, accept: 'application/json', 'content-type': 'multipart/form-data; boundary=x', 'transfer-encoding': 'chunked' },
      }, (res) => {
        let body = ''
        res.on('data', (c) => (body += c))
        res.on('end', () => done({ status: res.statusCode!, body }))
      })
      req.on('error', fail)
      req.end('--x\r\nContent-Disposition: form-data; name="photo"; filename="a.jpg"\r\n\r\n\xff\xd8\xff\r\n--x--\r\n')
    })
    expect(chunked.status).toBe(411)
    expect(JSON.parse(chunked.body).statusMessage).toMatch(/Content-Length/)
  })

  it('a new photo replaces the old one, and deleting it leaves nothing behind', async () => {
    const recipe = await newRecipe()
    const first = await send(producer, `/api/recipes/${recipe.id}/photo`, await halves(200, 100).jpeg().toBuffer())
    const second = await send(producer, `/api/recipes/${recipe.id}/photo`, await halves(300, 100).jpeg().toBuffer())
    expect(second.status).toBe(201)
    expect(second.body.photo.url).not.toBe(first.body.photo.url)
    expect((await fetchBytes(producer, first.body.photo.url)).status).toBe(404)
    expect((await fetchBytes(producer, first.body.photo.thumbUrl)).status).toBe(404)
    expect(existsSync(stored(first.body.photo.url))).toBe(false)
    expect(existsSync(stored(first.body.photo.url).replace(/\.jpg$/, '.thumb.webp'))).toBe(false)

    expect((await producer.delete(`/api/recipes/${recipe.id}/photo`)).status).toBe(204)
    expect((await producer.get(`/api/recipes/${recipe.id}`)).body.photo).toBeNull()
    const gone = await fetchBytes(producer, second.body.photo.url)
    expect(gone.status).toBe(404)
    expect((await fetchBytes(producer, second.body.photo.thumbUrl)).status).toBe(404)
    expect(existsSync(stored(second.body.photo.url))).toBe(false)
    // Deleting again is no error: there is simply no photo.
    expect((await producer.delete(`/api/recipes/${recipe.id}/photo`)).status).toBe(204)
  })

  it('a step takes a photo of its own; a step of another recipe is not found', async () => {
    const recipe = await newRecipe(['Slice the loaf.', 'Toast the slices.'])
    const other = await newRecipe(['Boil the kettle.'])
    const [first, second] = recipe.steps
    const jpeg = await halves(640, 480).jpeg().toBuffer()
    const res = await send(producer, `/api/recipes/${recipe.id}/steps/${second!.id}/photo`, jpeg)
    expect(res.status).toBe(201)
    expect(res.body.photo.url).toMatch(new RegExp(`^/api/photos/studio-${studioId}/recipe-${recipe.id}/step-${second!.id}-[A-Za-z0-9_-]+\\.jpg$`))
    const view = (await producer.get(`/api/recipes/${recipe.id}`)).body
    expect(view.steps.map((s: { photo: unknown }) => s.photo)).toEqual([null, res.body.photo])
    expect(view.photo).toBeNull()
    const thumb = await fetchBytes(producer, res.body.photo.thumbUrl)
    expect(await sharp(thumb.bytes).metadata()).toMatchObject({ format: 'webp', width: 480, height: 360 })

    const elsewhere = await send(producer, `/api/recipes/${recipe.id}/steps/${other.steps[0]!.id}/photo`, jpeg)
    expect(elsewhere.status).toBe(404)
    expect(elsewhere.body.statusMessage).toMatch(/no such step in this recipe/)
    expect((await producer.delete(`/api/recipes/${recipe.id}/steps/${other.steps[0]!.id}/photo`)).status).toBe(404)
    expect((await producer.delete(`/api/recipes/${recipe.id}/steps/${first!.id}/photo`)).status).toBe(204)

    expect((await producer.delete(`/api/recipes/${recipe.id}/steps/${second!.id}/photo`)).status).toBe(204)
    expect((await fetchBytes(producer, res.body.photo.url)).status).toBe(404)
    expect(existsSync(stored(res.body.photo.url))).toBe(false)
    expect((await producer.get(`/api/recipes/${recipe.id}`)).body.steps[1].photo).toBeNull()
  })

  it('the crew may look, camera and viewer may not upload, other studios and the signed-out see nothing', async () => {
    const recipe = await newRecipe(['Plate up.'])
    const res = await send(producer, `/api/recipes/${recipe.id}/photo`, await halves(100, 100).jpeg().toBuffer())
    const jpeg = await halves(50, 50).jpeg().toBuffer()
    for (const who of [demo.host, demo.camera, demo.viewer]) {
      const member = await signedIn(who)
      expect((await fetchBytes(member, res.body.photo.url)).status, who).toBe(200)
      expect((await fetchBytes(member, res.body.photo.thumbUrl)).status, who).toBe(200)
    }
    for (const who of [demo.camera, demo.viewer]) {
      const member = await signedIn(who)
      const refused = await send(member, `/api/recipes/${recipe.id}/photo`, jpeg)
      expect(refused.status, who).toBe(403)
      expect(refused.body.statusMessage).toMatch(/may not edit recipes/)
      expect((await send(member, `/api/recipes/${recipe.id}/steps/${recipe.steps[0]!.id}/photo`, jpeg)).status, who).toBe(403)
      expect((await member.delete(`/api/recipes/${recipe.id}/photo`)).status, who).toBe(403)
    }
    const outsiderEmail = uniqueEmail('photo-outsider')
    const outsider = new Client()
    await outsider.post('/api/auth/signup', { name: 'Elsewhere', email: outsiderEmail, password: 'a different studio entirely', studioName: 'Elsewhere Kitchen' })
    expect((await fetchBytes(outsider, res.body.photo.url)).status).toBe(404)
    expect((await send(outsider, `/api/recipes/${recipe.id}/photo`, jpeg)).status).toBe(404)
    expect((await outsider.delete(`/api/recipes/${recipe.id}/photo`)).status).toBe(404)
    const anon = new Client()
    expect((await fetchBytes(anon, res.body.photo.url)).status).toBe(401)
    expect((await send(anon, `/api/recipes/${recipe.id}/photo`, jpeg)).status).toBe(401)
    // The photo is untouched by all of that.
    expect((await fetchBytes(producer, res.body.photo.url)).status).toBe(200)
  })

  it('refuses addresses that try to leave the photo store (400) and knows no other names (404)', async () => {
    /** Sent byte for byte: fetch would tidy "..", so the raw request line goes out as written. */
    const raw = (path: string) => new Promise<{ status: number; body: string }>((done, fail) => {
      const base = new URL(url('/'))
      const req = httpRequest({ host: base.hostname, port: base.port, path, headers: { cookie: producer.cookie, accept: 'application/json' } }, (res) => {
        let body = ''
        res.on('data', (c) => (body += c))
        res.on('end', () => done({ status: res.statusCode!, body }))
      })
      req.on('error', fail)
      req.end()
    })
    const tricks = [
      `/api/photos/studio-${studioId}/recipe-1/../../../../etc/passwd`,
      `/api/photos/studio-${studioId}/..%2F..%2F..%2Fetc%2Fpasswd`,
      `/api/photos/studio-${studioId}/recipe-1/%2e%2e/%2e%2e/hobline.sqlite`,
      '/api/photos/%2Fetc%2Fpasswd',
      `/api/photos/studio-${studioId}/recipe-1/..%5C..%5Cboot.ini`,
      `/api/photos/studio-${studioId}/recipe-1/a%00.jpg`,
      `/api/photos/studio-${studioId}//recipe-1/name.jpg`,
    ]
    for (const path of tricks) {
      const res = await raw(path)
      expect(res.status, path).toBe(400)
      expect(JSON.parse(res.body).statusMessage, path).toMatch(/^This photo address /)
    }
    for (const path of [`/api/photos/studio-${studioId}/recipe-1/notes.txt`, `/api/photos/studio-${studioId}/recipe-1/abcdefghijkl.thumb.webp`, `/api/photos/studio-${studioId}/recipe-1/abcdefghijkl.jpg`]) {
      expect((await raw(path)).status, path).toBe(404)
    }
    expect((await fetchBytes(producer, `/api/photos/studio-${studioId}/recipe-1/abcdefghijkl.jpg?size=huge`)).status).toBe(400)
  })
})

describe('photos in an S3-compatible bucket', () => {
  // A stand-in for the bucket on loopback: keeps objects in memory and records every request.
  const objects = new Map<string, Buffer>()
  const seen: { method: string; path: string; authorization: string }[] = []
  let bucket: Server
  let app: ChildProcess
  let base = ''
  let appLog = ''

  beforeAll(async () => {
    bucket = createServer((req, res) => {
      const chunks: Buffer[] = []
      req.on('data', (c: Buffer) => chunks.push(c))
      req.on('end', () => {
        const path = decodeURIComponent(new URL(req.url!, 'http://bucket').pathname)
        seen.push({ method: req.method!, path, authorization: String(req.headers.authorization ?? '') })
        if (req.method === 'PUT') {
          objects.set(path, Buffer.concat(chunks))
          res.writeHead(200).end()
        } else if (req.method === 'GET' || req.method === 'HEAD') {
          const body = objects.get(path)
          if (!body) res.writeHead(404, { 'content-type': 'application/xml' }).end('<Error><Code>NoSuchKey</Code></Error>')
          else res.writeHead(200, { 'content-type': 'application/octet-stream', 'content-length': body.length }).end(req.method === 'GET' ? body : undefined)
        } else if (req.method === 'DELETE') {
          objects.delete(path)
          res.writeHead(204).end()
        } else res.writeHead(405).end()
      })
    })
    await new Promise<void>((r) => bucket.listen(0, '127.0.0.1', r))
    const bucketPort = (bucket.address() as AddressInfo).port

    const free = createServer()
    await new Promise<void>((r) => free.listen(0, '127.0.0.1', r))
    const port = (free.address() as AddressInfo).port
    await new Promise((r) => free.close(r))

    app = spawn(process.execPath, [resolve(rootDir, '.output/server/index.mjs')], {
      env: {
        ...process.env,
        PORT: String(port),
        HOST: '127.0.0.1',
        NUXT_DATABASE_PATH: tempDatabasePath('photos-s3'),
        NUXT_DATABASE_SEED: 'always',
        NUXT_SESSION_PASSWORD: 'test-session-password-of-at-least-32-characters',
        NUXT_PUBLIC_SITE_URL: `http://127.0.0.1:${port}`,
        NUXT_PHOTOS_DIR: join(tmpdir(), 'hobline-photos-never-used'),
        NUXT_PHOTOS_S3_ENDPOINT: `http://127.0.0.1:${bucketPort}`,
        NUXT_PHOTOS_S3_BUCKET: 'brackenford-photos',
        NUXT_PHOTOS_S3_REGION: 'eu-west-2',
        NUXT_PHOTOS_S3_ACCESS_KEY_ID: 'BRACKENFORDTESTKEY',
        NUXT_PHOTOS_S3_SECRET_ACCESS_KEY: 'not-a-real-secret',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    })
    app.stdout!.on('data', (c) => (appLog += c))
    app.stderr!.on('data', (c) => (appLog += c))
    base = `http://127.0.0.1:${port}`
    for (let i = 0; i < 600; i++) {
      const health = await fetch(`${base}/api/health`).then((r) => r.json()).catch(() => null)
      if (health?.status === 'ok') return
      await new Promise((r) => setTimeout(r, 50))
    }
    throw new Error(`the built app with an S3 bucket never became healthy:\n${appLog}`)
  }, 120_000)

  // The app must be gone before the bucket closes: a bucket's close() waits for every open
  // connection, and the app's keep-alive connections to it would hold the test file open.
  afterAll(async () => {
    if (app && app.exitCode === null && app.signalCode === null) {
      const exited = new Promise((r) => app!.once('exit', r))
      app.kill('SIGTERM')
      const timer = setTimeout(() => app!.kill('SIGKILL'), 10_000)
      await exited
      clearTimeout(timer)
    }
    bucket?.closeAllConnections()
    await new Promise((r) => bucket?.close(r))
  })

  it('stores the photo and its thumbnail in the bucket, signed, serves them from it and deletes them there', async () => {
    const at = (path: string) => `${base}${path}`
    const login = await fetch(at('/api/auth/login'), { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: demo.producer, password: DEMO_PASSWORD }) })
    const cookie = login.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))!.split(';')[0]!
    const call = (method: string, path: string, body?: unknown) => fetch(at(path), { method, headers: { cookie, origin: base, 'content-type': 'application/json', accept: 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) })
    const me = await (await call('GET', '/api/me')).json()
    const studioId = me.memberships[0].studioId
    const recipe = await (await call('POST', `/api/studios/${studioId}/recipes`, { title: 'Photo test', servings: 2 })).json()

    expect(appLog).toMatch(/photos are kept in the S3 bucket "brackenford-photos" at 127\.0\.0\.1:\d+ \(eu-west-2\)/)
    const jpeg = await halves(900, 600).withExif(gpsExif).jpeg().toBuffer()
    const res = await upload(at, cookie, `/api/recipes/${recipe.id}/photo`, jpeg)
    expect(res.status).toBe(201)
    const key = res.body.photo.url.replace('/api/photos/', '')
    const objectPath = `/brackenford-photos/${key}`
    const thumbPath = objectPath.replace(/\.jpg$/, '.thumb.webp')
    // The seeded demo recipes keep their photos in the bucket too; this recipe's are the two under its key.
    const ours = () => [...objects.keys()].filter((k) => k.startsWith(`/brackenford-photos/studio-${studioId}/recipe-${recipe.id}/`))
    expect(ours().sort()).toEqual([objectPath, thumbPath].sort())
    // Every request to the bucket is signed with AWS Signature Version 4 for the configured key and region
    // (AWS S3 API Reference, "Authenticating Requests (AWS Signature Version 4)").
    for (const r of seen) expect(r.authorization).toMatch(/^AWS4-HMAC-SHA256 Credential=BRACKENFORDTESTKEY\/\d{8}\/eu-west-2\/s3\/aws4_request, SignedHeaders=[^,]+, Signature=[0-9a-f]{64}$/)
    expect(objects.get(objectPath)!.includes('WGS-84')).toBe(false)

    const full = await getBytes(at, cookie, res.body.photo.url)
    expect(full.status).toBe(200)
    expect(full.headers.get('content-type')).toBe('image/jpeg')
    expect(full.bytes.equals(objects.get(objectPath)!)).toBe(true)
    const thumb = await getBytes(at, cookie, res.body.photo.thumbUrl)
    expect(thumb.headers.get('content-type')).toBe('image/webp')
    expect(await sharp(thumb.bytes).metadata()).toMatchObject({ width: 480, height: 320 })

    expect((await call('DELETE', `/api/recipes/${recipe.id}/photo`)).status).toBe(204)
    expect(ours()).toEqual([])
    expect(seen.filter((r) => r.method === 'DELETE').map((r) => r.path).sort()).toEqual([objectPath, thumbPath].sort())
    expect((await getBytes(at, cookie, res.body.photo.url)).status).toBe(404)
  })
})
