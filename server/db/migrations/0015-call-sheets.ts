import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The call sheet of an episode's shoot day: the call time (local time of day in the studio's zone),
// the place, the nearest hospital (left empty for the producer to fill in) and crew members called at
// another time; and the log of every sheet sent to the crew: who sent it, when, to whom, and a
// snapshot of what it said (with its SHA-256), which the next send is compared against.
const migration: Migration = {
  name: '0015-call-sheets',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('call_sheets', {
      episode_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'episodes', key: 'id' }, onDelete: 'CASCADE' },
      call_time: { type: DataTypes.STRING(5), allowNull: true },
      place: { type: DataTypes.TEXT, allowNull: true },
      hospital: { type: DataTypes.TEXT, allowNull: true },
      crew_calls: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.createTable('call_sheet_sends', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      episode_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'episodes', key: 'id' }, onDelete: 'CASCADE' },
      sent_by: { type: DataTypes.INTEGER, allowNull: true },
      sent_by_name: { type: DataTypes.STRING(120), allowNull: false },
      sent_at: { type: DataTypes.DATE, allowNull: false },
      recipients: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      changes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      snapshot: { type: DataTypes.TEXT, allowNull: false },
      hash: { type: DataTypes.STRING(64), allowNull: false },
    }, { transaction })
    await q.addIndex('call_sheet_sends', ['episode_id', 'sent_at'], { name: 'call_sheet_sends_episode_id_sent_at', transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('call_sheet_sends', { transaction })
    await q.dropTable('call_sheets', { transaction })
  },
}

export default migration
