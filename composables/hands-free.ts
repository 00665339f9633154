// Hands-free control of a shoot screen: one keydown listener on the window turns a pedal's or a
// clicker's key into the screen's action through this device's key map; "?" opens the key help.
// Voice commands (useVoiceCommands) call `run` too, so both paths behave alike.
import type { ShootCommand, ShootCommandType } from '~~/shared/types/shoot'
import { actionForKey, keyName, stepTimer, type KeyAction } from '~~/shared/utils/key-map'
import { upcomingWaits } from '~~/shared/utils/shoot-cues'
import { timerForMoreTime, timersToCallDone } from '~~/shared/utils/timer-attention'

export type HandsFreeHandlers = Partial<Record<KeyAction, () => void>>

/** Elements whose own keys must keep working: typing, and widgets that use arrows. */
const TYPING = 'input, textarea, select, [contenteditable]:not([contenteditable="false"]), [role="textbox"], [role="combobox"], [role="listbox"], [role="slider"], [role="spinbutton"], [role="menu"], [role="menubar"], [role="radiogroup"], [role="tablist"], [role="tree"], [role="grid"]'
/** Controls that Enter and the space bar press: those two keys stay theirs. */
const PRESSABLE = 'button, a[href], summary, [role="button"], [role="link"], [role="checkbox"], [role="switch"], [role="menuitem"], [role="tab"]'

function closestOf(target: EventTarget | null, selector: string): boolean {
  return target instanceof Element && !!target.closest(selector)
}

/** Whether a key event belongs to the element it was typed in rather than to the shoot. */
export function keyBelongsToTarget(event: KeyboardEvent, key: string): boolean {
  if (closestOf(event.target, TYPING)) return true
  return (key === 'Enter' || key === 'Space') && closestOf(event.target, PRESSABLE)
}

export function useHandsFree(handlers: MaybeRefOrGetter<HandsFreeHandlers>, options: { enabled?: MaybeRefOrGetter<boolean> } = {}) {
  const device = useDeviceSettings()
  const helpOpen = ref(false)
  const lastAction = ref<{ action: KeyAction; at: number } | null>(null)

  /** Does an action if this screen has it; false when it has not. An action also closes the help,
   * so a pedal always works, even when someone left the help open. */
  function run(action: KeyAction): boolean {
    if (!(toValue(options.enabled) ?? true)) return false
    const handler = toValue(handlers)[action]
    if (!handler) return false
    helpOpen.value = false
    lastAction.value = { action, at: Date.now() }
    handler()
    return true
  }

  useEventListener('keydown', (event: KeyboardEvent) => {
    if (event.defaultPrevented || event.isComposing || event.ctrlKey || event.metaKey || event.altKey) return
    if (!(toValue(options.enabled) ?? true)) return
    const key = keyName(event)
    if (!key || keyBelongsToTarget(event, key)) return
    if (key === '?') {
      event.preventDefault()
      helpOpen.value = !helpOpen.value
      return
    }
    if (key === 'Escape') {
      if (helpOpen.value) {
        event.preventDefault()
        helpOpen.value = false
      }
      return
    }
    const action = actionForKey(device.settings.keys, key)
    if (!action || !toValue(handlers)[action]) return
    // Handled here, so PageDown does not scroll and Enter does not submit; a held pedal acts once.
    event.preventDefault()
    if (!event.repeat) run(action)
  })

  return { helpOpen, lastAction, run }
}

/**
 * The standard actions of a shoot screen, from the shoot store, each only where this screen's role
 * may send it. `message` is set when an action cannot be done here (a step with no time, no alarm
 * ringing), for the screen to show beside the store's own refusals; the next action clears it.
 */
export function defaultShootHandlers() {
  const shoot = useShootStore()
  const message = ref<string | null>(null)

  const send = (cmd: ShootCommand) => {
    message.value = null
    void shoot.command(cmd)
  }

  const all: Record<KeyAction, { type: ShootCommandType; run: () => void }> = {
    next: { type: 'step.next', run: () => send({ type: 'step.next' }) },
    previous: { type: 'step.previous', run: () => send({ type: 'step.previous' }) },
    startTimer: {
      type: 'timer.start',
      run: () => {
        const timer = stepTimer(shoot.currentStep)
        if (!timer.ok) {
          message.value = timer.message
          return
        }
        send({ type: 'timer.start', label: timer.label, durationMs: timer.durationMs })
      },
    },
    startWait: {
      type: 'wait.start',
      run: () => {
        // Every cue that is due (its planned start has come; two pots may go on together); one not
        // yet due starts from its own button.
        const s = shoot.state
        const waits = s ? upcomingWaits(s, shoot.serverNowMs(), Number.POSITIVE_INFINITY) : []
        const due = waits.filter((w) => w.inMs <= 0)
        if (!due.length) {
          message.value = waits.length
            ? `No wait is due yet: ${waits[0]!.label} starts in ${countdownText(waits[0]!.inMs)}. Press its Start now to start it early.`
            : 'No wait of the cook plan is waiting to start.'
          return
        }
        message.value = null
        for (const w of due) void shoot.command({ type: 'wait.start', stepId: w.stepId })
      },
    },
    acknowledge: {
      type: 'timer.acknowledge',
      run: () => {
        // Due on this screen's clock, as the alarm is: a timer past its deadline that the server's
        // tick has not marked yet is acknowledged too (the reducer marks it due first). With none
        // ringing, a timer at its "check it" moment is called done.
        const done = timersToCallDone(shoot.state?.timers ?? [], shoot.serverNowMs())
        if (!done.length) {
          message.value = 'No alarm is ringing and no timer is at its check, so there is nothing to call done.'
          return
        }
        message.value = null
        for (const t of done) void shoot.command({ type: 'timer.acknowledge', timerId: t.id })
      },
    },
    addMinute: {
      type: 'timer.addTime',
      run: () => {
        const t = timerForMoreTime(shoot.state?.timers ?? [], shoot.serverNowMs())
        if (!t) {
          message.value = 'No timer is live, so there is none to add a minute to.'
          return
        }
        send({ type: 'timer.addTime', timerId: t.id, deltaMs: 60_000 })
      },
    },
    flub: { type: 'marker.add', run: () => send({ type: 'marker.add', kind: 'flub' }) },
  }

  const handlers = computed<HandsFreeHandlers>(() => {
    const out: HandsFreeHandlers = {}
    for (const [action, h] of Object.entries(all) as Array<[KeyAction, (typeof all)[KeyAction]]>) {
      if (shoot.can(h.type)) out[action] = h.run
    }
    return out
  })
  /** The actions this screen has, for the key help. */
  const actions = computed(() => Object.keys(handlers.value) as KeyAction[])

  return { handlers, actions, message }
}
