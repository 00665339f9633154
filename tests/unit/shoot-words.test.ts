// The shoot screens' one vocabulary: every state and every action has exactly one label and one
// colour, the colours are the palette's, and the screens use these words rather than their own.
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { SHOOT_COMMAND_TYPES, SHOOT_MARKER_KINDS } from '../../shared/types/shoot'
import { palette } from '../../shared/utils/palette'
import {
  ACTION_WORDS, COLOUR_MEANINGS, COMMAND_ACTIONS, MARKER_WORDS, MODE_WORDS, SHOOT_VOCABULARY, STATUS_WORDS, TIMER_WORDS, timerLook,
} from '../../shared/utils/shoot-words'

const root = join(import.meta.dirname, '..', '..')

describe('the shoot vocabulary', () => {
  it('gives every state and action exactly one label and one palette colour, and no two the same label within a group', () => {
    for (const [group, words] of Object.entries(SHOOT_VOCABULARY)) {
      const labels = Object.values(words).map((w) => w.label)
      expect(new Set(labels).size, `${group}: a label used twice`).toBe(labels.length)
      for (const [key, w] of Object.entries(words)) {
        expect(Object.keys(w).sort(), `${group}.${key}`).toEqual(['colour', 'label'])
        expect(w.label.trim().length, `${group}.${key} label`).toBeGreaterThan(0)
        expect(Object.keys(palette.set), `${group}.${key} colour`).toContain(w.colour)
      }
    }
  })

  it('covers every status, mode, marker kind and command of the shoot', () => {
    expect(Object.keys(STATUS_WORDS).sort()).toEqual(['ended', 'paused', 'ready', 'running'])
    expect(Object.keys(MODE_WORDS).sort()).toEqual(['rehearsal', 'take'])
    expect(Object.keys(MARKER_WORDS).sort()).toEqual(['chapter', ...SHOOT_MARKER_KINDS].sort())
    expect(Object.keys(COMMAND_ACTIONS).sort()).toEqual([...SHOOT_COMMAND_TYPES].sort())
    const pressed = Object.values(COMMAND_ACTIONS).flat()
    // Every action is the button of exactly one command, and every command has a button.
    expect(pressed.sort()).toEqual(Object.keys(ACTION_WORDS).sort())
  })

  it('gives each meaning one colour: states that mean the same take the same colour, and the colours are the ones the screen check explains', () => {
    expect(TIMER_WORDS.running.colour).toBe(STATUS_WORDS.running.colour)
    expect(TIMER_WORDS.paused.colour).toBe(STATUS_WORDS.paused.colour)
    expect(TIMER_WORDS['paused-with-rehearsal'].colour).toBe(TIMER_WORDS.paused.colour)
    expect(TIMER_WORDS['last-minute'].colour).toBe(TIMER_WORDS.ringing.colour)
    for (const words of Object.values(SHOOT_VOCABULARY)) {
      for (const w of Object.values(words)) expect(Object.keys(COLOUR_MEANINGS)).toContain(w.colour)
    }
  })

  it('tells a timer\'s look from its state, its check and the time left', () => {
    const running = { state: 'running' as const, heldByShoot: false }
    expect(timerLook(running, { ringing: false, checking: false, remainingMs: 61_000 })).toBe('running')
    expect(timerLook(running, { ringing: false, checking: false, remainingMs: 60_000 })).toBe('last-minute')
    expect(timerLook(running, { ringing: false, checking: true, remainingMs: 30_000 })).toBe('check')
    expect(timerLook(running, { ringing: true, checking: false, remainingMs: 0 })).toBe('ringing')
    expect(timerLook({ state: 'due', heldByShoot: false }, { ringing: false, checking: false, remainingMs: 0 })).toBe('ringing')
    expect(timerLook({ state: 'paused', heldByShoot: true }, { ringing: false, checking: false, remainingMs: 5_000 })).toBe('paused-with-rehearsal')
    expect(timerLook({ state: 'paused', heldByShoot: false }, { ringing: false, checking: false, remainingMs: 5_000 })).toBe('paused')
    expect(timerLook({ state: 'acknowledged', heldByShoot: false }, { ringing: false, checking: false, remainingMs: 0 })).toBe('done')
  })
})

/** Every Vue and TS source of the screens, with its path. */
function sources(dir: string): { path: string; text: string }[] {
  return readdirSync(join(root, dir), { recursive: true, encoding: 'utf8' })
    .filter((f) => f.endsWith('.vue') || f.endsWith('.ts'))
    .map((f) => ({ path: `${dir}/${f}`, text: readFileSync(join(root, dir, f), 'utf8') }))
}

describe('the screens speak the vocabulary', () => {
  // The old names of things that now have one: the alarm's stop action, a rung timer, a held timer,
  // and "take" for the recorded run. Matched in what a user reads (template text and strings).
  const retired = [/>\s*Acknowledge\b/, /'Acknowledge/, /Got it/, /Timer due/, /\brang\b/, /'Held/, /Held while/, /'Due\b/, /'Take'/, /Start a take/]
  const files = [...sources('components'), ...sources('pages'), ...sources('shared/utils').filter((f) => f.path.endsWith('key-map.ts'))]

  it.each(retired.map((r) => [String(r), r] as const))('no screen says %s', (_name, pattern) => {
    const found = files.filter((f) => f.text.split('\n').some((line) => !/^\s*(\/\/|\*|<!--)/.test(line) && pattern.test(line))).map((f) => f.path)
    expect(found).toEqual([])
  })
})

describe('the planning pages speak a crew\'s words', () => {
  // Scheduling-textbook names the plan's screens used to show, and the two names one switch had.
  const retired = [/Critical chain/i, /Lower bound/i, /\bslack\b/i, /oven places/i, /'Aside'/, /Two recipes at once/i, /\bTrays\b/, /critical, no/i]
  const files = [...sources('components/plan'), ...sources('components/desk'), ...sources('pages/episodes'), ...sources('shared/utils').filter((f) => /plan-(lanes|words)\.ts$/.test(f.path))]

  it.each(retired.map((r) => [String(r), r] as const))('no planning screen says %s', (_name, pattern) => {
    const shown = (line: string) => !/^\s*(\/\/|\*|<!--|\/\*\*)/.test(line) && !/\b(slack|critical)[A-Za-z]*[.:(]|\.(slack|critical)\b|'(slack|critical)'/.test(line)
    const found = files.filter((f) => f.text.split('\n').some((line) => shown(line) && pattern.test(line))).map((f) => f.path)
    expect(found).toEqual([])
  })
})
