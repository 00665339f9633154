// The one guard: who is asking, and may they do this in this studio (or on this shoot)?
// Every route calls it first; the socket handshake and every socket command use `authorizeSession`.
// The membership is read from the database (or access-reads.ts's memory of it, emptied by every
// request that may change it) on every call, so a changed or removed role takes effect at once,
// without waiting for the session cookie to expire. So is the account's session
// version: a member session made before the account's last "sign out everywhere", password reset
// or removal from a studio is refused (401), and over HTTP its cookie is cleared.
import type { H3Event } from 'h3'
import type { User, UserSession } from '#auth-utils'
import { JoinCode, Membership, User as Account } from '../db/models'
import { accessRead } from './access-reads'
import { DomainError } from '../../shared/utils/domain-error'
import { deviceCan, roleCan, type DeviceRole, type StudioAction, type StudioRole } from '../../shared/utils/roles'

export type Caller =
  | { kind: 'member'; user: User; studioId: number; role: StudioRole; shootId?: number }
  | { kind: 'device'; studioId: number; shootId: number; role: DeviceRole; codeId: number }

const DEVICE_SCOPE_MESSAGE = 'This device joined one shoot only and may open nothing else.'

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
  'joincode.manage': 'make join codes',
  'shopping.tick': 'tick the shopping list',
  'takelog.export': 'download the take log',
}

const SESSION_ENDED_MESSAGE = 'This session was ended (signed out everywhere, a new password, or removed from a studio). Sign in again.'

/** Whether a member session still holds: it carries the account's current session version. */
export async function sessionIsCurrent(session: UserSession): Promise<boolean> {
  if (!session.user) return true
  await useDb()
  const userId = session.user.id
  const version = await accessRead(`version:${userId}`, async () => (await Account.findByPk(userId, { attributes: ['sessionVersion'] }))?.sessionVersion ?? null)
  return version !== null && version === (session.sessionVersion ?? 0)
}

/** The request's session; an ended member session is cleared (its cookie too) and answered 401. */
export async function currentSession(event: H3Event): Promise<UserSession> {
  const session = await getUserSession(event)
  if (!(await sessionIsCurrent(session))) {
    await clearUserSession(event)
    throw new DomainError('signed-out', SESSION_ENDED_MESSAGE)
  }
  return session
}

/** The decision itself, without an HTTP event: shared by routes and sockets. */
export async function authorizeSession(session: UserSession, target: Target, action: StudioAction, versionChecked = false): Promise<Caller> {
  await useDb()
  if (!versionChecked && !(await sessionIsCurrent(session))) throw new DomainError('signed-out', SESSION_ENDED_MESSAGE)
  let studioId: number
  let shootId: number | undefined
  if ('shootId' in target) {
    const shootStudio = await useShoot().store.studioOf(target.shootId)
    if (shootStudio === null) throw new DomainError('not-found', 'There is no such shoot.')
    studioId = shootStudio
    shootId = target.shootId
  } else {
    studioId = target.studioId
  }

  if (session.user) {
    const userId = session.user.id
    const role = await accessRead(`role:${userId}:${studioId}`,
      async () => (await Membership.findOne({ where: { userId, studioId }, attributes: ['role'] }))?.role ?? null)
    // Not a member: answer as if it did not exist, so ids cannot be probed.
    if (!role) throw new DomainError('not-found', shootId ? 'There is no such shoot.' : 'There is no such studio on your account.')
    if (!roleCan(role, action)) {
      throw new DomainError('forbidden', `Your role here (${role}) may not ${ACTION_WORDS[action]}. Ask the studio's producer.`)
    }
    return { kind: 'member', user: session.user, studioId, role, shootId }
  }

  if (session.device) {
    const device = session.device
    const usable = await accessRead(`code:${device.codeId}`,
      async () => { const code = await JoinCode.findByPk(device.codeId, { attributes: ['id', 'revokedAt'] }); return !!code && !code.revokedAt })
    if (!usable || device.until < Date.now()) {
      throw new DomainError('signed-out', 'This device is no longer joined to the shoot. Enter a new join code from the control desk.')
    }
    if (shootId === undefined || shootId !== device.shootId || studioId !== device.studioId) {
      throw new DomainError('forbidden', DEVICE_SCOPE_MESSAGE)
    }
    if (!deviceCan(device.role, action)) {
      throw new DomainError('forbidden', `A ${device.role} device may not ${ACTION_WORDS[action]}.`)
    }
    return { kind: 'device', studioId, shootId, role: device.role, codeId: device.codeId }
  }

  throw new DomainError('signed-out', 'Sign in first.')
}

/** 401 unless a member (not a device) is signed in. */
export async function requireMember(event: H3Event): Promise<User> {
  const session = await currentSession(event)
  if (!session.user) throw new DomainError('signed-out', 'Sign in first.')
  return session.user
}

export async function authorize(event: H3Event, target: Target, action: StudioAction): Promise<Caller> {
  return authorizeSession(await currentSession(event), target, action, true)
}

/** For routes under /api/studios/:studioId/…: a member of that studio whose role allows `action`. */
export async function requireStudio(event: H3Event, action: StudioAction): Promise<Extract<Caller, { kind: 'member' }>> {
  const studioId = routeId(event, 'studioId')
  const caller = await authorize(event, { studioId }, action)
  if (caller.kind !== 'member') throw new DomainError('forbidden', DEVICE_SCOPE_MESSAGE)
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
    throw new DomainError('not-found', `There is no such ${noun}.`)
  }
  const caller = await authorize(event, { studioId }, action)
  if (caller.kind !== 'member') throw new DomainError('forbidden', DEVICE_SCOPE_MESSAGE)
  return { caller, id, studioId }
}
