// Hands-free keys. Foot pedals and presentation clickers type keys; each shoot screen maps them to
// the crew's actions. Defaults follow what such devices send out of the box: clickers send
// PageDown / PageUp (some send the arrow keys), pedals are set to any key (common practice).
// A key is named by KeyboardEvent.key (W3C UI Events KeyboardEvent key Values), letters in lower
// case and the space bar as "Space".
import { SHOOT_TIMER_LABEL_MAX, SHOOT_TIMER_MAX_MS, SHOOT_TIMER_MIN_MS } from '../types/shoot'
import { plainStepText } from './step-text'
import { ACTION_WORDS as A } from './shoot-words'

export const KEY_ACTIONS = ['next', 'previous', 'startTimer', 'startWait', 'acknowledge', 'addMinute', 'flub'] as const
export type KeyAction = (typeof KEY_ACTIONS)[number]
export type KeyMap = Record<KeyAction, string[]>

/** At most this many keys per action (a pedal and a clicker, say). */
export const KEYS_PER_ACTION = 3

export const KEY_ACTION_LABELS: Record<KeyAction, string> = {
  next: A['step.next'].label,
  previous: A['step.previous'].label,
  startTimer: `${A['timer.start'].label} for this step`,
  startWait: `${A['wait.start'].label} that is due now`,
  acknowledge: `${A['timer.done'].label}: stop the ringing alarm, or call a timer done at its check`,
  addMinute: `${A['timer.add'].label} on the ringing (or soonest) timer`,
  flub: 'Mark a flub',
}

export const DEFAULT_KEY_MAP: KeyMap = {
  next: ['PageDown', 'ArrowRight'],
  previous: ['PageUp', 'ArrowLeft'],
  startTimer: ['t'],
  startWait: ['s'],
  acknowledge: ['a', 'Enter'],
  addMinute: ['m', '+'],
  flub: ['f'],
}

/** Keys that always do the same thing and cannot be assigned: the help overlay and closing it. */
export const RESERVED_KEYS = ['?', 'Escape', 'Tab'] as const

const MODIFIERS = ['Shift', 'Control', 'Alt', 'Meta', 'AltGraph', 'CapsLock', 'Fn', 'FnLock', 'NumLock', 'ScrollLock', 'Symbol', 'SymbolLock', 'Hyper', 'Super', 'OS']

export function isReservedKey(key: string): boolean {
  return (RESERVED_KEYS as readonly string[]).includes(key)
}

/** The name Hobline gives the key of a keyboard event, or null for a lone modifier. */
export function keyName(event: { key: string }): string | null {
  const k = event.key
  if (!k || k === 'Unidentified' || k === 'Dead' || k === 'Process') return null
  if (MODIFIERS.includes(k)) return null
  // "Spacebar", "Esc", "Left"…: the names older browsers gave (before the W3C key values).
  const legacy: Record<string, string> = { ' ': 'Space', Spacebar: 'Space', Esc: 'Escape', Left: 'ArrowLeft', Right: 'ArrowRight', Up: 'ArrowUp', Down: 'ArrowDown' }
  if (legacy[k]) return legacy[k]
  return k.length === 1 ? k.toLowerCase() : k
}

/** How a key reads on screen. */
export function keyLabel(key: string): string {
  const names: Record<string, string> = {
    PageDown: 'Page Down', PageUp: 'Page Up', ArrowRight: '→', ArrowLeft: '←', ArrowUp: '↑', ArrowDown: '↓',
    Enter: 'Enter', Space: 'Space bar', Escape: 'Esc', Backspace: 'Backspace', MediaPlayPause: 'Play/Pause',
    AudioVolumeUp: 'Volume up', AudioVolumeDown: 'Volume down',
  }
  return names[key] ?? (key.length === 1 ? key.toUpperCase() : key)
}

/** How a key is spoken by a screen reader, where its label is a symbol. */
export function keySpokenName(key: string): string {
  const names: Record<string, string> = { ArrowRight: 'Right arrow', ArrowLeft: 'Left arrow', ArrowUp: 'Up arrow', ArrowDown: 'Down arrow', '?': 'Question mark' }
  return names[key] ?? keyLabel(key)
}

/** A key map read from storage: unknown actions and keys that are not text dropped, a key kept on
 * one action only (the first that names it), reserved keys removed, missing actions at default. */
export function normaliseKeyMap(raw: unknown): KeyMap {
  const given = (raw && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, unknown>
  const seen = new Set<string>()
  const out = {} as KeyMap
  for (const action of KEY_ACTIONS) {
    const list = Array.isArray(given[action]) ? (given[action] as unknown[]) : DEFAULT_KEY_MAP[action]
    out[action] = []
    for (const k of list) {
      if (typeof k !== 'string' || k === '' || k.length > 24 || seen.has(k) || isReservedKey(k)) continue
      if (out[action].length >= KEYS_PER_ACTION) break
      seen.add(k)
      out[action].push(k)
    }
  }
  return out
}

/** The action a key does in a map, or null. */
export function actionForKey(map: KeyMap, key: string | null): KeyAction | null {
  if (!key) return null
  for (const action of KEY_ACTIONS) if (map[action].includes(key)) return action
  return null
}

export type AssignResult =
  | { ok: true; map: KeyMap; movedFrom: KeyAction | null; dropped: string | null; message: string }
  | { ok: false; message: string }

/** Assigns a key to an action: the key leaves any other action it had (so one key never does two
 * things); the action keeps at most KEYS_PER_ACTION keys, dropping its oldest. The message says
 * what changed, for the screen to show. */
export function assignKey(map: KeyMap, action: KeyAction, key: string): AssignResult {
  if (isReservedKey(key)) {
    const keptFor = key === '?' ? 'the key help' : key === 'Tab' ? 'moving between controls' : 'closing panels'
    return { ok: false, message: `${keyLabel(key)} is kept for ${keptFor}; press another key.` }
  }
  if (!key || key.length > 24) return { ok: false, message: 'This key has no name the browser can report; press another key.' }
  const label = keyLabel(key)
  if (map[action].includes(key)) {
    return { ok: true, map, movedFrom: null, dropped: null, message: `${label} already does “${KEY_ACTION_LABELS[action]}”.` }
  }
  const movedFrom = KEY_ACTIONS.find((a) => a !== action && map[a].includes(key)) ?? null
  const next = {} as KeyMap
  for (const a of KEY_ACTIONS) next[a] = map[a].filter((k) => k !== key)
  const kept = [...next[action], key]
  const dropped = kept.length > KEYS_PER_ACTION ? kept[0]! : null
  next[action] = kept.slice(-KEYS_PER_ACTION)
  let message = `${label} now does “${KEY_ACTION_LABELS[action]}”.`
  if (movedFrom) message += ` It no longer does “${KEY_ACTION_LABELS[movedFrom]}”.`
  if (dropped) message += ` ${keyLabel(dropped)} was let go: an action keeps at most ${KEYS_PER_ACTION} keys.`
  return { ok: true, map: next, movedFrom, dropped, message }
}

/** Removes a key from an action. */
export function removeKey(map: KeyMap, action: KeyAction, key: string): KeyMap {
  return { ...map, [action]: map[action].filter((k) => k !== key) }
}

// ---- what the start-timer key starts ------------------------------------------------------------

/** The label length a hands-free timer gets: short enough to read on a cue screen. */
export const STEP_TIMER_LABEL_LENGTH = 40

/** A step's text cut to about `max` characters at a word, with "…" when cut. */
export function stepTimerLabel(text: string, max = STEP_TIMER_LABEL_LENGTH): string {
  const plain = plainStepText(text).replace(/[.;:,!]+$/, '')
  if (plain.length <= max) return plain
  // One character more, so a word that ends right at the limit is kept whole.
  const atWord = plain.slice(0, max + 1).lastIndexOf(' ')
  const head = (atWord >= max / 2 ? plain.slice(0, atWord) : plain.slice(0, max)).replace(/[\s.;:,!-]+$/, '')
  return `${head}…`.slice(0, SHOOT_TIMER_LABEL_MAX)
}

export type StepTimerResult =
  | { ok: true; label: string; durationMs: number }
  | { ok: false; message: string }

/** The timer the start-timer key starts for a step: its short text, for the long end of its time
 * range (the short end when only that is set). A step with no time gets a message instead. */
export function stepTimer(step: { text: string; durationMin: number | null; durationMax: number | null } | null | undefined): StepTimerResult {
  if (!step) return { ok: false, message: 'No recipe step is on screen, so there is no step timer to start. Start a timer by hand: name it and give the minutes.' }
  const seconds = step.durationMax ?? step.durationMin
  const label = stepTimerLabel(step.text) || 'Step timer'
  if (seconds === null || !Number.isFinite(seconds) || seconds <= 0) {
    return { ok: false, message: `“${label}” has no cooking time, so the key cannot start its timer. Start one by hand (name and minutes), or give the step a time in its recipe.` }
  }
  const durationMs = Math.round(seconds * 1000)
  if (durationMs < SHOOT_TIMER_MIN_MS || durationMs > SHOOT_TIMER_MAX_MS) {
    return { ok: false, message: `“${label}” has a time of ${seconds} s; a timer runs from 1 second to 24 hours. Fix the step's time in its recipe, or start a timer by hand.` }
  }
  return { ok: true, label, durationMs }
}
