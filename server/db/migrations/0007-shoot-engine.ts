import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The live shoot: its whole state as the shared reducer keeps it (JSON, read and written whole in
// one transaction with each command), the episode it runs, and a log of every accepted command.
const migration: Migration = {
  name: '0007-shoot-engine',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('shoots', 'episode_id', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'episodes', key: 'id' }, onDelete: 'SET NULL' }, { transaction })
    await q.addColumn('shoots', 'state', { type: DataTypes.TEXT, allowNull: true }, { transaction })
    await q.addColumn('shoots', 'seq', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, { transaction })
    await q.addColumn('shoots', 'created_by', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' }, { transaction })
    await q.createTable('shoot_events', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      shoot_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'shoots', key: 'id' }, onDelete: 'CASCADE' },
      seq: { type: DataTypes.INTEGER, allowNull: false },
      type: { type: DataTypes.STRING(32), allowNull: false },
      command: { type: DataTypes.TEXT, allowNull: false },
      actor: { type: DataTypes.TEXT, allowNull: false },
      server_ms: { type: DataTypes.BIGINT, allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.addIndex('shoot_events', ['shoot_id', 'seq'], { unique: true, transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('shoot_events', { transaction })
    for (const column of ['created_by', 'seq', 'state', 'episode_id']) await q.sequelize.query(`ALTER TABLE shoots DROP COLUMN ${column}`, { transaction })
  },
}

export default migration
