// Who may do what in a studio (DESIGN.md, "Who uses it"). The server enforces it through the one
// guard (server/utils/guard.ts); pages use the same table to hide what a role may not do.

export const STUDIO_ROLES = ['producer', 'host', 'camera', 'viewer'] as const
export type StudioRole = (typeof STUDIO_ROLES)[number]

/** Roles a device join code can grant: one role for one shoot. */
export const DEVICE_ROLES = ['host', 'camera'] as const
export type DeviceRole = (typeof DEVICE_ROLES)[number]

export type StudioAction =
  | 'studio.read'
  | 'crew.read'
  | 'crew.manage'
  | 'mail.read'
  | 'recipe.read'
  | 'recipe.edit'
  | 'price.edit'
  | 'episode.read'
  | 'episode.edit'
  | 'shoot.read'
  | 'shoot.create'
  | 'joincode.manage'
  | 'shopping.tick'
  | 'takelog.export'

const READ: StudioAction[] = ['studio.read', 'crew.read', 'recipe.read', 'episode.read', 'shoot.read']

const ALLOWED: Record<StudioRole, ReadonlySet<StudioAction>> = {
  producer: new Set<StudioAction>([
    ...READ, 'crew.manage', 'mail.read', 'recipe.edit', 'price.edit', 'episode.edit',
    'shoot.create', 'joincode.manage', 'shopping.tick', 'takelog.export',
  ]),
  host: new Set<StudioAction>([...READ, 'recipe.edit', 'shopping.tick']),
  camera: new Set<StudioAction>(READ),
  // The viewer is the editor too: the take log's exports are theirs to fetch.
  viewer: new Set<StudioAction>([...READ, 'takelog.export']),
}

/**
 * Actions a device session may take on its one shoot; anything about the studio itself is refused.
 * Which shoot command a role may send is the table in shoot-commands.ts, decided by the engine.
 */
const DEVICE_SCOPE: ReadonlySet<StudioAction> = new Set<StudioAction>(['shoot.read', 'recipe.read', 'episode.read'])

export function roleCan(role: StudioRole, action: StudioAction): boolean {
  return ALLOWED[role]?.has(action) ?? false
}

export function deviceCan(role: DeviceRole, action: StudioAction): boolean {
  return DEVICE_SCOPE.has(action) && roleCan(role, action)
}

export function isStudioRole(value: unknown): value is StudioRole {
  return typeof value === 'string' && (STUDIO_ROLES as readonly string[]).includes(value)
}

export const STUDIO_ROLE_LABELS: Record<StudioRole, string> = {
  producer: 'Producer',
  host: 'Host',
  camera: 'Camera',
  viewer: 'Viewer',
}

export const STUDIO_ROLE_SUMMARIES: Record<StudioRole, string> = {
  producer: 'Plans episodes, invites the crew, runs the shoot from the control desk',
  host: 'Reads the prompter, edits recipes and scripts, drives the shoot',
  camera: 'Follows the cue screen, marks takes, sets rolling',
  viewer: 'Reads recipes, episodes and the take log',
}
