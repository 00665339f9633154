// The one vocabulary of the shoot screens: every state a shoot, a camera or a kitchen timer can be
// in, and every action a button, a key or a voice command takes, each with exactly one label and
// one set colour. The prompter, the cue screen, the control desk, the screen check and the home
// page's picture of a prompter all read their words and colours from here, so "ringing" is ember
// and "Done" stops an alarm on every screen. Refusals of the live shoot (shoot-apply.ts) use the
// same action labels, so a message names the button to press.
import type { ShootCommandType, ShootMarkerKind, ShootMode, ShootStatus, ShootTimer } from '../types/shoot'
import type { palette } from './palette'

/** A set colour's name (palette.set): the text colour a state is shown in. */
export type SetColour = keyof typeof palette.set

export interface Word {
  label: string
  colour: SetColour
}

/**
 * What each colour means on a shoot screen, once. Bone is plain text; the others carry one meaning
 * each, and every state below takes the colour of its meaning.
 */
export const COLOUR_MEANINGS: Record<Exclude<SetColour, 'night' | 'panel' | 'edge'>, string> = {
  bone: 'Text to read',
  haze: 'Finished, waiting or secondary',
  saffron: 'Look now: the current line, a timer to check',
  ember: 'Act now: a timer in its last minute or ringing, the camera rolling, a caution',
  mint: 'Running as planned',
  sky: 'Stopped for now, or information',
}

/** A shoot's mode. The recorded run is a "recording"; one roll of the camera within it is a take. */
export const MODE_WORDS: Record<ShootMode, Word> = {
  rehearsal: { label: 'Rehearsal', colour: 'sky' },
  take: { label: 'Recording', colour: 'saffron' },
}

export const STATUS_WORDS: Record<ShootStatus, Word> = {
  ready: { label: 'Ready', colour: 'haze' },
  running: { label: 'Running', colour: 'mint' },
  paused: { label: 'Paused', colour: 'sky' },
  ended: { label: 'Ended', colour: 'haze' },
}

export type CameraState = 'rolling' | 'stopped'
export const CAMERA_WORDS: Record<CameraState, Word> = {
  rolling: { label: 'Rolling', colour: 'ember' },
  stopped: { label: 'Not rolling', colour: 'haze' },
}

export type ConnectionState = 'online' | 'connecting' | 'offline'
export const CONNECTION_WORDS: Record<ConnectionState, Word> = {
  online: { label: 'Online', colour: 'mint' },
  connecting: { label: 'Connecting', colour: 'saffron' },
  offline: { label: 'Offline', colour: 'ember' },
}

/**
 * How a kitchen timer looks. "Paused with the rehearsal" is a timer the rehearsal's own pause
 * stopped (it runs again when the rehearsal does); "Ringing" is due and sounding until someone
 * presses Done; "Done" is a timer called done, by its check or after it rang.
 */
export type TimerLook = 'running' | 'last-minute' | 'check' | 'ringing' | 'paused' | 'paused-with-rehearsal' | 'done' | 'cancelled'
export const TIMER_WORDS: Record<TimerLook, Word> = {
  'running': { label: 'Running', colour: 'mint' },
  'last-minute': { label: 'Last minute', colour: 'ember' },
  'check': { label: 'Check it', colour: 'saffron' },
  'ringing': { label: 'Ringing', colour: 'ember' },
  'paused': { label: 'Paused', colour: 'sky' },
  'paused-with-rehearsal': { label: 'Paused with the rehearsal', colour: 'sky' },
  'done': { label: 'Done', colour: 'haze' },
  'cancelled': { label: 'Cancelled', colour: 'haze' },
}

/** Kitchen time left when a countdown turns to its last minute. */
export const LAST_MINUTE_MS = 60_000

/** The look of a timer now, given whether it rings, is at its check and how much kitchen time is left. */
export function timerLook(timer: Pick<ShootTimer, 'state' | 'heldByShoot'>, now: { ringing: boolean; checking: boolean; remainingMs: number }): TimerLook {
  if (timer.state === 'acknowledged') return 'done'
  if (timer.state === 'cancelled') return 'cancelled'
  if (now.ringing || timer.state === 'due') return 'ringing'
  if (timer.state === 'paused') return timer.heldByShoot ? 'paused-with-rehearsal' : 'paused'
  if (now.checking) return 'check'
  return now.remainingMs <= LAST_MINUTE_MS ? 'last-minute' : 'running'
}

export const MARKER_WORDS: Record<ShootMarkerKind, Word> = {
  good: { label: 'Good take', colour: 'mint' },
  flub: { label: 'Flub', colour: 'ember' },
  pickup: { label: 'Pickup', colour: 'saffron' },
  note: { label: 'Note', colour: 'sky' },
  chapter: { label: 'Chapter', colour: 'haze' },
}

/**
 * Every action on a shoot screen, by what it does. The label is the button's words; the same words
 * are used by the key help, the voice help and the messages that refuse an action.
 */
export const ACTION_WORDS = {
  'shoot.start': { label: 'Start the shoot', colour: 'mint' },
  'shoot.pause': { label: 'Pause the shoot', colour: 'sky' },
  'shoot.resume': { label: 'Resume the shoot', colour: 'mint' },
  'shoot.end': { label: 'End the shoot', colour: 'bone' },
  'shoot.end-cancel': { label: 'End and cancel timers', colour: 'ember' },
  'step.next': { label: 'Next step', colour: 'bone' },
  'step.previous': { label: 'Previous step', colour: 'bone' },
  'step.jump': { label: 'Go', colour: 'bone' },
  'wait.start': { label: 'Start the wait', colour: 'mint' },
  'timer.start': { label: 'Start timer', colour: 'mint' },
  'timer.pause': { label: 'Pause timer', colour: 'sky' },
  'timer.resume': { label: 'Resume timer', colour: 'mint' },
  'timer.add': { label: '+1 min', colour: 'bone' },
  'timer.remove': { label: '−1 min', colour: 'bone' },
  'timer.cancel': { label: 'Cancel timer', colour: 'bone' },
  'timer.done': { label: 'Done', colour: 'mint' },
  'rolling.on': { label: 'Roll', colour: 'ember' },
  'rolling.off': { label: 'Cut', colour: 'bone' },
  'clock.speed': { label: 'Rehearsal speed', colour: 'sky' },
  'marker.add': { label: 'Mark', colour: 'bone' },
  'marker.edit': { label: 'Save marker', colour: 'bone' },
  'marker.delete': { label: 'Delete marker', colour: 'ember' },
  'camera.set': { label: 'Save camera', colour: 'bone' },
  'camera.remove': { label: 'Remove camera', colour: 'bone' },
} as const satisfies Record<string, Word>
export type ShootAction = keyof typeof ACTION_WORDS

/** The actions each shoot command is pressed as (a command with two buttons, such as adding or taking off time, has both). */
export const COMMAND_ACTIONS: Record<ShootCommandType, readonly ShootAction[]> = {
  'shoot.start': ['shoot.start'],
  'shoot.pause': ['shoot.pause'],
  'shoot.resume': ['shoot.resume'],
  'shoot.end': ['shoot.end', 'shoot.end-cancel'],
  'step.next': ['step.next'],
  'step.previous': ['step.previous'],
  'step.jump': ['step.jump'],
  'timer.start': ['timer.start'],
  'timer.pause': ['timer.pause'],
  'timer.resume': ['timer.resume'],
  'timer.addTime': ['timer.add', 'timer.remove'],
  'timer.cancel': ['timer.cancel'],
  'timer.acknowledge': ['timer.done'],
  'rolling.set': ['rolling.on', 'rolling.off'],
  'clock.speed': ['clock.speed'],
  'marker.add': ['marker.add'],
  'wait.start': ['wait.start'],
  'marker.edit': ['marker.edit'],
  'marker.delete': ['marker.delete'],
  'camera.set': ['camera.set'],
  'camera.remove': ['camera.remove'],
}

/** A button's words, for messages: “Done”. */
export function actionName(action: ShootAction): string {
  return `“${ACTION_WORDS[action].label}”`
}

/** What pausing does in each mode, said on the pause button's hint. */
export function pauseHint(mode: ShootMode): string {
  return mode === 'rehearsal'
    ? 'Pauses the rehearsal clock and its kitchen timers.'
    : 'Pauses the shoot clock only: the kitchen timers keep running, as the food keeps cooking.'
}

/** Every group of words, for the check that each has one label and one colour. */
export const SHOOT_VOCABULARY = {
  mode: MODE_WORDS,
  status: STATUS_WORDS,
  camera: CAMERA_WORDS,
  connection: CONNECTION_WORDS,
  timer: TIMER_WORDS,
  marker: MARKER_WORDS,
  action: ACTION_WORDS,
} as const
