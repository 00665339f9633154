import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { CallSheetSnapshot } from '../../../shared/utils/call-sheet'
import { json } from './recipe'

/** What the producer writes on an episode's call sheet (one row per episode, made at the first save). */
export class CallSheet extends Model<InferAttributes<CallSheet>, InferCreationAttributes<CallSheet>> {
  declare episodeId: number
  /** "08:30", local time of day in the studio's time zone. */
  declare callTime: string | null
  declare place: string | null
  declare hospital: string | null
  declare crewCalls: CreationOptional<{ userId: number; callTime: string }[]>
  declare version: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

/** One sending of the call sheet to the crew. */
export class CallSheetSend extends Model<InferAttributes<CallSheetSend>, InferCreationAttributes<CallSheetSend>> {
  declare id: CreationOptional<number>
  declare episodeId: number
  declare sentBy: number | null
  declare sentByName: string
  declare sentAt: Date
  declare recipients: { name: string; email: string }[]
  /** The change lines said at the top of the mail ([] for the first send). */
  declare changes: string[]
  declare snapshot: CallSheetSnapshot
  /** SHA-256 (hex) of the snapshot's JSON. */
  declare hash: string
}

export function initCallSheetModels(sequelize: Sequelize) {
  CallSheet.init({
    episodeId: { type: DataTypes.INTEGER, primaryKey: true },
    callTime: DataTypes.STRING(5), place: DataTypes.TEXT, hospital: DataTypes.TEXT, crewCalls: json('crewCalls', []),
    version: { type: DataTypes.INTEGER, defaultValue: 1 }, createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE,
  }, { sequelize, tableName: 'call_sheets', underscored: true })
  CallSheetSend.init({
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    episodeId: DataTypes.INTEGER, sentBy: DataTypes.INTEGER, sentByName: DataTypes.STRING(120), sentAt: DataTypes.DATE,
    recipients: json('recipients', []), changes: json('changes', []), snapshot: json('snapshot', null), hash: DataTypes.STRING(64),
  }, { sequelize, tableName: 'call_sheet_sends', underscored: true, timestamps: false })
}
