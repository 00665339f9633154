import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// What an import read from a recipe's own words: an ingredient's equivalent stated beside its
// unit ("½ cup (100 g)": JSON { min, max, unit }, null for none), and which of a step's fields were
// read from its text (JSON list of "duration", "handsOn", "station"; empty once a person confirmed
// or changed them).
const migration: Migration = {
  name: '0011-read-from-text',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('recipe_ingredients', 'stated', { type: DataTypes.TEXT, allowNull: true }, { transaction })
    await q.addColumn('recipe_steps', 'read_from_text', { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.sequelize.query('ALTER TABLE recipe_steps DROP COLUMN read_from_text', { transaction })
    await q.sequelize.query('ALTER TABLE recipe_ingredients DROP COLUMN stated', { transaction })
  },
}

export default migration
