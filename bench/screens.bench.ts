// The prompter in real Chromium on loopback: what the route ships (JS + CSS, gzipped), how soon its
// text is painted with the CPU slowed 4× (Largest Contentful Paint), and how long a key press takes
// to show the next step. Each figure has a baseline from the same run:
// - size and LCP: the join page, the smallest page a tablet opens;
// - key to paint: a bare page on the same server origin that changes one attribute on keydown.
// Gzip at zlib's default level 6 (what most servers send); LCP from the browser's own
// largest-contentful-paint entries (W3C Largest Contentful Paint); CPU slowed through the Chrome
// DevTools Protocol (Emulation.setCPUThrottlingRate, rate 4).
import { gzipSync } from 'node:zlib'
import { chromium, type Browser, type Page } from 'playwright-core'
import { DEMO_PASSWORD } from '../server/db/demo'
import { CHROMIUM_ARGS, CHROMIUM_PATH } from '../tests/support/chromium'
import { signIn, startBuiltApp } from './server'
import { percentile, type Benchmark, type BenchResult } from './types'

interface Setup { url: string; cookie: string; shootId: number; browser: Browser; stop: () => Promise<void> }
let shared: Promise<Setup> | undefined

async function setup(): Promise<Setup> {
  const app = await startBuiltApp()
  const cookie = await signIn(app.url, 'host@brackenford.test', DEMO_PASSWORD)
  const producer = await signIn(app.url, 'producer@brackenford.test', DEMO_PASSWORD)
  const res = await fetch(`${app.url}/api/episodes/1/shoots`, { method: 'POST', headers: { cookie: producer, origin: app.url, 'content-type': 'application/json' }, body: JSON.stringify({ mode: 'rehearsal' }) })
  const shootId = ((await res.json()) as { shoot: { id: number } }).shoot.id
  await fetch(`${app.url}/api/shoots/${shootId}/commands`, { method: 'POST', headers: { cookie: producer, origin: app.url, 'content-type': 'application/json' }, body: JSON.stringify({ type: 'shoot.start' }) })
  const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS })
  return { ...app, cookie, shootId, browser, stop: async () => { await browser.close(); await app.stop() } }
}
const ready = () => (shared ??= setup())

async function pageWithSession(s: Setup): Promise<Page> {
  const context = await s.browser.newContext({ viewport: { width: 1024, height: 768 } })
  const [name, value] = s.cookie.split('=') as [string, string]
  await context.addCookies([{ name, value, url: s.url }])
  return context.newPage()
}

/** JS and CSS bytes a page loads (its lazy chunks too, once the page is idle), gzipped one by one. */
async function shippedBytes(s: Setup, path: string): Promise<number> {
  const page = await pageWithSession(s)
  const bodies: Promise<number>[] = []
  page.on('response', (r) => {
    const type = r.request().resourceType()
    if (type === 'script' || type === 'stylesheet') bodies.push(r.body().then((b) => gzipSync(b).length).catch(() => 0))
  })
  await page.goto(`${s.url}${path}`, { waitUntil: 'networkidle' })
  await page.waitForTimeout(500)
  const total = (await Promise.all(bodies)).reduce((a, b) => a + b, 0)
  await page.context().close()
  return total / 1024
}

async function lcpMs(s: Setup, path: string): Promise<number> {
  const page = await pageWithSession(s)
  try {
    const cdp = await page.context().newCDPSession(page)
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 })
    await page.goto(`${s.url}${path}`, { waitUntil: 'load' })
    const lcp = await page.evaluate(() => new Promise<number>((resolve) => {
      let last = 0
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) last = e.startTime
      }).observe({ type: 'largest-contentful-paint', buffered: true })
      setTimeout(() => resolve(last), 1500)
    }))
    if (!(lcp > 0)) throw new Error(`no largest-contentful-paint entry on ${path}`)
    return lcp
  } finally {
    await page.context().close()
  }
}

/** ms from a keydown to the frame that shows what it changed: the change (of any of the
 * comma-separated attributes) is seen by a MutationObserver, and the paint is the first task after the next animation frame. `arm` installs
 * the listeners and returns once they are in place (so the key cannot come first, however slow the
 * machine); `result` waits for the figure, or says `null` when nothing changed within `ms`. */
const MEASURE = `
  window.__keyPaint = {
    arm(target, attr) {
      const state = { t0: 0, done: null }
      window.__keyPaint.state = state
      addEventListener('keydown', (e) => { state.t0 = e.timeStamp }, { capture: true, once: true })
      const obs = new MutationObserver(() => {
        obs.disconnect()
        requestAnimationFrame(() => setTimeout(() => { state.done = performance.now() - state.t0 }, 0))
      })
      obs.observe(document.querySelector(target), { attributes: true, attributeFilter: attr.split(','), subtree: true })
      state.stop = () => obs.disconnect()
      return true
    },
    result(ms) {
      const state = window.__keyPaint.state
      return new Promise((resolve) => {
        const until = performance.now() + ms
        const check = () => {
          if (state.done !== null) resolve(state.t0 ? state.done : null)
          else if (performance.now() > until) { state.stop(); resolve(null) }
          else setTimeout(check, 5)
        }
        check()
      })
    },
  }
`
type KeyPaintWindow = { __keyPaint: { arm: (t: string, a: string) => boolean; result: (ms: number) => Promise<number | null> } }

/** One figure per round; a press whose change did not show within 5 s fails the benchmark with
 * what happened, instead of waiting for ever. */
async function keyToPaint(page: Page, target: string, attr: string, rounds: number, key: string, ready?: () => Promise<void>): Promise<number[]> {
  await page.addScriptTag({ content: MEASURE })
  const out: number[] = []
  for (let i = 0; i < rounds; i++) {
    await ready?.()
    await page.evaluate(([t, a]) => (window as unknown as KeyPaintWindow).__keyPaint.arm(t!, a!), [target, attr])
    await page.keyboard.press(key)
    const ms = await page.evaluate((wait) => (window as unknown as KeyPaintWindow).__keyPaint.result(wait), 5000)
    if (ms === null) throw new Error(`${key} press ${i + 1} of ${rounds} changed no ${attr} under ${target} within 5 s`)
    out.push(ms)
    await page.waitForTimeout(150)
  }
  return out
}

const ROUNDS = 10
const LCP_RUNS = 5

async function keyToPaintRun(s: Setup): Promise<BenchResult> {
  const page = await pageWithSession(s)
  page.on('crash', () => console.warn('key press to paint: the prompter page crashed'))
  const bare = await s.browser.newPage()
  try {
    await page.goto(`${s.url}/shoots/${s.shootId}/prompter`, { waitUntil: 'networkidle' })
    // A command is refused while the socket is down, so each press waits for the screen to be online.
    const online = () => page.locator('[data-testid="connection"][data-online="true"]').waitFor({ timeout: 15_000 })
    // Forward then back, so the shoot ends where it started.
    // A move between segments (the demo show's intro to its cooking) changes data-segment, not data-step.
    const forward = await keyToPaint(page, '[data-testid="prompter"]', 'data-step,data-segment', ROUNDS / 2, 'PageDown', online)
    const back = await keyToPaint(page, '[data-testid="prompter"]', 'data-step,data-segment', ROUNDS / 2, 'PageUp', online)
    await bare.goto(`${s.url}/robots.txt`)
    await bare.setContent('<p id="x" data-step="0">step</p><script>addEventListener("keydown", () => { const x = document.getElementById("x"); x.dataset.step = String(Number(x.dataset.step) + 1) })</script>')
    const baseline = await keyToPaint(bare, '#x', 'data-step', ROUNDS, 'PageDown')
    return { figure: percentile([...forward, ...back], 95), unit: 'ms', baseline: percentile(baseline, 95), bound: 50, note: `${ROUNDS} presses; baseline: a bare page changing one attribute` }
  } finally {
    await bare.close().catch(() => {})
    await page.context().close().catch(() => {})
  }
}

export const screenBenchmarks: Benchmark[] = [
  {
    name: 'prompter route JS+CSS (gzip)',
    group: 'screens',
    async run() {
      const s = await ready()
      const prompter = await shippedBytes(s, `/shoots/${s.shootId}/prompter`)
      const join = await shippedBytes(s, '/join')
      return { figure: prompter, unit: 'KB', baseline: join, bound: 150, note: 'baseline: the join page' }
    },
  },
  {
    name: 'prompter LCP, CPU 4× slower',
    group: 'screens',
    async run() {
      const s = await ready()
      const prompter = `/shoots/${s.shootId}/prompter`
      // One visit of each first, not counted: the server's first render of a route loads its code.
      await lcpMs(s, prompter)
      await lcpMs(s, '/join')
      const runs = [] as number[]
      const base = [] as number[]
      for (let i = 0; i < LCP_RUNS; i++) {
        runs.push(await lcpMs(s, prompter))
        base.push(await lcpMs(s, '/join'))
      }
      return { figure: percentile(runs, 50) / 1000, unit: 's', baseline: percentile(base, 50) / 1000, bound: 1.0, note: `median of ${LCP_RUNS}; baseline: the join page` }
    },
  },
  {
    name: 'prompter key press to paint (p95)',
    group: 'screens',
    async run() {
      const s = await ready()
      try {
        // A renderer that dies under load (the page or its browser "has been closed") is named and
        // measured once more on a fresh page; any other failure ends the benchmark at once.
        try {
          return await keyToPaintRun(s)
        } catch (error) {
          if (!/has been closed|crash/i.test((error as Error).message)) throw error
          console.warn(`key press to paint: ${(error as Error).message.split('\n')[0]}; measuring again on a fresh page`)
          return await keyToPaintRun(s)
        }
      } finally {
        await s.stop()
        shared = undefined
      }
    },
  },
]
