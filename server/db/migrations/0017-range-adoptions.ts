import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// "Adopt the actuals" of a rehearsal report: the steps' planned ranges before and after, so the
// producer can undo it. `changes` is JSON [{ recipeId, stepId, before: { min, max }, after: { min, max } }]
// (seconds, as recipe_steps stores them); `versions` is JSON { recipeId: the version the adoption
// saved }, so an undo restores only recipes nobody has saved since.
const migration: Migration = {
  name: '0017-range-adoptions',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('range_adoptions', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      studio_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      shoot_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'shoots', key: 'id' }, onDelete: 'CASCADE' },
      changes: { type: DataTypes.TEXT, allowNull: false },
      versions: { type: DataTypes.TEXT, allowNull: false },
      by_user: { type: DataTypes.INTEGER, allowNull: true },
      by_name: { type: DataTypes.STRING(120), allowNull: true },
      at: { type: DataTypes.BIGINT, allowNull: false },
      undone_at: { type: DataTypes.BIGINT, allowNull: true },
    }, { transaction })
    await q.addIndex('range_adoptions', ['shoot_id'], { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('range_adoptions', { transaction })
  },
}

export default migration
