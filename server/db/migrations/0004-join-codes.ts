import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The shoot table starts here with what a join code needs; the live shoot engine adds its state.
const migration: Migration = {
  name: '0004-join-codes',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('shoots', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      studio_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      title: { type: DataTypes.STRING(160), allowNull: false },
      mode: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'rehearsal' },
      status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'ready' },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.createTable('join_codes', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      shoot_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'shoots', key: 'id' }, onDelete: 'CASCADE' },
      studio_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      role: { type: DataTypes.STRING(16), allowNull: false },
      code: { type: DataTypes.STRING(12), allowNull: false },
      created_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      revoked_at: { type: DataTypes.DATE, allowNull: true },
      used_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.addIndex('join_codes', ['code'], { transaction })
    await q.addIndex('join_codes', ['shoot_id'], { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('join_codes', { transaction })
    await q.dropTable('shoots', { transaction })
  },
}

export default migration
