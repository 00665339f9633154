import { DataTypes } from 'sequelize'
import type { Migration } from './index'

const migration: Migration = {
  name: '0001-studios',
  async up({ queryInterface, transaction }) {
    await queryInterface.createTable(
      'studios',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
        // BCP 47 locale and ISO 4217 currency: number, date and money formats for the studio.
        locale: { type: DataTypes.STRING(35), allowNull: false, defaultValue: 'en-GB' },
        currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'GBP' },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    )
  },
  async down({ queryInterface, transaction }) {
    await queryInterface.dropTable('studios', { transaction })
  },
}

export default migration
