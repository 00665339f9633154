// The built app: health, home and error pages.
import { $fetch, fetch } from '@nuxt/test-utils/e2e'
import { describe, expect, it } from 'vitest'
import { migrations } from '../../server/db/migrations'
import { useBuiltApp } from '../support/app'

describe('built app', async () => {
  await useBuiltApp()

  it('reports a migrated database on WAL with foreign keys', async () => {
    const health = await $fetch<{ status: string; database: unknown; migrations: unknown }>('/api/health')
    expect(health.status).toBe('ok')
    expect(health.database).toMatchObject({ file: 'hobline.sqlite', journalMode: 'wal', foreignKeys: true, busyTimeoutMs: 5000 })
    expect(health.migrations).toEqual({ applied: migrations.map((m) => m.name), pending: [], migrated: true })
  })

  it('serves the home page, saying what Hobline is', async () => {
    const res = await fetch('/')
    expect(res.status).toBe(200)
    const html = await res.text()
    expect(html).toContain('One live script for the whole kitchen shoot.')
    expect(html).toMatch(/<html\s+lang="en"/)
  })

  it('serves the static files the page names: its CSS, its scripts and the icon', async () => {
    const html = await (await fetch('/')).text()
    const assets = [...html.matchAll(/(?:href|src)="(\/_nuxt\/[^"]+)"/g)].map((m) => m[1]!)
    expect(assets.length).toBeGreaterThan(1)
    for (const path of [...new Set(assets), '/favicon.svg']) {
      const res = await fetch(path)
      expect(res.status, path).toBe(200)
    }
  })

  it('answers an unknown page with a 404 in Hobline\'s own look', async () => {
    const res = await fetch('/no-such-page', { headers: { accept: 'text/html' } })
    expect(res.status).toBe(404)
    expect(await res.text()).toContain('This page is not on the run order')
  })

  it('answers an unknown API route with a JSON 404, not the page', async () => {
    const res = await fetch('/api/no-such-route')
    expect(res.status).toBe(404)
    expect(res.headers.get('content-type')).toContain('application/json')
  })
})
