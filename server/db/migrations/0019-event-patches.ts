import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// Each shoot event keeps the change it made as a JSON Patch (RFC 6902): a shoot's row takes its
// whole state only every so many commands (server/shoot/store.ts), and the state in between is the
// row's with the later events' patches applied. Events logged before this migration have none; the
// rows were written with every one of them, so nothing needs them.
const migration: Migration = {
  name: '0019-event-patches',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('shoot_events', 'patch', { type: DataTypes.TEXT, allowNull: true }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.sequelize.query('ALTER TABLE shoot_events DROP COLUMN patch', { transaction })
  },
}

export default migration
