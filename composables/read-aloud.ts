// Reading a step aloud in rehearsal (VueUse useSpeechSynthesis), so the host hears what comes next
// without looking up. British English voice, at the browser's normal rate.
export function useReadAloud() {
  const text = ref('')
  const synth = useSpeechSynthesis(text, { lang: 'en-GB' })

  function speak(words: string) {
    if (!synth.isSupported.value) return
    const said = words.trim()
    if (!said) return
    text.value = said
    synth.speak()
    // VueUse pauses the voice whenever its playing flag falls (at the end of an utterance, or when a
    // new one replaces it, in a watcher that runs after this), and a paused voice holds the next
    // one back: resume it now and once that watcher has run.
    window.speechSynthesis.resume()
    void nextTick(() => window.speechSynthesis.resume())
  }
  function stop() {
    if (synth.isSupported.value) synth.stop()
  }

  onScopeDispose(stop)

  return { isSupported: synth.isSupported, speak, stop, speaking: synth.isPlaying }
}
