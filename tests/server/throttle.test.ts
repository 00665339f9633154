// The sign-in limit trips with a clear 429 and recovers when its window has passed.
// The window is 2 s here (NUXT_AUTH_THROTTLE_WINDOW_SECONDS); the product default is 15 minutes.
import { describe, expect, it } from 'vitest'
import { useBuiltApp } from '../support/app'
import { Client, demo } from '../support/client'

describe('sign-in limits', async () => {
  await useBuiltApp({ env: { NUXT_AUTH_THROTTLE_WINDOW_SECONDS: '2', NUXT_AUTH_LOGIN_PER_EMAIL: '3', NUXT_AUTH_JOIN_PER_ADDRESS: '4' } })

  it('per e-mail: the fourth wrong try is refused even with the right password, then it recovers', async () => {
    const client = new Client()
    for (let i = 0; i < 3; i++) expect((await client.post('/api/auth/login', { email: demo.camera, password: 'wrong password' })).status).toBe(401)
    const blocked = await client.post('/api/auth/login', { email: demo.camera, password: 'hob-demo-2026' })
    expect(blocked.status).toBe(429)
    expect(blocked.body.statusMessage).toMatch(/^Too many sign-in attempts for camera@brackenford.test\. Try again in \d seconds\.$/)
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(0)
    // Another account is not affected.
    expect((await client.post('/api/auth/login', { email: demo.viewer, password: 'hob-demo-2026' })).status).toBe(200)
    await new Promise((r) => setTimeout(r, 2200))
    expect((await client.post('/api/auth/login', { email: demo.camera, password: 'hob-demo-2026' })).status).toBe(200)
  })

  it('join codes: wrong guesses from one address are limited', async () => {
    const client = new Client()
    for (let i = 0; i < 4; i++) expect((await client.post('/api/join', { code: `ZZZ99${i}` })).status).toBe(404)
    const blocked = await client.post('/api/join', { code: 'ZZZ995' })
    expect(blocked.status).toBe(429)
    expect(blocked.body.statusMessage).toMatch(/Too many join-code attempts/)
    await new Promise((r) => setTimeout(r, 2200))
    expect((await client.post('/api/join', { code: 'ZZZ996' })).status).toBe(404)
  })
})
