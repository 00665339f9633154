import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// A number on each account that every session carries from its sign-in. Raising it ends every
// session of the account at its next request: sign out everywhere, a password reset, removal from
// a studio.
const migration: Migration = {
  name: '0009-session-version',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('users', 'session_version', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.sequelize.query('ALTER TABLE users DROP COLUMN session_version', { transaction })
  },
}

export default migration
