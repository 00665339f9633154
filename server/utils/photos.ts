// Photos of recipes and of their steps. An upload is checked by its bytes (JPEG, PNG or WebP only),
// capped in size, re-encoded without its camera metadata (EXIF and its GPS position: a home
// kitchen's address must not travel with a dish) and stored with a small thumbnail beside it in the
// photo store, a folder by default or an S3-compatible bucket by configuration (plugin 03.photos).
// Keys are `studio-<id>/recipe-<id>/<name>.<ext>`; the studio in the key decides who may read it.
//
// Nothing here uses Nitro's auto-imports, so command-line scripts can import this file as well.
import { randomBytes } from 'node:crypto'
import { getRequestHeader, readMultipartFormData, type H3Event } from 'h3'
import type { Driver, Storage } from 'unstorage'
import fsDriver from 'unstorage/drivers/fs'
import s3Driver from 'unstorage/drivers/s3'
import type { Sharp, SharpOptions } from 'sharp'
import { Recipe, RecipeStep } from '../db/models'
import { readDemoPhotoFile, type DemoPhotoName } from '../db/demo-photos'
import { useDb } from './db'
import { DomainError } from '../../shared/utils/domain-error'

export type PhotoType = 'jpeg' | 'png' | 'webp'

const TYPES: Record<PhotoType, { ext: string; mime: string }> = {
  jpeg: { ext: 'jpg', mime: 'image/jpeg' },
  png: { ext: 'png', mime: 'image/png' },
  webp: { ext: 'webp', mime: 'image/webp' },
}
const MIME_BY_EXT: Record<string, string> = { jpg: 'image/jpeg', png: 'image/png', webp: 'image/webp' }

/** The largest photo taken, in bytes (8 MB: a phone's full-size JPEG fits). */
export const PHOTO_MAX_BYTES = 8 * 1024 * 1024
/** The most pixels decoded (50 megapixels), so a small file cannot unpack into gigabytes. */
export const PHOTO_MAX_PIXELS = 50_000_000
/** Thumbnails are this many pixels wide (never wider than the photo itself). */
export const PHOTO_THUMB_WIDTH = 480
const ACCEPTED = 'JPEG, PNG or WebP'
// Room for the multipart boundaries and part headers around the file itself.
const MULTIPART_SLACK = 64 * 1024

/**
 * The image type from the first bytes, whatever the file is called or claims to be.
 * Signatures as listed in the WHATWG MIME Sniffing Standard, §6.1 "Matching an image type pattern":
 * JPEG FF D8 FF; PNG 89 50 4E 47 0D 0A 1A 0A (also PNG spec, W3C 3rd ed., §5.2 "PNG signature");
 * WebP "RIFF", four size bytes, "WEBPVP" (RFC 9649 §2.5 "RIFF File Format": RIFF … WEBP, then a
 * VP8/VP8L/VP8X chunk). Everything else, SVG included (it can carry script), is refused.
 */
export function sniffPhotoType(bytes: Uint8Array): PhotoType | null {
  const at = (offset: number, ...values: number[]) => values.every((v, i) => bytes[offset + i] === v)
  if (at(0, 0xff, 0xd8, 0xff)) return 'jpeg'
  if (at(0, 0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return 'png'
  if (at(0, 0x52, 0x49, 0x46, 0x46) && at(8, 0x57, 0x45, 0x42, 0x50, 0x56, 0x50)) return 'webp'
  return null
}

const megabytes = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1).replace(/\.0$/, '')} MB`

function tooBig(size?: number) {
  const what = size ? `The photo is ${megabytes(size)}; photos` : 'Photos'
  return new DomainError(
    'too-large',
    `${what} can be up to ${megabytes(PHOTO_MAX_BYTES)}. Save it smaller (2,000 pixels across is plenty for a recipe) and upload it again.`,
    { field: 'photo', data: { maxBytes: PHOTO_MAX_BYTES } },
  )
}

function notAPhoto(detail: string) {
  return new DomainError('unsupported-type', `Photo: ${detail} Upload a ${ACCEPTED} image.`, {
    field: 'photo', data: { accepted: Object.values(TYPES).map((t) => t.mime) },
  })
}

/** The bytes of the file in the multipart field `field`, with the size checked before and after reading. */
export async function readPhotoUpload(event: H3Event, field = 'photo'): Promise<Buffer> {
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!type.toLowerCase().startsWith('multipart/form-data')) {
    throw new DomainError('invalid', `Photo: send it as a form upload (multipart/form-data) in a field named "${field}".`, { field: field })
  }
  const length = Number(getRequestHeader(event, 'content-length'))
  if (!Number.isFinite(length) || length <= 0) {
    throw new DomainError('length-required', `Photo: the upload must state its size (Content-Length); send it from a form or with a Content-Length header.`, { field: field })
  }
  if (length > PHOTO_MAX_BYTES + MULTIPART_SLACK) throw tooBig(length)
  const parts = (await readMultipartFormData(event)) ?? []
  const part = parts.find((p) => p.name === field)
  if (!part || part.data.length === 0) {
    throw new DomainError('invalid', `Photo: attach it in a form field named "${field}".`, { field: field })
  }
  if (part.data.length > PHOTO_MAX_BYTES) throw tooBig(part.data.length)
  return part.data
}

// ---- sharp: loaded once, on first use; without it photos are refused, never kept as sent -----------

type SharpFactory = (input?: Buffer, options?: SharpOptions) => Sharp
let sharpLoading: Promise<SharpFactory | null> | undefined

function loadSharp(): Promise<SharpFactory | null> {
  sharpLoading ??= import('sharp').then(
    (m) => (m.default ?? m) as unknown as SharpFactory,
    (error: Error) => {
      console.error(`[hobline] sharp could not load (${error.message.split('\n')[0]}): photo uploads are refused until it does`)
      return null
    },
  )
  return sharpLoading
}

export interface PhotoVersions {
  type: PhotoType
  original: Buffer
  thumb: Buffer | null
}

/**
 * The photo to keep: turned upright by its EXIF orientation, then re-encoded in its own format
 * without any metadata (sharp drops EXIF, XMP and IPTC unless asked to keep them), plus a WebP
 * thumbnail. Damaged images and images over the pixel limit are refused with what to do.
 */
export async function preparePhoto(bytes: Buffer): Promise<PhotoVersions> {
  const type = sniffPhotoType(bytes)
  if (!type) throw notAPhoto('this file is not an image Hobline takes (it is checked by its contents, not its name).')
  const sharp = await loadSharp()
  // Without the image library the camera's metadata (GPS included) could not be removed: refuse, store nothing.
  if (!sharp) {
    throw new DomainError('unavailable', 'Photos cannot be taken right now: the server\'s image library did not load. Nothing was stored; '
      + 'ask whoever runs this Hobline server to reinstall it (npm install), then upload the photo again.')
  }
  // The header is read first (no pixels decoded), so an oversized image gets a message, not a crash.
  let width = 0
  let height = 0
  try {
    ;({ width = 0, height = 0 } = await sharp(bytes, { limitInputPixels: false }).metadata())
  } catch {
    throw notAPhoto(`the file starts like a ${type.toUpperCase()} image but could not be read; it may be damaged or cut short.`)
  }
  if (width * height > PHOTO_MAX_PIXELS) {
    throw new DomainError(
      'too-large',
      `The photo is ${width} × ${height} pixels; photos can be up to ${PHOTO_MAX_PIXELS / 1_000_000} megapixels. Resize it and upload it again.`,
      { field: 'photo', data: { maxPixels: PHOTO_MAX_PIXELS } },
    )
  }
  try {
    const upright = sharp(bytes, { limitInputPixels: PHOTO_MAX_PIXELS, failOn: 'error' }).rotate()
    const encoded = type === 'jpeg' ? upright.clone().jpeg({ quality: 90, mozjpeg: true })
      : type === 'png' ? upright.clone().png({ compressionLevel: 9 })
        : upright.clone().webp({ quality: 90 })
    const [original, thumb] = await Promise.all([
      encoded.toBuffer(),
      upright.clone().resize({ width: PHOTO_THUMB_WIDTH, withoutEnlargement: true }).webp({ quality: 78 }).toBuffer(),
    ])
    return { type, original, thumb }
  } catch {
    throw notAPhoto(`the ${type.toUpperCase()} image could not be decoded; it may be damaged or cut short.`)
  }
}

// ---- the store -----------------------------------------------------------------------------------

export interface PhotoStorageConfig {
  /** Folder of the filesystem store, used when no S3 bucket is configured. */
  dir: string
  s3: { endpoint: string; bucket: string; region: string; accessKeyId: string; secretAccessKey: string }
}

/** The same settings as runtimeConfig.photos, read from the environment (for scripts outside the server). */
export function photoConfigFromEnv(env: Record<string, string | undefined> = process.env): PhotoStorageConfig {
  return {
    dir: env.NUXT_PHOTOS_DIR || '.data/photos',
    s3: {
      endpoint: env.NUXT_PHOTOS_S3_ENDPOINT ?? '',
      bucket: env.NUXT_PHOTOS_S3_BUCKET ?? '',
      region: env.NUXT_PHOTOS_S3_REGION ?? '',
      accessKeyId: env.NUXT_PHOTOS_S3_ACCESS_KEY_ID ?? '',
      secretAccessKey: env.NUXT_PHOTOS_S3_SECRET_ACCESS_KEY ?? '',
    },
  }
}

/**
 * The driver for the configured store: an S3-compatible bucket when an endpoint or a bucket is set
 * (and then every S3 setting but the region must be), else a folder. Throws naming what is missing.
 */
export function photoDriver(config: PhotoStorageConfig): { driver: Driver; where: string } {
  const s3 = config.s3 ?? {}
  if (s3.endpoint || s3.bucket) {
    const missing = (['endpoint', 'bucket', 'accessKeyId', 'secretAccessKey'] as const)
      .filter((name) => !s3[name])
      .map((name) => `NUXT_PHOTOS_S3_${name.replace(/[A-Z]/g, (c) => `_${c}`).toUpperCase()}`)
    if (missing.length) throw new Error(`S3 photo storage is half configured: set ${missing.join(', ')} (or unset NUXT_PHOTOS_S3_ENDPOINT and NUXT_PHOTOS_S3_BUCKET to keep photos in a folder)`)
    // us-east-1 is the region S3-compatible servers such as MinIO answer to by default (from memory).
    const region = s3.region || 'us-east-1'
    const driver = s3Driver({ endpoint: s3.endpoint, bucket: s3.bucket, region, accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey })
    let host = s3.endpoint
    try {
      host = new URL(s3.endpoint).host
    } catch {
      // Not a URL: the log names the endpoint as written.
    }
    return { driver, where: `S3 bucket "${s3.bucket}" at ${host} (${region})` }
  }
  const dir = config.dir || '.data/photos'
  return { driver: fsDriver({ base: dir }), where: `folder ${dir}` }
}

let store: Storage | undefined
let storeProblem = 'The photo store has not started yet. Try again in a moment.'

/** Set by the photos plugin (or a script): the store every function here reads and writes. */
export function setPhotoStorage(storage: Storage | undefined, problem?: string) {
  store = storage
  if (problem) storeProblem = `Photos are unavailable: ${problem}.`
}

function photoStore(): Storage {
  if (!store) throw new DomainError('unavailable', storeProblem)
  return store
}

async function getBytes(key: string): Promise<Buffer | null> {
  const value = await photoStore().getItemRaw(key)
  if (value === null || value === undefined) return null
  if (Buffer.isBuffer(value)) return value
  if (value instanceof ArrayBuffer || ArrayBuffer.isView(value)) return Buffer.from(value as ArrayBuffer)
  return null
}

// ---- keys ----------------------------------------------------------------------------------------

const KEY = /^studio-([1-9]\d{0,9})\/recipe-([1-9]\d{0,9})\/([A-Za-z0-9_-]{8,80})\.(jpg|png|webp)$/

function newPhotoKey(studioId: number, recipeId: number, type: PhotoType, label?: string) {
  const name = `${label ? `${label}-` : ''}${randomBytes(12).toString('base64url')}`
  return `studio-${studioId}/recipe-${recipeId}/${name}.${TYPES[type].ext}`
}

/** The thumbnail stored beside a photo: `<name>.thumb.webp`, never itself a photo address. */
export function photoThumbKey(key: string) {
  return key.replace(/\.(jpg|png|webp)$/, '.thumb.webp')
}

/**
 * A photo address from the route (`studio-1/recipe-2/<name>.jpg`). 400 for anything that tries to
 * leave the store (`..`, `.`, an absolute or drive path, backslashes, encoded slashes, NUL); 404 for
 * any other name that is not a photo address, before anyone is asked who they are.
 */
export function parsePhotoKey(raw: string | undefined): { key: string; studioId: number; recipeId: number } {
  let key = raw ?? ''
  try {
    key = decodeURIComponent(key)
  } catch {
    throw new DomainError('invalid', 'This photo address has a broken %-escape; use the address the recipe gives.')
  }
  const segments = key.split('/')
  if (key.startsWith('/') || /^[A-Za-z]:/.test(key) || /[\\\0]/.test(key) || segments.some((s) => s === '..' || s === '.' || s === '')) {
    throw new DomainError('invalid', 'This photo address leaves the photo store (no "..", "." or empty parts, no absolute paths); use the address the recipe gives.')
  }
  const m = KEY.exec(key)
  if (!m) throw new DomainError('not-found', 'There is no such photo.')
  return { key, studioId: Number(m[1]), recipeId: Number(m[2]) }
}

// ---- photos of recipes and steps -----------------------------------------------------------------

async function writePhoto(key: string, versions: PhotoVersions) {
  const storage = photoStore()
  await storage.setItemRaw(key, versions.original)
  if (versions.thumb) {
    try {
      await storage.setItemRaw(photoThumbKey(key), versions.thumb)
    } catch (error) {
      await storage.removeItem(key).catch(() => {})
      throw error
    }
  }
}

/** Removes photos and their thumbnails; a store that fails is logged, never stops the caller. */
export async function deletePhotos(keys: Array<string | null | undefined>) {
  const storage = photoStore()
  for (const key of keys) {
    if (!key) continue
    for (const k of [key, photoThumbKey(key)]) {
      await storage.removeItem(k).catch((error: Error) => console.warn(`[hobline] could not delete photo ${k}: ${error.message}`))
    }
  }
}

/** Stores the uploaded photo as the recipe's photo (replacing and deleting the one before); its key. */
export async function setRecipePhoto(recipeId: number, studioId: number, bytes: Buffer): Promise<string> {
  const versions = await preparePhoto(bytes)
  const key = newPhotoKey(studioId, recipeId, versions.type)
  await writePhoto(key, versions)
  await useDb()
  const row = await Recipe.findOne({ where: { id: recipeId, studioId }, attributes: ['id', 'photo'] })
  if (!row) {
    await deletePhotos([key])
    throw new DomainError('not-found', 'There is no such recipe.')
  }
  const before = row.photo
  await Recipe.update({ photo: key }, { where: { id: recipeId } })
  if (before && before !== key) await deletePhotos([before])
  return key
}

export async function clearRecipePhoto(recipeId: number) {
  await useDb()
  const row = await Recipe.findByPk(recipeId, { attributes: ['id', 'photo'] })
  if (!row?.photo) return
  await Recipe.update({ photo: null }, { where: { id: recipeId } })
  await deletePhotos([row.photo])
}

/** 404 unless the step belongs to the recipe. */
export async function requireRecipeStep(recipeId: number, stepId: number) {
  await useDb()
  const step = await RecipeStep.findOne({ where: { id: stepId, recipeId }, attributes: ['id', 'photo'] })
  if (!step) throw new DomainError('not-found', 'There is no such step in this recipe.')
  return step
}

export async function setStepPhoto(recipeId: number, studioId: number, stepId: number, bytes: Buffer): Promise<string> {
  const versions = await preparePhoto(bytes)
  const key = newPhotoKey(studioId, recipeId, versions.type, `step-${stepId}`)
  await writePhoto(key, versions)
  const step = await requireRecipeStep(recipeId, stepId).catch(async (error) => {
    await deletePhotos([key])
    throw error
  })
  const before = step.photo
  await RecipeStep.update({ photo: key }, { where: { id: stepId, recipeId } })
  if (before && before !== key) await deletePhotos([before])
  return key
}

export async function clearStepPhoto(recipeId: number, stepId: number) {
  const step = await requireRecipeStep(recipeId, stepId)
  if (!step.photo) return
  await RecipeStep.update({ photo: null }, { where: { id: stepId, recipeId } })
  await deletePhotos([step.photo])
}

/**
 * The keys of a recipe's photos (its own and its steps'). Read them before deleting the recipe, and
 * pass them to `deletePhotos` once the rows are gone, so a failed delete never loses a photo.
 */
export async function recipePhotoKeys(recipeId: number): Promise<string[]> {
  await useDb()
  const recipe = await Recipe.findByPk(recipeId, { attributes: ['id', 'photo'] })
  const steps = await RecipeStep.findAll({ where: { recipeId }, attributes: ['id', 'photo'] })
  return [recipe?.photo, ...steps.map((s) => s.photo)].filter((k): k is string => !!k)
}

/** The stored bytes and their type; `thumb` falls back to the photo itself when it has no thumbnail. */
export async function readPhoto(key: string, size: 'full' | 'thumb' = 'full'): Promise<{ bytes: Buffer; type: string }> {
  if (size === 'thumb') {
    const thumb = await getBytes(photoThumbKey(key))
    if (thumb) return { bytes: thumb, type: 'image/webp' }
  }
  const bytes = await getBytes(key)
  if (!bytes) throw new DomainError('not-found', 'There is no such photo; it may have been replaced or deleted.')
  return { bytes, type: MIME_BY_EXT[key.slice(key.lastIndexOf('.') + 1)]! }
}

// ---- demo photos ---------------------------------------------------------------------------------

type DemoPhotoSource = (name: DemoPhotoName) => Promise<{ photo: Uint8Array; thumb: Uint8Array }>
let demoPhotoSource: DemoPhotoSource = readDemoPhotoFile

/** The built server has no source tree: its plugin hands over the demo photos bundled into it. */
export function setDemoPhotoSource(source: DemoPhotoSource) {
  demoPhotoSource = source
}

/**
 * Stores one of the demo photos (server/db/demo-photos) for a recipe and returns its key, to put in
 * `recipes.photo` or `recipe_steps.photo`. The files are made clean and small by
 * scripts/make-demo-photos.ts, thumbnails included, so this only copies them into the store.
 */
export async function storeDemoPhoto(name: DemoPhotoName, studioId: number, recipeId: number): Promise<string> {
  const { photo, thumb } = await demoPhotoSource(name)
  const key = newPhotoKey(studioId, recipeId, 'jpeg', `demo-${name}`)
  await writePhoto(key, { type: 'jpeg', original: Buffer.from(photo), thumb: Buffer.from(thumb) })
  return key
}
