// A timer's countdown on screen, drawn from its deadline and the server clock each frame
// (timerRemainingMs in shared/utils/shoot-timers.ts): nothing here ticks, so every screen shows
// the same time and a screen that slept, reloaded or lost the network shows the right one.
import type { ShootTimer } from '~~/shared/types/shoot'
import { timerChecking, timerRemainingMs } from '~~/shared/utils/shoot-timers'
import { clockTextMs } from '~~/shared/utils/clock-text'
import { LAST_MINUTE_MS, TIMER_WORDS, timerLook } from '~~/shared/utils/shoot-words'

/** The last minute of kitchen time, when a countdown turns urgent. */
export const COUNTDOWN_URGENT_MS = LAST_MINUTE_MS

/** m:ss, or h:mm:ss from an hour, rounded up so 0:00 shows only when the time is up. */
export function countdownText(ms: number): string {
  return clockTextMs(ms, 'up')
}

/**
 * Remaining kitchen time of a timer, its label, whether it is in its last minute and whether it is
 * due. A running timer whose deadline has passed counts as due at once, before the server's word
 * arrives (or while this screen is offline); a due timer stays due until someone acknowledges it.
 */
export function useTimerCountdown(timer: MaybeRefOrGetter<ShootTimer | null | undefined>, now: Readonly<Ref<number>> = useServerNow()) {
  // Never more than the time set: a clock estimate a few ms early must not show 20:01 on a 20:00 timer.
  const remainingMs = computed(() => {
    const t = toValue(timer)
    return t ? Math.min(t.durationMs, timerRemainingMs(t, now.value)) : 0
  })
  const due = computed(() => {
    const t = toValue(timer)
    return !!t && (t.state === 'due' || (t.state === 'running' && remainingMs.value <= 0))
  })
  const urgent = computed(() => {
    const t = toValue(timer)
    return !!t && !due.value && (t.state === 'running' || t.state === 'paused') && remainingMs.value <= COUNTDOWN_URGENT_MS
  })
  /** How long it has been due, in server ms (0 when it is not). */
  const overdueMs = computed(() => {
    const t = toValue(timer)
    const since = t?.dueAtServerMs ?? t?.deadlineServerMs
    return due.value && since != null ? Math.max(0, now.value - since) : 0
  })
  const label = computed(() => countdownText(remainingMs.value))
  /** How it looks now, in the shoot vocabulary (shared/utils/shoot-words.ts): its state's label and colour. */
  const look = computed(() => {
    const t = toValue(timer)
    return t ? timerLook(t, { ringing: due.value, checking: !due.value && timerChecking(t, now.value), remainingMs: remainingMs.value }) : 'running'
  })
  const word = computed(() => TIMER_WORDS[look.value])
  return { remainingMs, label, urgent, due, overdueMs, look, word }
}

/** Time gone by (the shoot clock, a marker's stamp): m:ss or h:mm:ss, rounded down. */
export function elapsedText(ms: number): string {
  return clockTextMs(ms, 'down')
}
