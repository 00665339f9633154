// npm run demo — build, then serve the built app with the demo studio on the embedded SQLite database.
// `npm run demo -- --https` serves it to the studio network over https (scripts/tls-setup.ts): the
// tablets and phones open the printed address, and trust the studio's root once at /on-set.
import { spawn, spawnSync } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { get } from 'node:https'
import { DEMO_PASSWORD, demoCrew, demoStudio } from '../server/db/demo'
import { certificateFingerprint, lanAddress } from '../server/tls/local-ca'
import { databasePath } from './env'
import { demoTls, tlsEnv } from './tls-setup'

const https = process.argv.includes('--https')
const port = process.env.PORT || '3000'
// Over https the demo is for the studio network: every interface, unless HOST says otherwise.
const host = process.env.HOST || (https ? '0.0.0.0' : '127.0.0.1')
const tls = https ? demoTls() : null

if (!process.argv.includes('--no-build')) {
  const build = spawnSync('npx', ['nuxt', 'build'], { stdio: 'inherit' })
  if (build.status !== 0) process.exit(build.status ?? 1)
}

// A session secret kept beside the database, so sign-ins survive a restart of the demo.
mkdirSync('.data', { recursive: true })
const secretFile = '.data/session-password'
if (!existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 })

// On every interface the address to print (and put in QR codes) is the laptop's on the studio network.
const shownHost = host === '0.0.0.0' ? lanAddress() ?? 'localhost' : host
const url = `${https ? 'https' : 'http'}://${shownHost}:${port}`
const server = spawn('node', ['.output/server/index.mjs'], {
  stdio: 'inherit',
  env: {
    ...process.env,
    PORT: port,
    HOST: host,
    NUXT_DATABASE_PATH: databasePath,
    NUXT_DATABASE_SEED: 'always',
    NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD || readFileSync(secretFile, 'utf8'),
    // The built server needs its public address (links in mail); the demo's own unless one is given.
    NUXT_PUBLIC_SITE_URL: process.env.NUXT_PUBLIC_SITE_URL || url,
    // A Secure session cookie is dropped by a browser on a plain-http studio address (only localhost
    // is exempt), and a tablet could not stay signed in: Secure only over https.
    NUXT_SESSION_COOKIE_SECURE: process.env.NUXT_SESSION_COOKIE_SECURE || String(https),
    ...(tls ? tlsEnv(tls) : {}),
  },
})
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.kill(signal))
server.on('exit', (code) => process.exit(code ?? 0))

for (let i = 0; i < 120; i++) {
  const health = await askHealth().catch(() => null)
  if (health?.status === 'ok') {
    console.log(`\nHobline is running at ${url}`)
    if (tls?.rootCert) {
      console.log(`On each tablet and phone: open ${url}/on-set and trust the studio certificate once (${tls.rootCert}).`)
      console.log(`Its SHA-256 fingerprint, to compare on the device: ${certificateFingerprint(readFileSync(tls.rootCert, 'utf8'))}`)
    } else if (tls) console.log('Served with the studio\'s own certificate.')
    else console.log('Plain http: tablets cannot keep the screen awake, hear voice commands or install the app; `npm run demo -- --https` can.')
    console.log(`Demo studio: ${demoStudio.name} (database ${databasePath})`)
    console.log(`Demo accounts, all with the password ${DEMO_PASSWORD}:`)
    for (const person of demoCrew) console.log(`  ${person.role.padEnd(9)} ${person.email}  (${person.name})`)
    console.log('Stop with Ctrl+C.\n')
    break
  }
  await new Promise((r) => setTimeout(r, 500))
}

/** GET /api/health on the demo's own address (over https, trusting the studio root or its own certificate). */
function askHealth(): Promise<{ status?: string }> {
  if (!tls) return fetch(`${url}/api/health`).then((r) => r.json())
  const ca = readFileSync(tls.rootCert ?? tls.cert, 'utf8')
  return new Promise((done, fail) => {
    get({ host: host === '0.0.0.0' ? '127.0.0.1' : host, port, path: '/api/health', ca, servername: 'localhost', checkServerIdentity: () => undefined }, (res) => {
      let body = ''
      res.on('data', (c) => (body += c))
      res.on('end', () => done(JSON.parse(body)))
    }).on('error', fail)
  })
}
