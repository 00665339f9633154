// What one screen does when a timer is due: ring, flash, or both ("quiet on set"). Off camera every
// crew screen rings and flashes. While the camera rolls, screens flash and only those set to ring
// while rolling make a sound; the host's screen stays quiet unless no other screen would ring, since
// a due timer whose food can burn is never left silent on every device.
import type { ShootTimer } from '../types/shoot'
import { shootTimerDueAt } from './shoot-timers'

/** A due timer rings again every this many ms until someone acknowledges it. */
export const ALARM_REPEAT_MS = 3000

export interface AlarmOutputInput {
  /** This screen's role on the shoot; null when it is not on one. */
  role: string | null
  /** Whether the camera is rolling. */
  rolling: boolean
  /** This screen is set to ring aloud while rolling (device settings). */
  audibleWhileRolling: boolean
  /** Some other crew screen on the shoot rings aloud while rolling. */
  audibleElsewhere: boolean
  /** A host's screen is on the shoot (default true). Without one, the fall-back ring moves to
   * whichever crew screen is left, so something still rings. */
  hostOnSet?: boolean
}

export interface AlarmOutput {
  sound: boolean
  flash: boolean
  /** Why, in a sentence for the screen. */
  reason: string
}

const CREW = ['producer', 'host', 'camera']

export function alarmOutput({ role, rolling, audibleWhileRolling, audibleElsewhere, hostOnSet = true }: AlarmOutputInput): AlarmOutput {
  if (role === null || (!CREW.includes(role) && role !== 'viewer')) {
    return { sound: false, flash: false, reason: 'This screen is not on the shoot, so it neither rings nor flashes.' }
  }
  if (role === 'viewer') return { sound: false, flash: true, reason: 'A viewer’s screen flashes and stays quiet.' }
  if (!rolling) return { sound: true, flash: true, reason: 'Not rolling: this screen rings and flashes.' }
  if (audibleWhileRolling) return { sound: true, flash: true, reason: 'Rolling: this screen is set to ring while rolling, and flashes.' }
  if (!audibleElsewhere && (role === 'host' || !hostOnSet)) {
    return { sound: true, flash: true, reason: 'No device on set is set to ring while rolling, so this one rings.' }
  }
  return {
    sound: false,
    flash: true,
    reason: role === 'host'
      ? 'Quiet on set: the camera is rolling, so this screen flashes and another screen rings.'
      : 'Quiet on set: the camera is rolling, so this screen flashes and stays quiet.',
  }
}

/** The screens on a shoot as the server lists them: their role and whether each rings while rolling. */
export interface AlarmPresence {
  screens: ReadonlyArray<{ role: string; audibleWhileRolling: boolean }>
}

/**
 * Whether a crew screen other than this one rings while rolling. The list includes this screen, so
 * when this screen rings it takes one ringing crew entry off the count. Viewers never ring, so they
 * do not count.
 */
export function audibleElsewhere(presence: AlarmPresence, self: { role: string | null; audibleWhileRolling: boolean }): boolean {
  const ringing = presence.screens.filter((s) => s.audibleWhileRolling && CREW.includes(s.role)).length
  const mine = self.audibleWhileRolling && self.role !== null && CREW.includes(self.role) ? 1 : 0
  return ringing - mine > 0
}

/**
 * The timers ringing at a server time: those the server marked due, and running ones whose deadline
 * has passed before the server's word arrives (or while this screen is offline), taken as due at
 * their deadline, which is when the server marks them. Sorted by slot.
 */
export function dueTimersAt(timers: readonly ShootTimer[], nowServerMs: number): ShootTimer[] {
  return timers
    .flatMap((t) => {
      if (t.state === 'due') return [t]
      if (t.state === 'running' && t.deadlineServerMs !== null && t.deadlineServerMs <= nowServerMs) return [shootTimerDueAt(t, t.deadlineServerMs)]
      return []
    })
    .sort((a, b) => a.slot - b.slot)
}
