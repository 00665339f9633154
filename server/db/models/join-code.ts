// Join codes: a device's way onto one shoot. The shoots and their event log are not Sequelize
// models: server/shoot/store.ts is the one way into those tables.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { DeviceRole } from '../../../shared/utils/roles'

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

export function initJoinCodeModel(sequelize: Sequelize) {
  JoinCode.init(
    {
      id, shootId: DataTypes.INTEGER, studioId: DataTypes.INTEGER, role: DataTypes.STRING(16), code: DataTypes.STRING(12),
      createdBy: DataTypes.INTEGER, expiresAt: DataTypes.DATE, revokedAt: DataTypes.DATE, usedCount: { type: DataTypes.INTEGER, defaultValue: 0 }, ...stamps,
    },
    { sequelize, tableName: 'join_codes', underscored: true },
  )
}
