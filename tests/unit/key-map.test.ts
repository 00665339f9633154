// Hands-free keys (shared/utils/key-map.ts). Key names are KeyboardEvent.key values as the W3C
// UI Events KeyboardEvent key Values spec defines them (" " for the space bar, "PageDown",
// "Shift" for the lone modifier); the defaults for clickers and pedals are common practice.
import { describe, expect, it } from 'vitest'
import {
  DEFAULT_KEY_MAP, KEY_ACTIONS, KEYS_PER_ACTION, RESERVED_KEYS, actionForKey, assignKey, keyLabel, keyName,
  normaliseKeyMap, removeKey, stepTimer, stepTimerLabel, type KeyMap,
} from '../../shared/utils/key-map'

/** A KeyboardEvent-like object as a browser fills it (W3C UI Events, KeyboardEvent key Values). */
const press = (key: string, extra: Partial<KeyboardEvent> = {}) => ({ key, code: '', shiftKey: false, ctrlKey: false, altKey: false, metaKey: false, repeat: false, ...extra })
const copy = (m: KeyMap): KeyMap => JSON.parse(JSON.stringify(m))

describe('DEFAULT_KEY_MAP', () => {
  it('gives no key to two actions and has a key for every action', () => {
    const all = KEY_ACTIONS.flatMap((a) => DEFAULT_KEY_MAP[a])
    expect(new Set(all).size).toBe(all.length)
    for (const a of KEY_ACTIONS) expect(DEFAULT_KEY_MAP[a].length).toBeGreaterThan(0)
  })
  it('sends a clicker\'s PageDown / PageUp to next and previous (common practice)', () => {
    expect(actionForKey(DEFAULT_KEY_MAP, 'PageDown')).toBe('next')
    expect(actionForKey(DEFAULT_KEY_MAP, 'PageUp')).toBe('previous')
  })
  it('uses no reserved key and is its own normal form', () => {
    for (const k of RESERVED_KEYS) expect(actionForKey(DEFAULT_KEY_MAP, k)).toBeNull()
    expect(normaliseKeyMap(DEFAULT_KEY_MAP)).toEqual(DEFAULT_KEY_MAP)
  })
})

describe('keyName', () => {
  it('names the space bar "Space" (the spec\'s key value is " ")', () => {
    expect(keyName(press(' ', { code: 'Space' }))).toBe('Space')
  })
  it('reads a letter typed with Shift as the lower case letter', () => {
    expect(keyName(press('A', { code: 'KeyA', shiftKey: true }))).toBe('a')
    expect(keyName(press('a', { code: 'KeyA' }))).toBe('a')
  })
  it('gives null for a lone modifier and for keys the browser cannot name', () => {
    for (const k of ['Shift', 'Control', 'Alt', 'Meta', 'AltGraph', 'CapsLock', 'Unidentified', 'Dead', '']) {
      expect(keyName(press(k)), k).toBeNull()
    }
  })
  it('keeps named keys as the spec writes them', () => {
    expect(keyName(press('PageDown', { code: 'PageDown' }))).toBe('PageDown')
    expect(keyName(press('ArrowRight'))).toBe('ArrowRight')
    expect(keyName(press('Enter'))).toBe('Enter')
    expect(keyName(press('F5'))).toBe('F5')
    expect(keyName(press('?', { shiftKey: true }))).toBe('?')
  })
  it('maps the older names some browsers still send to the spec\'s values', () => {
    expect(keyName(press('Spacebar'))).toBe('Space')
    expect(keyName(press('Esc'))).toBe('Escape')
    expect(keyName(press('Right'))).toBe('ArrowRight')
  })
})

describe('keyLabel', () => {
  it('writes keys as people read them', () => {
    expect(keyLabel('PageDown')).toBe('Page Down')
    expect(keyLabel('Space')).toBe('Space bar')
    expect(keyLabel('t')).toBe('T')
    expect(keyLabel('F5')).toBe('F5')
  })
})

describe('assignKey', () => {
  it('moves a key from the action that had it, and says so', () => {
    const r = assignKey(copy(DEFAULT_KEY_MAP), 'flub', 'PageDown')
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(r.movedFrom).toBe('next')
    expect(r.map.next).toEqual(['ArrowRight'])
    expect(r.map.flub).toEqual(['f', 'PageDown'])
    expect(actionForKey(r.map, 'PageDown')).toBe('flub')
    expect(r.message).toBe('Page Down now does “Mark a flub”. It no longer does “Next step”.')
  })
  it('adds a new key without moving anything', () => {
    const r = assignKey(copy(DEFAULT_KEY_MAP), 'startTimer', 'b')
    expect(r).toMatchObject({ ok: true, movedFrom: null, dropped: null })
    if (r.ok) expect(r.map.startTimer).toEqual(['t', 'b'])
  })
  it(`keeps at most ${KEYS_PER_ACTION} keys on an action, letting the oldest go`, () => {
    let map = copy(DEFAULT_KEY_MAP)
    for (const k of ['1', '2']) {
      const r = assignKey(map, 'flub', k)
      if (r.ok) map = r.map
    }
    expect(map.flub).toEqual(['f', '1', '2'])
    const r = assignKey(map, 'flub', '3')
    expect(r).toMatchObject({ ok: true, dropped: 'f' })
    if (r.ok) {
      expect(r.map.flub).toEqual(['1', '2', '3'])
      expect(r.message).toContain('F was let go')
    }
  })
  it('leaves the map alone when the action already has the key', () => {
    const r = assignKey(copy(DEFAULT_KEY_MAP), 'next', 'PageDown')
    expect(r).toMatchObject({ ok: true, movedFrom: null, map: DEFAULT_KEY_MAP })
  })
  it('refuses the reserved keys with a message that says what to do', () => {
    for (const k of RESERVED_KEYS) {
      const r = assignKey(copy(DEFAULT_KEY_MAP), 'next', k)
      expect(r.ok, k).toBe(false)
      if (!r.ok) expect(r.message).toMatch(/is kept for .+; press another key\.$/)
    }
    const r = assignKey(copy(DEFAULT_KEY_MAP), 'next', '?')
    expect(r).toEqual({ ok: false, message: '? is kept for the key help; press another key.' })
  })
  it('does not change the map it was given', () => {
    const map = copy(DEFAULT_KEY_MAP)
    assignKey(map, 'flub', 'PageDown')
    expect(map).toEqual(DEFAULT_KEY_MAP)
  })
})

describe('removeKey', () => {
  it('takes one key off one action', () => {
    const map = removeKey(copy(DEFAULT_KEY_MAP), 'acknowledge', 'Enter')
    expect(map.acknowledge).toEqual(['a'])
    expect(map.next).toEqual(DEFAULT_KEY_MAP.next)
    expect(actionForKey(map, 'Enter')).toBeNull()
  })
})

describe('normaliseKeyMap', () => {
  it('gives the defaults for anything that is not a map', () => {
    for (const raw of [null, undefined, 'PageDown', 42, [], true]) expect(normaliseKeyMap(raw)).toEqual(DEFAULT_KEY_MAP)
  })
  it('keeps valid keys and drops junk: unknown actions, non-text, empty, over-long, reserved, repeats', () => {
    const map = normaliseKeyMap({
      next: ['b', 7, '', 'x'.repeat(25), '?', 'Escape', 'b', null],
      previous: ['b', 'PageUp'],
      startTimer: ['t', 'F9'],
      jump: ['j'],
    })
    expect(map.next).toEqual(['b'])
    expect(map.previous).toEqual(['PageUp']) // "b" already belongs to next
    expect(map.startTimer).toEqual(['t', 'F9'])
    expect(map.acknowledge).toEqual(DEFAULT_KEY_MAP.acknowledge) // missing: default
    expect(map.flub).toEqual(DEFAULT_KEY_MAP.flub)
    expect('jump' in map).toBe(false)
  })
  it('keeps an action the crew emptied on purpose empty', () => {
    expect(normaliseKeyMap({ ...DEFAULT_KEY_MAP, flub: [] }).flub).toEqual([])
  })
  it(`keeps at most ${KEYS_PER_ACTION} keys per action`, () => {
    expect(normaliseKeyMap({ next: ['1', '2', '3', '4', '5'] }).next).toEqual(['1', '2', '3'])
  })
  it('does not let a stored key repeat a default of an action stored without it', () => {
    // "f" is flub's default; next claims it first, so flub falls back to nothing of its own.
    const map = normaliseKeyMap({ next: ['f'] })
    expect(map.next).toEqual(['f'])
    expect(map.flub).toEqual([])
    const all = KEY_ACTIONS.flatMap((a) => map[a])
    expect(new Set(all).size).toBe(all.length)
  })
})

describe('stepTimer', () => {
  it('labels the timer with the step text, tokens read as their ingredient', () => {
    expect(stepTimerLabel('Sweat {{red-onion|item}} in {{butter*1/2}}  gently.')).toBe('Sweat red onion in butter gently')
    expect(stepTimerLabel('Sweat {{onion|item}} until soft.')).toBe('Sweat onion until soft')
  })
  it('cuts a long text at a word near 40 characters, marking the cut', () => {
    const label = stepTimerLabel('Simmer the stock with the bay leaves and peppercorns until reduced by half')
    expect(label).toBe('Simmer the stock with the bay leaves and…')
    expect(label.length).toBeLessThanOrEqual(41)
  })
  it('times the long end of the range, in ms', () => {
    expect(stepTimer({ text: 'Boil {{pasta}}', durationMin: 540, durationMax: 600 })).toEqual({ ok: true, label: 'Boil pasta', durationMs: 600_000 })
  })
  it('uses the short end when only it is set', () => {
    expect(stepTimer({ text: 'Rest', durationMin: 300, durationMax: null })).toEqual({ ok: true, label: 'Rest', durationMs: 300_000 })
  })
  it('refuses a step with no time, saying what to do', () => {
    const r = stepTimer({ text: 'Plate up', durationMin: null, durationMax: null })
    expect(r).toEqual({ ok: false, message: '“Plate up” has no cooking time, so the key cannot start its timer. Start one by hand (name and minutes), or give the step a time in its recipe.' })
    expect(stepTimer({ text: 'Plate up', durationMin: 0, durationMax: 0 }).ok).toBe(false)
  })
  it('refuses when no step is on screen', () => {
    const r = stepTimer(null)
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.message).toMatch(/^No recipe step is on screen/)
  })
  it('refuses a time over the 24 hours a timer may run', () => {
    const r = stepTimer({ text: 'Cure', durationMin: null, durationMax: 25 * 3600 })
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.message).toContain('from 1 second to 24 hours')
  })
})
