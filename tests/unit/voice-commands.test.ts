// Spoken commands (shared/utils/voice-commands.ts). These are Hobline's own product rules, not a
// published standard: a command counts only right after the wake word "Hobline", in whole words,
// whatever the case and punctuation, and the last command in a transcript wins.
import { describe, expect, it } from 'vitest'
import { KEY_ACTIONS } from '../../shared/utils/key-map'
import { VOICE_PHRASES, VOICE_WAKE_WORD, voiceAction, voiceExample, voiceWords } from '../../shared/utils/voice-commands'

describe('voiceAction', () => {
  it.each([
    ['Hobline next', 'next'],
    ['hobline next step', 'next'],
    ['Hobline, go back.', 'previous'],
    ['hobline previous', 'previous'],
    ['Hobline start timer', 'startTimer'],
    ['HOBLINE START THE TIMER!', 'startTimer'],
    ['hobline stop alarm', 'acknowledge'],
    ['Hobline: got it', 'acknowledge'],
    ['hobline acknowledge', 'acknowledge'],
    ['hobline flub', 'flub'],
    ['Hobline — mark flub', 'flub'],
  ] as const)('reads "%s" as %s', (said, action) => {
    expect(voiceAction(said)).toBe(action)
  })

  it('ignores commands said without the wake word (the host reading the script)', () => {
    for (const said of ['next', 'next step', 'go back', 'start the timer', 'got it', 'flub', 'Now the next step is to start the timer']) {
      expect(voiceAction(said), said).toBeNull()
    }
  })

  it('does not take "hob" (the cooktop) for the wake word', () => {
    expect(voiceAction('put the pan back on the hob, next we chop the herbs')).toBeNull()
    expect(voiceAction('hob next')).toBeNull()
  })

  it('accepts the wake word written as two words, as speech services hear it', () => {
    expect(voiceAction('Hob line, next')).toBe('next')
  })

  it('counts only whole words', () => {
    expect(voiceAction('hobline nextly')).toBeNull()
    expect(voiceAction('hoblinenext')).toBeNull()
    expect(voiceAction('hobline flubbed')).toBeNull()
    expect(voiceAction('hobliners next')).toBeNull()
  })

  it('wants the command right after the wake word, allowing "please" and hesitations', () => {
    expect(voiceAction('Hobline, please, next step')).toBe('next')
    expect(voiceAction('hobline um go back')).toBe('previous')
    expect(voiceAction('hobline I think we should go back')).toBeNull()
  })

  it('lets the last command win', () => {
    expect(voiceAction('Hobline next. Sorry, hobline go back')).toBe('previous')
    expect(voiceAction('hobline start the timer and hobline flub')).toBe('flub')
    expect(voiceAction('hobline got it, then hobline')).toBe('acknowledge')
  })

  it('ignores what follows a command, so the script read after it does nothing', () => {
    expect(voiceAction('hobline next step go back to the pan')).toBe('next')
  })

  it('gives null for empty or unrelated speech', () => {
    expect(voiceAction('')).toBeNull()
    expect(voiceAction('   ')).toBeNull()
    expect(voiceAction('hobline')).toBeNull()
    expect(voiceAction('hobline what a lovely colour')).toBeNull()
  })
})

describe('VOICE_PHRASES', () => {
  it('has phrases for every action, and each phrase reads back as its own action', () => {
    for (const action of KEY_ACTIONS) {
      expect(VOICE_PHRASES[action].length, action).toBeGreaterThan(0)
      for (const phrase of VOICE_PHRASES[action]) expect(voiceAction(`${VOICE_WAKE_WORD} ${phrase}`), phrase).toBe(action)
    }
  })
  it('gives no phrase to two actions', () => {
    const all = KEY_ACTIONS.flatMap((a) => VOICE_PHRASES[a])
    expect(new Set(all).size).toBe(all.length)
  })
  it('writes examples with the wake word, and every example works', () => {
    expect(voiceExample('next step')).toBe('Hobline, next step')
    expect(voiceAction(voiceExample('start the timer'))).toBe('startTimer')
  })
})

describe('voiceWords', () => {
  it('splits on punctuation and keeps apostrophes inside words', () => {
    expect(voiceWords("Hobline, it's DONE — next!")).toEqual(['hobline', "it's", 'done', 'next'])
  })
})
