// Who may send which shoot command: the one table. The server decides with it once, in
// applyShootCommand (shoot-reducer.ts), which the engine calls for every command; the screens read
// it only to show the controls a role may use. Reading a command from the wire is shoot-schema.ts.
import { SHOOT_COMMAND_TYPES, type ShootCommandType, type ShootRole } from '../types/shoot'

const DRIVE: ShootRole[] = ['producer', 'host']
const ON_SET: ShootRole[] = ['producer', 'host', 'camera']

/**
 * The roles of DESIGN.md: the producer may do everything; the host drives the shoot (start, pause,
 * resume, advance, timers, markers) but neither ends it, sets the rehearsal speed nor the rolling
 * flag; the camera adds markers and toggles rolling; a viewer only reads. Only the producer sets
 * the shoot's cameras and changes or deletes markers afterwards (also once the shoot has ended).
 */
export const SHOOT_COMMAND_ROLES: Readonly<Record<ShootCommandType, readonly ShootRole[]>> = {
  'shoot.start': DRIVE,
  'shoot.pause': DRIVE,
  'shoot.resume': DRIVE,
  'shoot.end': ['producer'],
  'step.next': DRIVE,
  'step.previous': DRIVE,
  'step.jump': DRIVE,
  'timer.start': DRIVE,
  'timer.pause': DRIVE,
  'timer.resume': DRIVE,
  'timer.addTime': DRIVE,
  'timer.cancel': DRIVE,
  'timer.acknowledge': DRIVE,
  'rolling.set': ['producer', 'camera'],
  'clock.speed': ['producer'],
  'marker.add': ON_SET,
  'wait.start': DRIVE,
  'marker.edit': ['producer'],
  'marker.delete': ['producer'],
  'camera.set': ['producer'],
  'camera.remove': ['producer'],
}

/** What a command does, in words, for messages ("may not start timers"). */
export const SHOOT_COMMAND_PHRASES: Readonly<Record<ShootCommandType, string>> = {
  'shoot.start': 'start the shoot',
  'shoot.pause': 'pause the shoot',
  'shoot.resume': 'resume the shoot',
  'shoot.end': 'end the shoot',
  'step.next': 'move to the next step',
  'step.previous': 'move to the previous step',
  'step.jump': 'jump to a step',
  'timer.start': 'start timers',
  'timer.pause': 'pause timers',
  'timer.resume': 'resume timers',
  'timer.addTime': 'change the time on timers',
  'timer.cancel': 'cancel timers',
  'timer.acknowledge': 'acknowledge alarms',
  'rolling.set': 'set the camera rolling flag',
  'clock.speed': 'change the rehearsal speed',
  'marker.add': 'add markers',
  'wait.start': 'start a wait of the cook plan',
  'marker.edit': 'change markers',
  'marker.delete': 'delete markers',
  'camera.set': 'set the cameras',
  'camera.remove': 'remove cameras',
}

export function isShootCommandType(type: unknown): type is ShootCommandType {
  return typeof type === 'string' && (SHOOT_COMMAND_TYPES as readonly string[]).includes(type)
}

/** Whether a role may send a command type; false for anything unknown. */
export function shootCommandAllowed(role: ShootRole | string, commandType: ShootCommandType | string): boolean {
  if (!isShootCommandType(commandType)) return false
  return (SHOOT_COMMAND_ROLES[commandType] as readonly string[]).includes(role)
}

const ROLE_WORDS: Record<ShootRole, string> = {
  producer: 'the producer', host: 'the host', camera: 'a camera operator', viewer: 'a viewer',
}

/** The refusal for a role that may not send a command: who may instead. */
export function shootCommandForbiddenMessage(role: ShootRole | string, commandType: ShootCommandType): string {
  const who = ROLE_WORDS[role as ShootRole] ?? `the role "${role}"`
  const allowed = SHOOT_COMMAND_ROLES[commandType].map((r) => ROLE_WORDS[r])
  const list = allowed.length > 1 ? `${allowed.slice(0, -1).join(', ')} or ${allowed.at(-1)}` : allowed[0]
  const text = `${who} may not ${SHOOT_COMMAND_PHRASES[commandType]}; ${list} may`
  return text.charAt(0).toUpperCase() + text.slice(1) + '.'
}

/** The refusal for a role that may not send a command, or null when it may (or the type is unknown). */
export function shootCommandRefusal(role: ShootRole | string | undefined, type: unknown): { code: 'forbidden'; message: string } | null {
  if (!isShootCommandType(type) || shootCommandAllowed(role ?? '', type)) return null
  return { code: 'forbidden', message: shootCommandForbiddenMessage(role ?? 'viewer', type) }
}
