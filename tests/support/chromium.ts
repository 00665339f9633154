// The system Chromium (Debian's package), never a browser downloaded by a test tool.
import { existsSync } from 'node:fs'

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH || '/usr/bin/chromium'

// Without the networking flags Chromium tries to reach outside hosts, which this network refuses.
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  // Alarms must sound without a tap first, as they do once a crew member has touched the screen.
  '--autoplay-policy=no-user-gesture-required',
]

export function chromiumLaunchOptions() {
  return { executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS }
}

/**
 * Whether the browser layer can run. Locally a missing Chromium skips it with one line; under CI it
 * is a failure, since CI installs Chromium.
 */
export function chromiumAvailable(): boolean {
  if (existsSync(CHROMIUM_PATH)) return true
  if (process.env.CI === 'true' || process.env.CI === '1') {
    throw new Error(`Chromium is required in CI but ${CHROMIUM_PATH} is missing (apt-get install chromium).`)
  }
  console.warn(`[tests] browser tests skipped: no Chromium at ${CHROMIUM_PATH} (apt-get install chromium)`)
  return false
}
