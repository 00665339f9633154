import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { StudioRole } from '../../../shared/utils/roles'

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>
  declare name: string
  declare email: string
  declare passwordHash: string
  /** Goes up to end every session of the account at once (sign out everywhere, password reset, removal). */
  declare sessionVersion: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<number>
  declare userId: ForeignKey<number>
  declare studioId: ForeignKey<number>
  declare role: StudioRole
  /** The member's reading pace on camera in words a minute; null for the default (shared/utils/show-runtime.ts). */
  declare readingWpm: CreationOptional<number | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Invite extends Model<InferAttributes<Invite>, InferCreationAttributes<Invite>> {
  declare id: CreationOptional<number>
  declare studioId: number
  declare email: string
  declare role: StudioRole
  declare tokenHash: string
  declare invitedBy: number | null
  declare expiresAt: Date
  declare acceptedAt: CreationOptional<Date | null>
  declare revokedAt: CreationOptional<Date | null>
  declare sentCount: CreationOptional<number>
  declare lastSentAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  declare id: CreationOptional<number>
  declare userId: number
  declare tokenHash: string
  declare expiresAt: Date
  declare usedAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE }

export function initAccountModels(sequelize: Sequelize) {
  User.init({ id, name: DataTypes.STRING(80), email: DataTypes.STRING(254), passwordHash: DataTypes.STRING(255), sessionVersion: { type: DataTypes.INTEGER, defaultValue: 0 }, ...stamps }, { sequelize, tableName: 'users', underscored: true })
  Membership.init({ id, role: DataTypes.STRING(16), readingWpm: DataTypes.INTEGER, ...stamps }, { sequelize, tableName: 'memberships', underscored: true })
  Invite.init(
    {
      id, studioId: DataTypes.INTEGER, email: DataTypes.STRING(254), role: DataTypes.STRING(16), tokenHash: DataTypes.STRING(64),
      invitedBy: DataTypes.INTEGER, expiresAt: DataTypes.DATE, acceptedAt: DataTypes.DATE, revokedAt: DataTypes.DATE,
      sentCount: { type: DataTypes.INTEGER, defaultValue: 0 }, lastSentAt: DataTypes.DATE, ...stamps,
    },
    { sequelize, tableName: 'invites', underscored: true },
  )
  PasswordReset.init(
    { id, userId: DataTypes.INTEGER, tokenHash: DataTypes.STRING(64), expiresAt: DataTypes.DATE, usedAt: DataTypes.DATE, ...stamps },
    { sequelize, tableName: 'password_resets', underscored: true },
  )
}
