// Driving a shoot state through the reducer in unit tests, as the producer, on round times.
import type { ShootActor, ShootState } from '../../shared/types/shoot'
import { applyShootCommand } from '../../shared/utils/shoot-reducer'

export const T0 = 1_760_000_000_000
export const MIN = 60_000
export const PRODUCER: ShootActor = { role: 'producer', id: 'user:1' }

/** The state after a command; throws with the reducer's message when it is refused. */
export function run(s: ShootState, command: unknown, now: number): ShootState {
  const r = applyShootCommand(s, command, { nowServerMs: now, actor: PRODUCER })
  if (!r.ok) throw new Error(r.error.message)
  return r.state
}
