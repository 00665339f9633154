// Device join codes: a short code for one shoot and one role, shown as text and as a QR code.
import type { H3Event } from 'h3'
import QRCode from 'qrcode'
import { Op } from 'sequelize'
import { JoinCode } from '../db/models'
import type { DeviceRole } from '../../shared/utils/roles'
import { DomainError } from '../../shared/utils/domain-error'

export const JOIN_CODE_MINUTES = 30
/** How long a device stays joined after it used a code (a long shoot day). */
export const DEVICE_SESSION_MS = 14 * 60 * 60 * 1000

export function displayJoinCode(code: string) {
  return `${code.slice(0, 3)}-${code.slice(3)}`
}

/** `site` is the address devices reach the app at (siteUrl). */
async function codeView(site: string, code: JoinCode) {
  const joinUrl = `${site}/join?code=${code.code}`
  return {
    id: code.id,
    shootId: code.shootId,
    role: code.role,
    code: displayJoinCode(code.code),
    expiresAt: code.expiresAt,
    usedCount: code.usedCount,
    joinUrl,
    qrSvg: await QRCode.toString(joinUrl, { type: 'svg', margin: 1, errorCorrectionLevel: 'M' }),
  }
}

export async function createJoinCode(site: string, shootId: number, role: DeviceRole, createdBy: number, minutes = JOIN_CODE_MINUTES) {
  await useDb()
  const studioId = await useShoot().store.studioOf(shootId)
  if (studioId === null) throw new DomainError('not-found', 'There is no such shoot.')
  // A fresh code must not equal one still usable.
  for (let attempt = 0; attempt < 8; attempt++) {
    const code = newJoinCode()
    const clash = await JoinCode.findOne({ where: { code, revokedAt: null, expiresAt: { [Op.gt]: new Date() } } })
    if (clash) continue
    const row = await JoinCode.create({ shootId, studioId, role, code, createdBy, expiresAt: new Date(Date.now() + minutes * 60_000) })
    return codeView(site, row)
  }
  throw new DomainError('unavailable', 'Could not make a unique join code; try again.')
}

export async function listJoinCodes(site: string, shootId: number) {
  await useDb()
  const rows = await JoinCode.findAll({ where: { shootId, revokedAt: null, expiresAt: { [Op.gt]: new Date() } }, order: [['id', 'DESC']] })
  return Promise.all(rows.map((r) => codeView(site, r)))
}

export async function revokeJoinCode(shootId: number, codeId: number) {
  await useDb()
  const row = await JoinCode.findOne({ where: { id: codeId, shootId } })
  if (!row) throw new DomainError('not-found', 'There is no such join code for this shoot.')
  if (!row.revokedAt) {
    row.revokedAt = new Date()
    await row.save()
  }
}

/** Trades a typed code for a device session on its shoot; the caller counts failed attempts. */
export async function redeemJoinCode(event: H3Event, input: string) {
  await useDb()
  const code = normaliseJoinCode(input)
  const row = code.length === JOIN_CODE_LENGTH
    ? await JoinCode.findOne({ where: { code, revokedAt: null, expiresAt: { [Op.gt]: new Date() } } })
    : null
  if (!row) return null
  row.usedCount += 1
  await row.save()
  const device = { codeId: row.id, shootId: row.shootId, studioId: row.studioId, role: row.role, until: Date.now() + DEVICE_SESSION_MS }
  await startFreshSession(event, { device, loggedInAt: Date.now() })
  return device
}
