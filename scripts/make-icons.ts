// npx tsx scripts/make-icons.ts — the installed app's icons (web app manifest, nuxt.config.ts `pwa`)
// drawn from the brand mark (components/brand/BrandMark.vue, public/favicon.svg) in the set palette:
// 192 and 512 px for "any" purpose, and a 512 px maskable one whose mark sits inside the safe zone
// (the centre circle of 40% radius, W3C Web App Manifest "icon masks"). tests/unit/app-icons.test.ts
// fails when a committed file differs from what this draws.
import { writeFileSync } from 'node:fs'
import sharp from 'sharp'
import { palette } from '../shared/utils/palette'

export const APP_ICONS = [
  { file: 'public/icons/hobline-192.png', size: 192, maskable: false },
  { file: 'public/icons/hobline-512.png', size: 512, maskable: false },
  { file: 'public/icons/hobline-maskable-512.png', size: 512, maskable: true },
] as const

/** The mark on the night background; `scale` of the 32-unit mark's box the mark fills. */
export function iconSvg(size: number, maskable: boolean): string {
  const { night, bone, saffron } = palette.set
  // Maskable: full-bleed background, the mark in the middle 60% (inside the 80% safe circle).
  const inner = maskable ? 0.6 : 1
  const offset = (32 * (1 - inner)) / 2
  const corner = maskable ? 0 : 7
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 32 32">`
    + `<rect width="32" height="32" rx="${corner}" fill="${night}"/>`
    + `<g transform="translate(${offset} ${offset}) scale(${inner})">`
    + `<circle cx="16" cy="16" r="10" fill="none" stroke="${bone}" stroke-width="3"/>`
    + `<circle cx="16" cy="16" r="4" fill="none" stroke="${bone}" stroke-width="2.5"/>`
    + `<path d="M2 16h6M24 16h6" stroke="${saffron}" stroke-width="3" stroke-linecap="round"/></g></svg>`
}

export function renderIcon(size: number, maskable: boolean): Promise<Buffer> {
  return sharp(Buffer.from(iconSvg(size, maskable))).png({ compressionLevel: 9 }).toBuffer()
}

if (process.argv[1]?.endsWith('make-icons.ts')) {
  for (const icon of APP_ICONS) {
    writeFileSync(icon.file, await renderIcon(icon.size, icon.maskable))
    console.log(`${icon.file} (${icon.size}×${icon.size}${icon.maskable ? ', maskable' : ''})`)
  }
}
