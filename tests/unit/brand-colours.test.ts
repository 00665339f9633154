// The logo, the favicon, the browser's theme colour and the drawn demo photos use Hobline's palette (shared/utils/palette.ts,
// the colours tailwind.config.ts gives the pages), not colours of their own. Colours are read as SVG 1.1
// paints (fill, stroke, stop-color: a #rrggbb colour, none, currentColor or a url() to a gradient).
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { palette } from '../../tailwind.config'

const root = resolve(import.meta.dirname, '../..')
const read = (path: string) => readFileSync(resolve(root, path), 'utf8')
const paletteColours = new Set<string>([...Object.values(palette.plan), ...Object.values(palette.set)])

/** Every paint in an SVG's attributes and style, and every colour written anywhere in it. */
function paints(svg: string): string[] {
  const attrs = [...svg.matchAll(/(?<![:\w-])(?:fill|stroke|stop-color|color)\s*[=:]\s*"?([^";>\s]+)/g)].map((m) => m[1]!)
  const literals = [...svg.matchAll(/#[0-9a-f]{3,8}\b|rgba?\([^)]*\)|hsla?\([^)]*\)/gi)].map((m) => m[0])
  return [...attrs, ...literals]
}

const isPaletteOrNeutral = (paint: string) => paletteColours.has(paint.toLowerCase()) || ['none', 'currentColor'].includes(paint) || /^url\(#/.test(paint)

describe('favicon', () => {
  const svg = read('public/favicon.svg')
  it('paints only with palette colours', () => {
    const found = paints(svg)
    expect(found.length).toBeGreaterThan(0)
    expect(found.filter((p) => !isPaletteOrNeutral(p))).toEqual([])
  })
  it('is the mark on the shoot screens\' night', () => {
    expect(svg).toContain(`fill="${palette.set.night}"`)
  })
})

describe('the mark in the header (components/brand/BrandMark.vue)', () => {
  const source = read('components/brand/BrandMark.vue')
  it('writes no colour of its own: static paints are none or currentColor', () => {
    expect(paints(source).filter((p) => !isPaletteOrNeutral(p))).toEqual([])
  })
  it('takes its bound colours from the palette by name', () => {
    const bound = [...source.matchAll(/:(?:fill|stroke)="([^"]+)"/g)].map((m) => m[1]!)
    expect(bound.length).toBeGreaterThan(0)
    for (const expr of bound) {
      const [, theme, name] = /^palette\.(plan|set)\.(\w+)$/.exec(expr) ?? []
      expect(theme, expr).toBeDefined()
      expect((palette as Record<string, Record<string, string>>)[theme!]![name!], expr).toMatch(/^#[0-9a-f]{6}$/)
    }
  })
})

describe('the demo photos (scripts/make-demo-photos.ts)', () => {
  it('are drawn with palette colours only: the script writes no colour of its own', () => {
    const source = read('scripts/make-demo-photos.ts')
    expect(source).toMatch(/palette/)
    expect([...source.matchAll(/#[0-9a-f]{3,8}\b|rgba?\(|hsla?\(/gi)].map((m) => m[0])).toEqual([])
  })
})

describe('the browser theme colour (nuxt.config.ts app.head)', () => {
  it('is a palette colour', async () => {
    // nuxt.config.ts outside Nuxt: defineNuxtConfig is Nuxt's identity function, put in place here.
    ;(globalThis as { defineNuxtConfig?: (c: unknown) => unknown }).defineNuxtConfig = (c) => c
    // Imported by a path the type checker does not follow: nuxt.config.ts is checked in Nuxt's own project.
    const configPath = resolve(root, 'nuxt.config.ts')
    const config = (await import(/* @vite-ignore */ configPath)).default as { app: { head: { meta: { name?: string; content?: string }[] } } }
    const themes = config.app.head.meta.filter((m) => m.name === 'theme-color')
    expect(themes).toHaveLength(1)
    expect(paletteColours.has(themes[0]!.content!)).toBe(true)
    expect(themes[0]!.content).toBe(palette.set.night)
  })
})
