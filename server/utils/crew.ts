// A studio's crew: members with their roles, and invites by e-mail.
import { Invite, Membership, Studio, User } from '../db/models'
import { formatExpiry, inviteMail } from '../mail/templates'
import type { StudioRole } from '../../shared/utils/roles'
import { DomainError } from '../../shared/utils/domain-error'

export const INVITE_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000

export async function listMembers(studioId: number) {
  await useDb()
  const rows = await Membership.findAll({ where: { studioId }, include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }], order: [['id', 'ASC']] })
  return rows.map((m) => {
    const user = (m as Membership & { user: User }).user
    return { userId: user.id, name: user.name, email: user.email, role: m.role, readingWpm: m.readingWpm ?? null, since: m.createdAt }
  })
}

async function producersLeft(studioId: number, withoutUserId: number) {
  return Membership.count({ where: { studioId, role: 'producer' } }).then(async (n) => {
    const self = await Membership.findOne({ where: { studioId, userId: withoutUserId, role: 'producer' } })
    return n - (self ? 1 : 0)
  })
}

/** A member's new role and/or reading pace; the studio keeps at least one producer. */
export async function changeMember(studioId: number, userId: number, change: { role?: StudioRole; readingWpm?: number | null }) {
  const sequelize = await useDb()
  return sequelize.transaction(async () => {
    const membership = await Membership.findOne({ where: { studioId, userId } })
    if (!membership) throw new DomainError('not-found', 'That person is not in this studio.')
    const role = change.role ?? membership.role
    if (membership.role === 'producer' && role !== 'producer' && (await producersLeft(studioId, userId)) === 0) {
      throw new DomainError('conflict', 'A studio needs at least one producer. Make someone else a producer first.')
    }
    membership.role = role
    if (change.readingWpm !== undefined) membership.readingWpm = change.readingWpm
    await membership.save()
    return { userId, role, readingWpm: membership.readingWpm ?? null }
  })
}

export async function removeMember(studioId: number, userId: number) {
  const sequelize = await useDb()
  await sequelize.transaction(async () => {
    const membership = await Membership.findOne({ where: { studioId, userId } })
    if (!membership) throw new DomainError('not-found', 'That person is not in this studio.')
    if (membership.role === 'producer' && (await producersLeft(studioId, userId)) === 0) {
      throw new DomainError('conflict', 'A studio needs at least one producer. Make someone else a producer before removing this one.')
    }
    await membership.destroy()
    // Every session of the removed person ends at its next request (the guard compares versions).
    await User.increment('sessionVersion', { where: { id: userId } })
  })
}

export function inviteView(invite: Invite, studio: { locale: string; timeZone: string } | null) {
  return {
    id: invite.id,
    email: invite.email,
    role: invite.role,
    expiresAt: invite.expiresAt,
    /** When the link stops working, in the studio's local time, in the words of the invitation mail. */
    expiresText: formatExpiry(invite.expiresAt, studio?.locale, studio?.timeZone),
    expired: invite.expiresAt.getTime() < Date.now(),
    sentCount: invite.sentCount,
    lastSentAt: invite.lastSentAt,
  }
}

export async function listInvites(studioId: number) {
  await useDb()
  const rows = await Invite.findAll({ where: { studioId, acceptedAt: null, revokedAt: null }, order: [['id', 'DESC']] })
  const studio = await Studio.findByPk(studioId)
  return rows.map((r) => inviteView(r, studio))
}

/** A new link (the old one stops working), a new expiry, and the mail. */
async function sendInvite(site: string, invite: Invite, inviterName: string) {
  const { token, hash } = newToken()
  invite.tokenHash = hash
  invite.expiresAt = new Date(Date.now() + INVITE_LIFETIME_MS)
  invite.sentCount = invite.sentCount + 1
  invite.lastSentAt = new Date()
  await invite.save()
  const studio = await Studio.findByPk(invite.studioId)
  const link = `${site}/invite/${token}`
  const mail = inviteMail({
    studioName: studio!.name, inviterName, role: invite.role, link, expiresAt: invite.expiresAt, locale: studio!.locale, timeZone: studio!.timeZone,
  })
  await sendMail({ ...mail, to: invite.email, kind: 'invite', studioId: invite.studioId })
  return { invite: inviteView(invite, studio), token }
}

export async function inviteToStudio(site: string, studioId: number, inviter: { id: number; name: string }, email: string, role: StudioRole) {
  await useDb()
  const existing = await User.findOne({ where: { email }, attributes: ['id'] })
  if (existing && (await Membership.findOne({ where: { studioId, userId: existing.id } }))) {
    throw new DomainError('conflict', 'E-mail to invite: this person is already in the studio. Change their role in the crew list instead.', { field: 'email' })
  }
  // Inviting the same address again renews the pending invite instead of making a second one.
  let invite = await Invite.findOne({ where: { studioId, email, acceptedAt: null, revokedAt: null } })
  if (invite) invite.role = role
  else invite = Invite.build({ studioId, email, role, tokenHash: newToken().hash, invitedBy: inviter.id, expiresAt: new Date() })
  return sendInvite(site, invite, inviter.name)
}

async function pendingInvite(studioId: number, inviteId: number) {
  await useDb()
  const invite = await Invite.findOne({ where: { id: inviteId, studioId, acceptedAt: null, revokedAt: null } })
  if (!invite) throw new DomainError('not-found', 'There is no such invite waiting in this studio; it may have been accepted or withdrawn already.')
  return invite
}

export async function resendInvite(site: string, studioId: number, inviteId: number, inviterName: string) {
  return sendInvite(site, await pendingInvite(studioId, inviteId), inviterName)
}

export async function revokeInvite(studioId: number, inviteId: number) {
  const invite = await pendingInvite(studioId, inviteId)
  invite.revokedAt = new Date()
  await invite.save()
}

async function openInvite(token: string) {
  await useDb()
  const invite = await Invite.findOne({ where: { tokenHash: hashToken(token) }, include: [{ model: Studio, as: 'studio', attributes: ['id', 'name'] }] })
  if (!invite) throw new DomainError('not-found', 'This invite link is not known. It may have been replaced by a newer mail.')
  if (invite.acceptedAt) throw new DomainError('gone', 'This invite was already accepted. Sign in to reach the studio.')
  if (invite.revokedAt) throw new DomainError('gone', 'This invite was withdrawn by the studio. Ask the producer for a new one.')
  if (invite.expiresAt.getTime() < Date.now()) throw new DomainError('gone', 'This invite has expired. Ask the producer to send it again.')
  return invite as Invite & { studio: Studio }
}

// The preview does not say whether the address has an account: the page asks for a name and a
// password either way, and an existing account keeps its own name.
export async function describeInvite(token: string) {
  const invite = await openInvite(token)
  return { studioName: invite.studio.name, role: invite.role, email: invite.email, expiresAt: invite.expiresAt }
}

/** The address an open invite was sent to (the sign-in limit of that address covers accepting it). */
export async function invitedEmail(token: string): Promise<string> {
  return (await openInvite(token)).email
}

export async function acceptInvite(token: string, input: { name?: string; password: string }) {
  const sequelize = await useDb()
  const invite = await openInvite(token)
  // Asked of everyone, account or not, so the answer does not tell which.
  if (!input.name) throw new DomainError('invalid', 'Your name: write your name (an existing account keeps the name it has).', { field: 'name' })
  // The password is checked or hashed before the transaction: a scrypt run takes about half a
  // second, and a transaction holds the one write queue every live shoot shares.
  const existing = await User.findOne({ where: { email: invite.email } })
  let passwordHash = ''
  if (existing) {
    if (!(await verifyPassword(existing.passwordHash, input.password))) {
      throw new DomainError('signed-out', `Password: this password was not accepted for ${invite.email}. If the address already has a Hobline account, enter that account's password, or reset it from the sign-in page.`, { field: 'password' })
    }
    await rehashIfOld(existing, input.password)
  } else {
    passwordHash = await newPasswordHash(input.password, invite.email)
  }
  return sequelize.transaction(async (transaction) => {
    const open = await openInvite(token)
    const user = existing ?? await createUser({ name: input.name!, email: open.email, passwordHash }, transaction)
    const already = await Membership.findOne({ where: { userId: user.id, studioId: open.studioId }, transaction })
    if (!already) await Membership.create({ userId: user.id, studioId: open.studioId, role: open.role }, { transaction })
    open.acceptedAt = new Date()
    await open.save({ transaction })
    return { user, studioId: open.studioId }
  })
}
