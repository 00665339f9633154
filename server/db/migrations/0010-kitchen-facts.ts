import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// Kitchen facts (issue 14):
// - studios.fluid_measure: what a bare "pint", "quart", "gallon" or "fl oz" means, 'us' or 'imperial';
//   null follows the studio's locale (en-GB: imperial).
// - recipe_ingredients.allergen_state: how sure the stored allergens are: 'suggested' (read from the
//   item's name, nobody has checked), 'checked' (a person checked the labels: allergens_checked_by,
//   allergens_checked_at), or 'none-declared' (no allergen information has been given). Rows saved
//   before this were names-based guesses that the screens showed as confirmed: they become 'suggested'.
const migration: Migration = {
  name: '0010-kitchen-facts',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('studios', 'fluid_measure', { type: DataTypes.STRING(8), allowNull: true }, { transaction })
    await q.addColumn('recipe_ingredients', 'allergen_state', { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'suggested' }, { transaction })
    await q.addColumn('recipe_ingredients', 'allergens_checked_by', { type: DataTypes.STRING(120), allowNull: true }, { transaction })
    await q.addColumn('recipe_ingredients', 'allergens_checked_at', { type: DataTypes.DATE, allowNull: true }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    for (const column of ['allergens_checked_at', 'allergens_checked_by', 'allergen_state']) {
      await q.sequelize.query(`ALTER TABLE recipe_ingredients DROP COLUMN ${column}`, { transaction })
    }
    await q.sequelize.query('ALTER TABLE studios DROP COLUMN fluid_measure', { transaction })
  },
}

export default migration
