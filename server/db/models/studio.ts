import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

export class Studio extends Model<InferAttributes<Studio>, InferCreationAttributes<Studio>> {
  declare id: CreationOptional<number>
  declare name: string
  declare slug: string
  declare locale: CreationOptional<string>
  declare currency: CreationOptional<string>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initStudio(sequelize: Sequelize) {
  Studio.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      locale: { type: DataTypes.STRING(35), allowNull: false, defaultValue: 'en-GB' },
      currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'GBP' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'studios', underscored: true },
  )
}
