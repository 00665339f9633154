import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { DeviceRole } from '../../../shared/utils/roles'

export class Shoot extends Model<InferAttributes<Shoot>, InferCreationAttributes<Shoot>> {
  declare id: CreationOptional<number>
  declare studioId: number
  declare title: string
  declare mode: CreationOptional<'rehearsal' | 'take'>
  declare status: CreationOptional<string>
  declare episodeId: CreationOptional<number | null>
  /** The reducer's ShootState as JSON; null for a shoot row made before the engine (tests). */
  declare state: CreationOptional<string | null>
  declare seq: CreationOptional<number>
  declare createdBy: CreationOptional<number | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class JoinCode extends Model<InferAttributes<JoinCode>, InferCreationAttributes<JoinCode>> {
  declare id: CreationOptional<number>
  declare shootId: number
  declare studioId: number
  declare role: DeviceRole
  declare code: string
  declare createdBy: number | null
  declare expiresAt: Date
  declare revokedAt: CreationOptional<Date | null>
  declare usedCount: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE }

export function initShootModels(sequelize: Sequelize) {
  Shoot.init(
    {
      id, studioId: DataTypes.INTEGER, title: DataTypes.STRING(160), mode: { type: DataTypes.STRING(16), defaultValue: 'rehearsal' }, status: { type: DataTypes.STRING(16), defaultValue: 'ready' },
      episodeId: DataTypes.INTEGER, state: DataTypes.TEXT, seq: { type: DataTypes.INTEGER, defaultValue: 0 }, createdBy: DataTypes.INTEGER, ...stamps,
    },
    { sequelize, tableName: 'shoots', underscored: true },
  )
  JoinCode.init(
    {
      id, shootId: DataTypes.INTEGER, studioId: DataTypes.INTEGER, role: DataTypes.STRING(16), code: DataTypes.STRING(12),
      createdBy: DataTypes.INTEGER, expiresAt: DataTypes.DATE, revokedAt: DataTypes.DATE, usedCount: { type: DataTypes.INTEGER, defaultValue: 0 }, ...stamps,
    },
    { sequelize, tableName: 'join_codes', underscored: true },
  )
}

export class ShootEvent extends Model<InferAttributes<ShootEvent>, InferCreationAttributes<ShootEvent>> {
  declare id: CreationOptional<number>
  declare shootId: number
  declare seq: number
  declare type: string
  declare command: string
  declare actor: string
  declare serverMs: number
  declare createdAt: CreationOptional<Date>
}

export function initShootEventModel(sequelize: Sequelize) {
  ShootEvent.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }, shootId: DataTypes.INTEGER, seq: DataTypes.INTEGER,
      type: DataTypes.STRING(32), command: DataTypes.TEXT, actor: DataTypes.TEXT, serverMs: DataTypes.BIGINT, createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'shoot_events', underscored: true, updatedAt: false },
  )
}
