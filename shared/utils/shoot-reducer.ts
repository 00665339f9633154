// The shoot reducer: (state, command from anywhere) → new state | error. Pure. The server applies
// every command with it; the rules themselves are in shoot-apply.ts, and after each change the cook
// plan is computed again from the present (shoot-live-plan.ts).
//
// Order of checks: the sender's role (the one permission check of shoot commands), the command's shape (zod, shoot-schema.ts), the shoot having
// ended, then the command against the state (shoot-apply.ts).
import type { ShootApplyResult, ShootCommand, ShootCommandContext, ShootState } from '../types/shoot'
import { shootCommandRefusal } from './shoot-commands'
import { parseShootCommand } from './shoot-schema'
import { applyKnownShootCommand, applyTakeLogCommandsWith } from './shoot-apply'
import { takeLogCommands } from './take-log-apply'
import { withLivePlan } from './shoot-live-plan'

applyTakeLogCommandsWith(takeLogCommands)

/** Commands after which the plan stays as it was (markers, cameras and the rolling flag change nothing in it). */
const KEEPS_PLAN = new Set(['marker.add', 'rolling.set', 'marker.edit', 'marker.delete', 'camera.set', 'camera.remove'])

/** Applies one command; see the file comment for the order of checks. */
export function applyShootCommand(state: ShootState, command: ShootCommand | unknown, ctx: ShootCommandContext): ShootApplyResult {
  const now = ctx?.nowServerMs
  if (typeof now !== 'number' || !Number.isFinite(now)) {
    return { ok: false, error: { code: 'invalid', message: 'The server could not read its own clock; try again.', field: 'nowServerMs' } }
  }
  // The one place that decides which role may send which command (the table in shoot-commands.ts).
  const forbidden = shootCommandRefusal(ctx.actor?.role, (command as { type?: unknown } | null)?.type)
  if (forbidden) return { ok: false, error: forbidden }
  const parsed = parseShootCommand(command)
  if (!parsed.ok) return parsed
  const result = applyKnownShootCommand(state, parsed.command, ctx)
  // The rest of the plan follows what just happened. Screens applying their own command early skip
  // this (it keeps the planner out of their bundle) and take the new plan with the server's answer.
  if (!result.ok || KEEPS_PLAN.has(parsed.command.type)) return result
  return { ...result, state: withLivePlan(result.state, now) }
}
