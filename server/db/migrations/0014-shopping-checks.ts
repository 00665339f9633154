import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The shopping list's check-offs, shared by the crew: one row per episode and list line (the line's
// key, shared/utils/shopping-list.ts `lineKey`), ticked or not, by whom and when. An untick keeps the
// row (ticked 0), so the latest change's time is the list's version for devices that poll.
const migration: Migration = {
  name: '0014-shopping-checks',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('shopping_checks', {
      episode_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'episodes', key: 'id' }, onDelete: 'CASCADE' },
      line_key: { type: DataTypes.STRING(80), allowNull: false, primaryKey: true },
      ticked: { type: DataTypes.BOOLEAN, allowNull: false },
      ticked_by: { type: DataTypes.INTEGER, allowNull: true },
      ticked_by_name: { type: DataTypes.STRING(120), allowNull: true },
      at: { type: DataTypes.BIGINT, allowNull: false },
    }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('shopping_checks', { transaction })
  },
}

export default migration
