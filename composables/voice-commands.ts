// Voice commands through the browser's speech recognition (VueUse useSpeechRecognition): it
// listens while `enabled` is true, reads each final result with voiceAction (the wake word first)
// and calls onAction. Browsers end a long listen now and then (silence, the network); while still
// enabled it starts again, unless an error that needs the crew stops it (a blocked microphone).
import { voiceAction } from '~~/shared/utils/voice-commands'
import type { KeyAction } from '~~/shared/utils/key-map'

/** What each speech recognition error means for the crew; listening stops on these. Others
 * ("no-speech", "aborted") only end one listen, and listening goes on. */
const ERRORS: Record<string, string> = {
  'not-allowed': 'The microphone is blocked for this page. Allow it in the browser\'s site settings, then listen again.',
  'service-not-allowed': 'This browser does not allow speech recognition here. Use the keys or the buttons.',
  'audio-capture': 'No microphone was found. Plug one in, then listen again.',
  'network': 'The browser\'s speech service cannot be reached, so voice commands have stopped. Use the keys or the buttons, or listen again later.',
  'language-not-supported': 'This browser cannot recognise British English speech. Use the keys or the buttons.',
}
const RESTART_MS = 400

/** The parts of the Web Speech API's result and error events read here. */
interface HeardEvent { resultIndex: number; results: ArrayLike<{ isFinal: boolean; 0?: { transcript: string } }> }
interface HeardError { error: string }

export function useVoiceCommands(onAction: (action: KeyAction) => void, enabled: MaybeRefOrGetter<boolean>) {
  const speech = useSpeechRecognition({ continuous: true, interimResults: true, lang: 'en-GB' })
  /** The last words heard (interim while speaking, then final). */
  const transcript = ref('')
  /** The last command understood. */
  const heard = ref<KeyAction | null>(null)
  const error = ref<string | null>(null)
  const wanted = ref(false)
  let restart: ReturnType<typeof setTimeout> | undefined

  function start() {
    if (!speech.isSupported.value) return
    error.value = null
    wanted.value = true
    speech.start()
  }
  function stop() {
    wanted.value = false
    clearTimeout(restart)
    speech.stop()
  }

  const recognition = speech.recognition
  if (recognition) {
    /** Results of this listen already read: a final result is read once, interim ones never. */
    let readUpTo = 0
    useEventListener(recognition, 'start', () => {
      readUpTo = 0
    })
    useEventListener(recognition, 'result', (e: Event) => {
      const event = e as unknown as HeardEvent
      for (let i = Math.max(event.resultIndex, readUpTo); i < event.results.length; i++) {
        const result = event.results[i]!
        const words = result[0]?.transcript.trim() ?? ''
        if (words) transcript.value = words
        if (!result.isFinal) continue
        readUpTo = i + 1
        const action = voiceAction(words)
        if (action) {
          heard.value = action
          onAction(action)
        }
      }
    })
    useEventListener(recognition, 'error', (e: Event) => {
      const message = ERRORS[(e as unknown as HeardError).error]
      if (!message) return
      error.value = message
      wanted.value = false
    })
    useEventListener(recognition, 'end', () => {
      if (!wanted.value || !(toValue(enabled) ?? false)) return
      clearTimeout(restart)
      restart = setTimeout(() => {
        if (wanted.value && !speech.isListening.value) speech.start()
      }, RESTART_MS)
    })
  }

  watch(() => toValue(enabled), (on) => (on ? start() : stop()), { immediate: true })
  onScopeDispose(() => clearTimeout(restart))

  return { isSupported: speech.isSupported, isListening: speech.isListening, transcript, heard, start, stop, error }
}
