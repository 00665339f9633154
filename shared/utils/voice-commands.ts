// Spoken commands for the shoot screens. A host reads the script aloud, and the script is full of
// "next", "back" and "timer"; so a command counts only right after Hobline's own wake word
// ("Hobline, next step"). "Hob" alone would not do: it is the cooktop, and cooks say it all day.
// Speech services spell an unknown word as they hear it, so "hob line" counts as the wake word too.
import { KEY_ACTIONS, type KeyAction } from './key-map'

export const VOICE_WAKE_WORD = 'hobline'
/** The ways a speech service writes the wake word, as lists of words. */
const WAKE_FORMS: readonly string[][] = [['hobline'], ['hob', 'line'], ['hoblin']]
/** Words a speaker may put between the wake word and the command. */
const FILLERS = new Set(['please', 'ok', 'okay', 'um', 'uh', 'er', 'erm', 'now'])

/** What a host says after the wake word, for each action (and for the help text). */
export const VOICE_PHRASES: Record<KeyAction, string[]> = {
  next: ['next', 'next step'],
  previous: ['go back', 'back', 'previous', 'previous step'],
  startTimer: ['start timer', 'start the timer'],
  startWait: ['start it', 'start the wait', 'start it now'],
  acknowledge: ['done', "it's done", 'it is done', 'stop alarm', 'stop the alarm', 'got it', 'acknowledge'],
  addMinute: ['one more minute', 'add a minute', 'add one minute', 'plus one minute'],
  flub: ['flub', 'mark flub', 'mark a flub'],
}

/** Lower case words without punctuation; a hyphen or apostrophe inside a word is kept. */
export function voiceWords(transcript: string): string[] {
  return transcript
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[’‘]/g, "'")
    .split(/[^a-z0-9'-]+/)
    .map((w) => w.replace(/^['-]+|['-]+$/g, ''))
    .filter(Boolean)
}

/** Phrases as word lists, longest first, so "next step" is read before "next". */
const PHRASES: Array<{ action: KeyAction; words: string[] }> = KEY_ACTIONS
  .flatMap((action) => VOICE_PHRASES[action].map((p) => ({ action, words: voiceWords(p) })))
  .sort((a, b) => b.words.length - a.words.length)

const startsWith = (words: string[], at: number, part: string[]) => part.every((w, i) => words[at + i] === w)

/**
 * The action a transcript asks for: a phrase of VOICE_PHRASES right after the wake word (a few
 * fillers like "please" allowed between), in whole words, whatever the case and punctuation.
 * When the wake word comes more than once, the last command wins. Null when nothing counts.
 */
export function voiceAction(transcript: string): KeyAction | null {
  const words = voiceWords(transcript)
  let found: KeyAction | null = null
  for (let i = 0; i < words.length; i++) {
    const wake = WAKE_FORMS.find((form) => startsWith(words, i, form))
    if (!wake) continue
    let at = i + wake.length
    while (at < words.length && FILLERS.has(words[at]!)) at++
    const phrase = PHRASES.find((p) => startsWith(words, at, p.words))
    if (phrase) found = phrase.action
  }
  return found
}

/** How a phrase is said, with the wake word, for the help text: "Hobline, next step". */
export function voiceExample(phrase: string): string {
  return `Hobline, ${phrase}`
}
