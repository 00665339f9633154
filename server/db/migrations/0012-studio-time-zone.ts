import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The studio's time zone (IANA name), so invitations and other times it sends are written in its
// local time. Studios made before it keep UTC until their producer picks their zone.
const migration: Migration = {
  name: '0012-studio-time-zone',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('studios', 'time_zone', { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.sequelize.query('ALTER TABLE studios DROP COLUMN time_zone', { transaction })
  },
}

export default migration
