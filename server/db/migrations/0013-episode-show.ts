import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The episode as a show: each segment keeps the id the editor gave it (old segments take their row
// id, so the shoots already made keep naming them `segment-<id>`), a script and, for a recipe
// segment, the closing lines, and what the camera frames; the episode gains its shoot date, servings, unit system, budget per
// serving, target length and presenter; every crew member gains a reading pace (words a minute).
const migration: Migration = {
  name: '0013-episode-show',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('episode_segments', 'seg_key', { type: DataTypes.STRING(40), allowNull: true }, { transaction })
    await q.sequelize.query('UPDATE episode_segments SET seg_key = CAST(id AS TEXT)', { transaction })
    await q.addColumn('episode_segments', 'script', { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' }, { transaction })
    await q.addColumn('episode_segments', 'closing', { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' }, { transaction })
    await q.addColumn('episode_segments', 'shot', { type: DataTypes.STRING(200), allowNull: true }, { transaction })
    await q.addColumn('episodes', 'shoot_date', { type: DataTypes.STRING(10), allowNull: true }, { transaction })
    await q.addColumn('episodes', 'servings', { type: DataTypes.INTEGER, allowNull: true }, { transaction })
    await q.addColumn('episodes', 'unit_system', { type: DataTypes.STRING(8), allowNull: true }, { transaction })
    await q.addColumn('episodes', 'budget_per_serving_minor', { type: DataTypes.INTEGER, allowNull: true }, { transaction })
    await q.addColumn('episodes', 'target_seconds', { type: DataTypes.INTEGER, allowNull: true }, { transaction })
    await q.addColumn('episodes', 'host_id', { type: DataTypes.INTEGER, allowNull: true }, { transaction })
    await q.addColumn('memberships', 'reading_wpm', { type: DataTypes.INTEGER, allowNull: true }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    for (const [table, column] of [
      ['memberships', 'reading_wpm'], ['episodes', 'host_id'], ['episodes', 'target_seconds'], ['episodes', 'budget_per_serving_minor'],
      ['episodes', 'unit_system'], ['episodes', 'servings'], ['episodes', 'shoot_date'],
      ['episode_segments', 'shot'], ['episode_segments', 'closing'], ['episode_segments', 'script'], ['episode_segments', 'seg_key'],
    ]) await q.sequelize.query(`ALTER TABLE ${table} DROP COLUMN ${column}`, { transaction })
  },
}

export default migration
