// Keeps a shoot screen awake while it is shown, and says how. First the Screen Wake Lock API (VueUse
// useWakeLock; W3C Screen Wake Lock API), which browsers give only on a secure address (https or
// localhost); where it is missing or refused, nosleep.js plays a tiny silent looping video, which
// keeps most tablets and phones awake. The video is loaded only then (it is not in the prompter's
// bundle), stops when the page is hidden and starts again when it is shown. Browsers play it only
// after a touch when they have not let the page play media yet: `needsTouch` says so, and the first
// touch or key press tries again.
import type NoSleep from 'nosleep.js'

/** How this screen is kept awake: the browser's wake lock, the looping video, or not at all (yet). */
export type AwakeWay = 'wake-lock' | 'video' | 'none' | 'starting'

export function useScreenAwake() {
  const wakeLock = useWakeLock()
  const visibility = useDocumentVisibility()
  const way = ref<AwakeWay>('starting')
  /** Why the wake lock is not used, in the crew's words ('' while it is). */
  const lockMissing = ref('')
  const needsTouch = ref(false)
  let noSleep: NoSleep | null = null
  let shown = false

  async function startVideo() {
    try {
      const NoSleepClass = (await import('nosleep.js')).default
      noSleep ??= new NoSleepClass()
      await noSleep.enable()
      if (!shown) noSleep.disable()
      else {
        way.value = 'video'
        needsTouch.value = false
      }
    } catch {
      way.value = 'none'
      needsTouch.value = true
    }
  }

  async function start() {
    shown = true
    if (!window.isSecureContext) lockMissing.value = 'the browser gives the screen wake lock only on a secure (https) address'
    else if (!wakeLock.isSupported.value) lockMissing.value = 'this browser has no screen wake lock'
    else {
      try {
        await wakeLock.request('screen')
        way.value = 'wake-lock'
        lockMissing.value = ''
        return
      } catch (e) {
        lockMissing.value = `the browser refused the screen wake lock (${(e as Error).name || 'refused'}), for instance to save battery`
      }
    }
    await startVideo()
  }

  function stop() {
    shown = false
    noSleep?.disable()
    if (wakeLock.isActive.value) void wakeLock.release().catch(() => {})
  }

  // The video fallback pauses while the page is hidden and plays again when it is shown (the wake
  // lock is released and taken again by the browser and VueUse themselves).
  watch(visibility, (now) => {
    if (!shown || way.value !== 'video' || !noSleep) return
    if (now === 'hidden') noSleep.disable()
    else void startVideo()
  })

  /** A touch or key press: the video may play now. */
  function touched() {
    if (shown && needsTouch.value) void startVideo()
  }

  onMounted(() => void start())
  onBeforeUnmount(stop)
  // The wake lock's own state: released by the browser (page hidden) shows as not held.
  const held = computed(() => (way.value === 'wake-lock' ? wakeLock.isActive.value : way.value === 'video'))
  return { way, held, lockMissing, needsTouch, touched }
}
