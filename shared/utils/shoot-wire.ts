// A shoot:event message on a screen: the state it brings.
import type { ShootState } from '../types/shoot'
import type { ShootEventMessage } from '../types/socket-events'

/** The state after `message`, or null when the screen must ask for a snapshot. */
export function applyShootMessage(_held: ShootState | null, message: ShootEventMessage): ShootState | null {
  return message.state
}
