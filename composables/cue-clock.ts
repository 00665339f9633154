// The server clock for cues that must turn due on time: the screen's frame clock (20 a second),
// plus a wake-up timed for the next moment a cue is due, so at 32× a cue still turns within a few
// kitchen ms of its planned start instead of up to one frame (1.6 kitchen s) late.
import type { ShootState } from '~~/shared/types/shoot'
import { shootClockAt } from '~~/shared/utils/shoot-clock'

/** `dueAt` gives the shoot-clock times still to come (ms); the clock reads again when the soonest arrives. */
export function useCueClock(dueAt: (state: ShootState, now: number) => number[]): Readonly<Ref<number>> {
  const shoot = useShootStore()
  const frame = useShootNow()
  const now = shallowRef(frame.value)
  watch(frame, (v) => (now.value = v))
  let wake: ReturnType<typeof setTimeout> | undefined
  watch([now, () => shoot.state], ([t, s]) => {
    clearTimeout(wake)
    if (!s || !s.clock.running) return
    const shootNow = shootClockAt(s.clock, t)
    const next = Math.min(...dueAt(s, t).filter((at) => at > shootNow))
    if (!Number.isFinite(next)) return
    // Real ms to it; one more so the clock has surely passed it when read.
    const wait = (next - shootNow) / s.clock.speed + 1
    if (wait < 200) wake = setTimeout(() => (now.value = shoot.serverNowMs()), wait)
  })
  onScopeDispose(() => clearTimeout(wake))
  return readonly(now)
}
