// Alarms on a shoot screen: which timers are due, whether this screen rings or flashes for them
// (shared/utils/alarm-policy.ts, "quiet on set"), and the sounds themselves through howler. Every
// screen works out the same alarm round from the server clock (timerAlarmRound), so repeats ring
// together; a screen that comes in late starts the sound part-way through, in step with the others.
// Acknowledged anywhere, the server's state changes and every screen goes quiet.
//
// howler is loaded only in the browser, after the page is drawn; the tests reach each sound through
// howler's own globals (window.Howler._howls, howl.playing()) and read <html data-alarm>.
import type { Howl, HowlerGlobal } from 'howler'
import type { ShootTimer } from '~~/shared/types/shoot'
import { ALARM_REPEAT_MS, alarmOutput, audibleElsewhere, dueTimersAt, type AlarmOutput, type AlarmPresence } from '~~/shared/utils/alarm-policy'
import { ALARM_PATTERNS, COUNT_TICK_PATH, alarmSlotFor, alarmSoundPath, patternDurationMs } from '~~/shared/utils/alarm-sounds'
import { timerAlarmRound, timerOverdueMs } from '~~/shared/utils/shoot-timers'

interface AlarmBank {
  Howler: HowlerGlobal
  /** By slot, 0 … 7. */
  alarms: Howl[]
  tick: Howl
}

// One set of sounds per browser tab, made on first use and kept across pages: audio objects, never
// made during server rendering, so nothing is shared between requests.
let bank: Promise<AlarmBank> | null = null

function loadBank(): Promise<AlarmBank> {
  // The server build drops this branch, so howler is in no server chunk.
  if (!import.meta.client) return Promise.reject(new Error('alarm sounds play in the browser only'))
  // howler's core build: the spatial audio plugin of the full build is not used.
  bank ??= import('howler/dist/howler.core.min.js').then((mod) => {
    const { Howl, Howler } = 'Howl' in mod ? mod : (mod as { default: typeof mod }).default
    // An alarm has to start at once: keep the audio context awake instead of suspending it after
    // 30 idle seconds, as howler does by default.
    Howler.autoSuspend = false
    const w = window as unknown as { Howler?: HowlerGlobal; Howl?: typeof Howl }
    w.Howler ??= Howler
    w.Howl ??= Howl
    const make = (src: string) => new Howl({ src: [src], preload: true, html5: false })
    return { Howler, alarms: ALARM_PATTERNS.map((p) => make(alarmSoundPath(p.slot))), tick: make(COUNT_TICK_PATH) }
  })
  bank.catch(() => {
    bank = null // a failed chunk load: the next screen tries again
  })
  return bank
}

/** A sound that would start more than this late is started part-way through, in step. */
const IN_STEP_MS = 60
/** While the page is hidden the frame clock stops; this keeps repeats going (browsers may slow it). */
const HIDDEN_CHECK_MS = 250

export interface ShootAlarmsOptions {
  /** Some other crew screen on the shoot rings while rolling. Default: from the screens the server
   * lists as on the shoot; false when it lists none, so the host's screen rings. */
  audibleElsewhere?: MaybeRefOrGetter<boolean>
  /** The screen's server clock, when it already reads one (ScreenShell); otherwise its own. */
  now?: Readonly<Ref<number>>
}

export function useShootAlarms(options: ShootAlarmsOptions = {}) {
  const shoot = useShootStore()
  const device = useDeviceSettings()
  const now = options.now ?? useServerNow()

  const ringing = computed<ShootTimer[]>(() => dueTimersAt(shoot.state?.timers ?? [], now.value))
  const selfAudible = computed(() => device.audibleWhileRolling(shoot.role))
  // The screens on the shoot as the server lists them; none listed yet means not known.
  const presence = computed<AlarmPresence | null>(() => (shoot.presence.screens.length ? shoot.presence : null))
  const elsewhere = computed(() => {
    if (options.audibleElsewhere !== undefined) return toValue(options.audibleElsewhere)
    return presence.value ? audibleElsewhere(presence.value, { role: shoot.role, audibleWhileRolling: selfAudible.value }) : false
  })
  const output = computed<AlarmOutput>(() => alarmOutput({
    role: shoot.role,
    rolling: !!shoot.state?.rolling,
    audibleWhileRolling: selfAudible.value,
    audibleElsewhere: elsewhere.value,
    hostOnSet: presence.value ? presence.value.screens.some((s) => s.role === 'host') : true,
  }))
  const sounding = computed(() => ringing.value.length > 0 && output.value.sound)
  const flashing = computed(() => ringing.value.length > 0 && output.value.flash)
  /** Whether the browser lets this screen make sound yet (most need one tap first: unlock). */
  const audioReady = ref(false)
  /** The sounds are loaded but the browser keeps the page silent (no tap yet). */
  const audioBlocked = ref(false)

  let loaded: AlarmBank | null = null
  let disposed = false
  let unlockWanted = false
  /** The round each due timer last rang for, and the sound playing for it. */
  const played = new Map<string, number>()
  const voices = new Map<string, { howl: Howl; id: number }>()

  let context: AudioContext | null = null
  const canPlay = (b: AlarmBank) => !b.Howler.usingWebAudio || b.Howler.ctx?.state === 'running'

  function check(nowMs: number) {
    const b = loaded
    if (!b) return
    const due = dueTimersAt(shoot.state?.timers ?? [], nowMs)
    const ids = new Set(due.map((t) => t.id))
    const ring = output.value.sound
    for (const [id, voice] of voices) {
      if (ring && ids.has(id)) continue
      voice.howl.stop(voice.id)
      voices.delete(id)
    }
    for (const id of played.keys()) if (!ids.has(id)) played.delete(id)
    if (!ring || !canPlay(b)) return
    for (const t of due) {
      const round = timerAlarmRound(t, nowMs, ALARM_REPEAT_MS)!
      if (played.get(t.id) === round) continue
      played.set(t.id, round)
      const slot = alarmSlotFor(t)
      const into = timerOverdueMs(t, nowMs) - round * ALARM_REPEAT_MS
      if (into >= patternDurationMs(ALARM_PATTERNS[slot]!)) continue // over for this round; the next one rings
      voices.get(t.id)?.howl.stop(voices.get(t.id)!.id)
      const howl = b.alarms[slot]!
      const id = howl.play()
      if (into > IN_STEP_MS) howl.seek(into / 1000, id)
      voices.set(t.id, { howl, id })
      howl.once('end', () => {
        if (voices.get(t.id)?.id === id) voices.delete(t.id)
      }, id)
    }
  }

  /** The audio context started or stopped (unlocked by a tap, interrupted by a phone call). */
  function onAudioState() {
    if (!loaded) return
    audioReady.value = canPlay(loaded)
    audioBlocked.value = !audioReady.value
    check(shoot.serverNowMs())
  }

  function resume(b: AlarmBank) {
    const ctx = b.Howler.ctx
    if (ctx && ctx.state !== 'running') void ctx.resume().catch(() => {})
  }

  /** Call on the first tap or key press: browsers keep a page silent until the user acts. */
  function unlock() {
    unlockWanted = true
    if (loaded) resume(loaded)
  }

  function playTick() {
    if (loaded && canPlay(loaded)) loaded.tick.play()
  }

  async function acknowledgeAll(): Promise<void> {
    if (!shoot.can('timer.acknowledge')) return
    const due = dueTimersAt(shoot.state?.timers ?? [], shoot.serverNowMs())
    await Promise.all(due.map((t) => shoot.command({ type: 'timer.acknowledge', timerId: t.id })))
  }

  onMounted(async () => {
    let b: AlarmBank
    try {
      b = await loadBank()
    } catch {
      return // no sound on this screen; the flash still shows
    }
    if (disposed) return
    loaded = b
    b.Howler.volume(device.settings.volume)
    context = b.Howler.ctx ?? null
    context?.addEventListener('statechange', onAudioState)
    if (unlockWanted) resume(b)
    onAudioState()
  })

  watch(now, (t) => check(t))
  watch([() => shoot.state, () => output.value.sound], () => check(shoot.serverNowMs()))
  watch(() => device.settings.volume, (v) => loaded?.Howler.volume(v))
  useIntervalFn(() => {
    if (document.visibilityState === 'hidden') check(shoot.serverNowMs())
  }, HIDDEN_CHECK_MS)

  const alarmAttr = computed(() => [sounding.value && 'sound', flashing.value && 'flash'].filter(Boolean).join('+'))
  if (import.meta.client) watch(alarmAttr, (v) => (document.documentElement.dataset.alarm = v), { immediate: true })

  onScopeDispose(() => {
    disposed = true
    context?.removeEventListener('statechange', onAudioState)
    for (const voice of voices.values()) voice.howl.stop(voice.id)
    voices.clear()
    if (import.meta.client) document.documentElement.dataset.alarm = ''
  })

  return { ringing, flashing, sounding, output, audioReady: readonly(audioReady), audioBlocked: readonly(audioBlocked), acknowledgeAll, unlock, playTick }
}
