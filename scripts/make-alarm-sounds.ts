// npx tsx scripts/make-alarm-sounds.ts — writes the eight alarm sounds (one per timer slot) and the
// count-in tick to public/sounds/ from the patterns in shared/utils/alarm-sounds.ts. The files are
// committed; run this again only after changing a pattern (the unit test says when they are stale).
import { mkdirSync, writeFileSync } from 'node:fs'
import { ALARM_PATTERNS, COUNT_TICK_PATTERN, alarmSoundPath, COUNT_TICK_PATH, patternWav } from '../shared/utils/alarm-sounds'

const publicDir = new URL('../public/', import.meta.url)
mkdirSync(new URL('sounds/', publicDir), { recursive: true })

const files = [
  ...ALARM_PATTERNS.map((pattern) => ({ path: alarmSoundPath(pattern.slot), pattern })),
  { path: COUNT_TICK_PATH, pattern: COUNT_TICK_PATTERN },
]
for (const { path, pattern } of files) {
  const bytes = patternWav(pattern)
  writeFileSync(new URL(`.${path}`, publicDir), bytes)
  console.log(`${path}  ${pattern.title}  ${(bytes.length / 1024).toFixed(1)} KB`)
}
