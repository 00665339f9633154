// The one guard: who is asking, and may they do this in this studio (or on this shoot)?
// Every route calls it first; the socket handshake and every socket command use `authorizeSession`.
// The membership is read from the database on every call, so a changed or removed role takes
// effect at once, without waiting for the session cookie to expire.
import type { H3Event } from 'h3'
import type { User, UserSession } from '#auth-utils'
import { JoinCode, Membership, Shoot } from '../db/models'
import { deviceCan, roleCan, type DeviceRole, type StudioAction, type StudioRole } from '../../shared/utils/roles'

export type Caller =
  | { kind: 'member'; user: User; studioId: number; role: StudioRole; shootId?: number }
  | { kind: 'device'; studioId: number; shootId: number; role: DeviceRole; codeId: number }

export type Target = { studioId: number } | { shootId: number }

const ACTION_WORDS: Record<StudioAction, string> = {
  'studio.read': 'open this studio',
  'crew.read': 'see the crew',
  'crew.manage': 'manage the crew',
  'mail.read': 'read the outbox',
  'recipe.read': 'read recipes',
  'recipe.edit': 'edit recipes',
  'price.edit': 'edit prices',
  'episode.read': 'read episodes',
  'episode.edit': 'edit episodes',
  'shoot.read': 'watch this shoot',
  'shoot.create': 'start a shoot',
  'shoot.drive': 'drive the shoot',
  'shoot.mark': 'add take markers',
  'shoot.roll': 'set rolling',
  'joincode.manage': 'make join codes',
}

export class GuardError extends Error {
  constructor(public statusCode: 401 | 403 | 404, message: string) {
    super(message)
  }
}

/** The decision itself, without an HTTP event: shared by routes and sockets. */
export async function authorizeSession(session: UserSession, target: Target, action: StudioAction): Promise<Caller> {
  await useDb()
  let studioId: number
  let shootId: number | undefined
  if ('shootId' in target) {
    const shoot = await Shoot.findByPk(target.shootId, { attributes: ['id', 'studioId'] })
    if (!shoot) throw new GuardError(404, 'There is no such shoot.')
    studioId = shoot.studioId
    shootId = shoot.id
  } else {
    studioId = target.studioId
  }

  if (session.user) {
    const membership = await Membership.findOne({ where: { userId: session.user.id, studioId }, attributes: ['role'] })
    // Not a member: answer as if it did not exist, so ids cannot be probed.
    if (!membership) throw new GuardError(404, shootId ? 'There is no such shoot.' : 'There is no such studio on your account.')
    if (!roleCan(membership.role, action)) {
      throw new GuardError(403, `Your role here (${membership.role}) may not ${ACTION_WORDS[action]}. Ask the studio's producer.`)
    }
    return { kind: 'member', user: session.user, studioId, role: membership.role, shootId }
  }

  if (session.device) {
    const device = session.device
    const code = await JoinCode.findByPk(device.codeId, { attributes: ['id', 'revokedAt'] })
    if (!code || code.revokedAt || device.until < Date.now()) {
      throw new GuardError(401, 'This device is no longer joined to the shoot. Enter a new join code from the control desk.')
    }
    if (shootId === undefined || shootId !== device.shootId || studioId !== device.studioId) {
      throw new GuardError(403, 'This device joined one shoot only and may open nothing else.')
    }
    if (!deviceCan(device.role, action)) {
      throw new GuardError(403, `A ${device.role} device may not ${ACTION_WORDS[action]}.`)
    }
    return { kind: 'device', studioId, shootId, role: device.role, codeId: device.codeId }
  }

  throw new GuardError(401, 'Sign in first.')
}

function toHttp(error: unknown): never {
  if (error instanceof GuardError) throw createError({ statusCode: error.statusCode, statusMessage: error.message })
  throw error
}

/** 401 unless a member (not a device) is signed in. */
export async function requireMember(event: H3Event): Promise<User> {
  const session = await getUserSession(event)
  if (!session.user) throw createError({ statusCode: 401, statusMessage: 'Sign in first.' })
  return session.user
}

export async function authorize(event: H3Event, target: Target, action: StudioAction): Promise<Caller> {
  return authorizeSession(await getUserSession(event), target, action).catch(toHttp)
}

/** For routes under /api/studios/:studioId/…: a member of that studio whose role allows `action`. */
export async function requireStudio(event: H3Event, action: StudioAction): Promise<Extract<Caller, { kind: 'member' }>> {
  const studioId = routeId(event, 'studioId')
  const caller = await authorize(event, { studioId }, action)
  if (caller.kind !== 'member') throw createError({ statusCode: 403, statusMessage: 'This device joined one shoot only and may open nothing else.' })
  return caller
}

/** For routes under /api/shoots/:id/…: a member of the shoot's studio, or a device joined to it. */
export async function requireShoot(event: H3Event, action: StudioAction, param = 'id'): Promise<Caller & { shootId: number }> {
  const shootId = routeId(event, param)
  const caller = await authorize(event, { shootId }, action)
  return { ...caller, shootId }
}

/**
 * For routes under /api/<things>/:id/… where the thing belongs to a studio (a recipe, an episode):
 * a member of that studio whose role allows `action`. An unknown id and another studio's thing look
 * the same (404), once the caller is known to be signed in.
 */
export async function requireStudioThing(
  event: H3Event, action: StudioAction, findStudioId: (id: number) => Promise<number | null>, noun: string, param = 'id',
): Promise<{ caller: Extract<Caller, { kind: 'member' }>; id: number; studioId: number }> {
  const id = routeId(event, param)
  await useDb()
  const studioId = await findStudioId(id)
  if (studioId === null) {
    await requireMember(event)
    throw createError({ statusCode: 404, statusMessage: `There is no such ${noun}.` })
  }
  const caller = await authorize(event, { studioId }, action)
  if (caller.kind !== 'member') throw createError({ statusCode: 403, statusMessage: 'This device joined one shoot only and may open nothing else.' })
  return { caller, id, studioId }
}
