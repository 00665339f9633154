// npm run demo — build, then serve the built app with the demo studio on the embedded SQLite database.
import { spawn, spawnSync } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { DEMO_PASSWORD, demoCrew, demoStudio } from '../server/db/demo'
import { databasePath } from './env'

const port = process.env.PORT || '3000'
const host = process.env.HOST || '127.0.0.1'

if (!process.argv.includes('--no-build')) {
  const build = spawnSync('npx', ['nuxt', 'build'], { stdio: 'inherit' })
  if (build.status !== 0) process.exit(build.status ?? 1)
}

// A session secret kept beside the database, so sign-ins survive a restart of the demo.
mkdirSync('.data', { recursive: true })
const secretFile = '.data/session-password'
if (!existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 })

const url = `http://${host === '0.0.0.0' ? 'localhost' : host}:${port}`
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
  },
})
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.kill(signal))
server.on('exit', (code) => process.exit(code ?? 0))

for (let i = 0; i < 120; i++) {
  const health = await fetch(`${url}/api/health`).then((r) => r.json()).catch(() => null)
  if (health?.status === 'ok') {
    console.log(`\nHobline is running at ${url}`)
    console.log(`Demo studio: ${demoStudio.name} (database ${databasePath})`)
    console.log(`Demo accounts, all with the password ${DEMO_PASSWORD}:`)
    for (const person of demoCrew) console.log(`  ${person.role.padEnd(9)} ${person.email}  (${person.name})`)
    console.log('Stop with Ctrl+C.\n')
    break
  }
  await new Promise((r) => setTimeout(r, 500))
}
