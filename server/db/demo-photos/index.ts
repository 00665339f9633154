// The demo studio's photos, one for each demo recipe: drawn for Hobline by scripts/make-demo-photos.ts (simple shapes in the
// Hobline palette, no photograph of anyone's kitchen), each a JPEG with its WebP thumbnail beside it.
// Outside the built server they are read from this folder; the server bundles them (plugin 03.photos).
import { readFile } from 'node:fs/promises'

export const DEMO_PHOTO_NAMES = ['stew', 'flatbreads', 'squash'] as const
export type DemoPhotoName = (typeof DEMO_PHOTO_NAMES)[number]

export async function readDemoPhotoFile(name: DemoPhotoName): Promise<{ photo: Uint8Array; thumb: Uint8Array }> {
  if (!DEMO_PHOTO_NAMES.includes(name)) throw new Error(`no demo photo named "${name}"; there are ${DEMO_PHOTO_NAMES.join(', ')}`)
  const [photo, thumb] = await Promise.all([
    readFile(new URL(`./${name}.jpg`, import.meta.url)),
    readFile(new URL(`./${name}.thumb.webp`, import.meta.url)),
  ])
  return { photo, thumb }
}
