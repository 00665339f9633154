import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** One mail as the local SMTP catcher received it (the outbox). */
export class Mail extends Model<InferAttributes<Mail>, InferCreationAttributes<Mail>> {
  declare id: CreationOptional<number>
  /** The studio the mail was sent for (header X-Hobline-Studio); null when none or unknown. */
  declare studioId: number | null
  /** What the mail is, as the sender named it: 'invite', 'password-reset', … */
  declare kind: string
  declare messageId: string | null
  declare from: string
  declare to: string
  declare subject: string
  declare html: string | null
  declare text: string | null
  declare receivedAt: Date
}

export function initMailModel(sequelize: Sequelize) {
  Mail.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      studioId: { type: DataTypes.INTEGER, allowNull: true },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      messageId: { type: DataTypes.STRING(998), allowNull: true },
      from: { type: DataTypes.TEXT, allowNull: false },
      to: { type: DataTypes.TEXT, allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: true },
      text: { type: DataTypes.TEXT, allowNull: true },
      receivedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, tableName: 'mails', underscored: true, timestamps: false },
  )
}
