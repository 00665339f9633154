import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// A step's short name ("Pasta water", "Dough rest"), for its timer and its cues instead of the
// whole step text cut off. Null when the step has none.
const migration: Migration = {
  name: '0008-step-names',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('recipe_steps', 'name', { type: DataTypes.STRING(40), allowNull: true }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.sequelize.query('ALTER TABLE recipe_steps DROP COLUMN name', { transaction })
  },
}

export default migration
