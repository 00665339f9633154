import { DataTypes } from 'sequelize'
import type { Migration } from './index'

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
}

const migration: Migration = {
  name: '0002-accounts',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('users', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(80), allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      password_hash: { type: DataTypes.STRING(255), allowNull: false },
      ...timestamps,
    }, { transaction })
    await q.createTable('memberships', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      studio_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      role: { type: DataTypes.STRING(16), allowNull: false },
      ...timestamps,
    }, { transaction })
    await q.addIndex('memberships', ['user_id', 'studio_id'], { unique: true, transaction })
    await q.addIndex('memberships', ['studio_id'], { transaction })
    await q.createTable('invites', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      studio_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      invited_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      accepted_at: { type: DataTypes.DATE, allowNull: true },
      revoked_at: { type: DataTypes.DATE, allowNull: true },
      sent_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_sent_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction })
    await q.addIndex('invites', ['studio_id', 'email'], { transaction })
    await q.createTable('password_resets', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      used_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    for (const table of ['password_resets', 'invites', 'memberships', 'users']) await q.dropTable(table, { transaction })
  },
}

export default migration
