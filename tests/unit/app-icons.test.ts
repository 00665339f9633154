// The installed app's icons (public/icons, named by the web app manifest in pwa.config.ts) are the
// ones scripts/make-icons.ts draws from the brand mark, in the sizes installability asks for: 192 and
// 512 px (Chromium's installable-manager wants a square icon of 144 px or more; 192 and 512 are the
// sizes web.dev's "Add a web app manifest" names), and a 512 px maskable one (W3C Web App Manifest,
// "purpose" member).
import { readFileSync } from 'node:fs'
import sharp from 'sharp'
import { describe, expect, it } from 'vitest'
import { APP_ICONS, renderIcon } from '../../scripts/make-icons'
import { pwa } from '../../pwa.config'

describe('app icons', () => {
  it('are committed as drawn, square, in the sizes the manifest names', async () => {
    for (const icon of APP_ICONS) {
      const file = readFileSync(icon.file)
      const meta = await sharp(file).metadata()
      expect([meta.format, meta.width, meta.height], icon.file).toEqual(['png', icon.size, icon.size])
      const [committed, drawn] = await Promise.all([sharp(file).raw().toBuffer(), sharp(await renderIcon(icon.size, icon.maskable)).raw().toBuffer()])
      expect(committed.equals(drawn), `${icon.file} is stale: npx tsx scripts/make-icons.ts`).toBe(true)
    }
    const named = (pwa.manifest || undefined)?.icons?.map((i) => [i.src, i.sizes, i.purpose])
    expect(named).toEqual(APP_ICONS.map((i) => [i.file.replace(/^public/, ''), `${i.size}x${i.size}`, i.maskable ? 'maskable' : 'any']))
  })

  it('a maskable icon keeps the mark inside the safe zone: its corners are background', async () => {
    const maskable = APP_ICONS.find((i) => i.maskable)!
    const { data, info } = await sharp(readFileSync(maskable.file)).raw().toBuffer({ resolveWithObject: true })
    const at = (x: number, y: number) => [...data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3)]
    // The safe zone is the centre circle of radius 40% (W3C Web App Manifest, icon masks): outside it only the background.
    const night = [0x0f, 0x13, 0x18]
    for (const [x, y] of [[0, 0], [511, 0], [0, 511], [511, 511], [256, 40], [40, 256]]) expect(at(x!, y!), `${x},${y}`).toEqual(night)
  })
})
