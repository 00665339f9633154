// Accounts: users, their memberships, sign-in and password resets. Route handlers stay thin and
// call these; these return plain objects, never Sequelize instances.
import type { H3Event } from 'h3'
import type { UserSession } from '#auth-utils'
import type { Transaction } from 'sequelize'
import { Membership, PasswordReset, Studio, User } from '../db/models'
import { passwordProblem } from '../../shared/utils/password-policy'
import type { StudioRole } from '../../shared/utils/roles'
import { DomainError } from '../../shared/utils/domain-error'

export const RESET_LIFETIME_MS = 60 * 60 * 1000

export interface MembershipView {
  studioId: number
  studioName: string
  role: StudioRole
}

export function publicUser(user: User) {
  return { id: user.id, name: user.name, email: user.email }
}

export function assertPasswordAllowed(password: string, email: string) {
  const problem = passwordProblem(password, email)
  if (problem) throw new DomainError('invalid', `Password: ${problem.charAt(0).toLowerCase()}${problem.slice(1)}`, { field: 'password' })
}

export async function membershipsOf(userId: number): Promise<MembershipView[]> {
  const rows = await Membership.findAll({ where: { userId }, include: [{ model: Studio, as: 'studio', attributes: ['id', 'name'] }], order: [['id', 'ASC']] })
  return rows.map((m) => {
    const studio = (m as Membership & { studio: Studio }).studio
    return { studioId: studio.id, studioName: studio.name, role: m.role }
  })
}

export function slugFor(name: string): string {
  const base = name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'studio'
  return `${base}-${Math.random().toString(36).slice(2, 8)}`
}

/**
 * A new account, in the caller's transaction. The password is hashed BEFORE the transaction
 * (`newPasswordHash`): at OWASP's scrypt cost a hash takes about half a second, and a transaction
 * holds the one write queue every live shoot shares.
 */
export async function createUser(input: { name: string; email: string; passwordHash: string }, transaction: Transaction): Promise<User> {
  if (await User.findOne({ where: { email: input.email }, transaction })) {
    throw new DomainError('conflict', 'E-mail address: an account with this address already exists. Sign in instead, or reset the password.', { field: 'email' })
  }
  return User.create({ name: input.name, email: input.email, passwordHash: input.passwordHash }, { transaction })
}

/** The hash of a new password, once the password policy allows it. */
export async function newPasswordHash(password: string, email: string): Promise<string> {
  assertPasswordAllowed(password, email)
  return hashPassword(password)
}

/** A new studio with `userId` as its producer, in the caller's transaction: sign-up's and "Open a studio"'s. */
export async function createStudioFor(
  userId: number, input: { name: string; locale?: string; currency?: string; timeZone?: string }, transaction: Transaction,
): Promise<Studio> {
  const studio = await Studio.create({
    name: input.name, slug: slugFor(input.name), locale: input.locale, currency: input.currency, timeZone: input.timeZone,
  }, { transaction })
  await Membership.create({ userId, studioId: studio.id, role: 'producer' }, { transaction })
  return studio
}

export async function signUp(input: { name: string; email: string; password: string; studioName: string }) {
  const sequelize = await useDb()
  const passwordHash = await newPasswordHash(input.password, input.email)
  return sequelize.transaction(async (transaction) => {
    const user = await createUser({ name: input.name, email: input.email, passwordHash }, transaction)
    const studio = await createStudioFor(user.id, { name: input.studioName }, transaction)
    return { user: publicUser(user), studioId: studio.id, sessionVersion: user.sessionVersion ?? 0 }
  })
}

/** A signed-in member opens another studio and becomes its producer. */
export async function openStudio(userId: number, input: { name: string; locale: string; currency: string; timeZone: string }) {
  const sequelize = await useDb()
  return sequelize.transaction(async (transaction) => {
    if (!(await User.findByPk(userId, { attributes: ['id'], transaction }))) throw new DomainError('signed-out', 'This account no longer exists. Sign in again.')
    const studio = await createStudioFor(userId, input, transaction)
    return { id: studio.id, name: studio.name, locale: studio.locale, currency: studio.currency, timeZone: studio.timeZone }
  })
}

// A real scrypt hash of a random string, so an unknown e-mail costs the same time as a wrong password.
let decoyHash: Promise<string> | undefined

export async function checkCredentials(email: string, password: string): Promise<User | null> {
  await useDb()
  const user = await User.findOne({ where: { email } })
  if (!user) {
    decoyHash ??= hashPassword(crypto.randomUUID())
    await verifyPassword(await decoyHash, password)
    return null
  }
  if (!(await verifyPassword(user.passwordHash, password))) return null
  await rehashIfOld(user, password)
  return user
}

/**
 * A hash made at an older cost (e.g. scrypt N=2^14 before Hobline moved to OWASP's N=2^17) is made
 * again, at today's cost, while the password is at hand: after a successful check only.
 */
export async function rehashIfOld(user: User, password: string, transaction?: Transaction) {
  if (!passwordNeedsReHash(user.passwordHash)) return
  user.passwordHash = await hashPassword(password)
  await user.save({ transaction })
}

/**
 * Ends every session of the account but (optionally) the caller's: the version the sessions carry
 * goes up, and the guard refuses a session whose version is behind. Returns the new version.
 */
export async function endSessions(userId: number, transaction?: Transaction): Promise<number> {
  await useDb()
  await User.increment('sessionVersion', { where: { id: userId }, transaction })
  const user = await User.findByPk(userId, { attributes: ['sessionVersion'], transaction })
  return user?.sessionVersion ?? 0
}

/**
 * A new session with a new id, whatever cookie the request brought (no session fixation).
 * h3's session update re-reads the request's cookie after a clear and would keep its id, so the
 * incoming session cookie is dropped from this request before the new session is written.
 */
export async function startFreshSession(event: H3Event, data: Omit<UserSession, 'id'>) {
  await clearUserSession(event)
  const name = useRuntimeConfig().session.name || 'nuxt-session'
  const cookies = (event.node.req.headers.cookie ?? '').split(';').filter((c) => !c.trim().startsWith(`${name}=`))
  event.node.req.headers.cookie = cookies.join(';')
  await setUserSession(event, data)
}

export async function startMemberSession(event: H3Event, user: User, studioId?: number) {
  await startFreshSession(event, { user: publicUser(user), studioId, sessionVersion: user.sessionVersion ?? 0, loggedInAt: Date.now() })
}

export async function requestPasswordReset(email: string): Promise<{ user: User; token: string; expiresAt: Date } | null> {
  await useDb()
  const user = await User.findOne({ where: { email } })
  if (!user) return null
  const { token, hash } = newToken()
  const expiresAt = new Date(Date.now() + RESET_LIFETIME_MS)
  await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt })
  return { user, token, expiresAt }
}

export async function resetPassword(token: string, password: string) {
  const sequelize = await useDb()
  const openReset = async () => {
    const reset = await PasswordReset.findOne({ where: { tokenHash: hashToken(token) } })
    if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) {
      throw new DomainError('gone', 'This reset link has expired or was already used. Ask for a new one from the sign-in page.')
    }
    const user = await User.findByPk(reset.userId)
    if (!user) throw new DomainError('gone', 'The account for this link no longer exists.')
    return { reset, user }
  }
  // Hashed outside the transaction (see createUser); the link is checked again inside it.
  const { user: before } = await openReset()
  const passwordHash = await newPasswordHash(password, before.email)
  return sequelize.transaction(async (transaction) => {
    const { user } = await openReset()
    user.passwordHash = passwordHash
    // Every session of the account ends: whoever knew the old password is signed out everywhere.
    user.sessionVersion = (user.sessionVersion ?? 0) + 1
    await user.save({ transaction })
    // This link and every other open link for the account stop working.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction })
    return publicUser(user)
  })
}
