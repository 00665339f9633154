import { DataTypes } from 'sequelize'
import type { Migration } from './index'

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
}
const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const studioRef = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' }

// Recipes with their ingredients and steps in order, the studio's price list, and the studio
// settings costing needs. List-like fields (tags, script lines, cautions, allergen groups, the
// steps a step waits for) are JSON text: they are read and written whole, never queried inside.
const migration: Migration = {
  name: '0005-recipes',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('studios', 'budget_per_serving_minor', { type: DataTypes.INTEGER, allowNull: true }, { transaction })
    await q.addColumn('studios', 'cup_unit', { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'cup' }, { transaction })
    await q.addColumn('studios', 'unit_system', { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'metric' }, { transaction })

    await q.createTable('prices', {
      id,
      studio_id: studioRef,
      item: { type: DataTypes.STRING(120), allowNull: false },
      package_size: { type: DataTypes.FLOAT, allowNull: false },
      package_unit: { type: DataTypes.STRING(16), allowNull: false },
      price_minor: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      shop: { type: DataTypes.STRING(120), allowNull: true },
      bought_on: { type: DataTypes.DATEONLY, allowNull: true },
      ...stamps,
    }, { transaction })
    await q.addIndex('prices', ['studio_id', 'item'], { transaction })

    await q.createTable('recipes', {
      id,
      studio_id: studioRef,
      title: { type: DataTypes.STRING(160), allowNull: false },
      summary: { type: DataTypes.TEXT, allowNull: true },
      servings: { type: DataTypes.FLOAT, allowNull: false },
      yield_text: { type: DataTypes.STRING(120), allowNull: true },
      tags: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      notes: { type: DataTypes.TEXT, allowNull: true },
      times: { type: DataTypes.TEXT, allowNull: false, defaultValue: '{"prep":null,"cook":null,"total":null}' },
      photo: { type: DataTypes.STRING(200), allowNull: true },
      // Optimistic locking: every save must name the version it started from.
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      ...stamps,
    }, { transaction })
    await q.addIndex('recipes', ['studio_id'], { transaction })

    await q.createTable('recipe_ingredients', {
      id,
      recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
      position: { type: DataTypes.INTEGER, allowNull: false },
      key: { type: DataTypes.STRING(40), allowNull: false },
      min: { type: DataTypes.FLOAT, allowNull: true },
      max: { type: DataTypes.FLOAT, allowNull: true },
      unit: { type: DataTypes.STRING(16), allowNull: true },
      item: { type: DataTypes.STRING(200), allowNull: false },
      prep: { type: DataTypes.STRING(200), allowNull: true },
      optional: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      to_taste: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      group: { type: DataTypes.STRING(120), allowNull: true },
      allergens: { type: DataTypes.TEXT, allowNull: false, defaultValue: '{"eu":[],"us":[]}' },
      price_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'prices', key: 'id' }, onDelete: 'SET NULL' },
      ...stamps,
    }, { transaction })
    await q.addIndex('recipe_ingredients', ['recipe_id', 'position'], { transaction })

    await q.createTable('recipe_steps', {
      id,
      recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
      position: { type: DataTypes.INTEGER, allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      script: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      hands_on: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      duration_min: { type: DataTypes.INTEGER, allowNull: true },
      duration_max: { type: DataTypes.INTEGER, allowNull: true },
      station: { type: DataTypes.STRING(12), allowNull: true },
      after: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      camera_shot: { type: DataTypes.STRING(200), allowNull: true },
      camera_note: { type: DataTypes.STRING(500), allowNull: true },
      cautions: { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' },
      group: { type: DataTypes.STRING(120), allowNull: true },
      photo: { type: DataTypes.STRING(200), allowNull: true },
      ...stamps,
    }, { transaction })
    await q.addIndex('recipe_steps', ['recipe_id', 'position'], { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    for (const table of ['recipe_steps', 'recipe_ingredients', 'recipes', 'prices']) await q.dropTable(table, { transaction })
    // SQLite's own DROP COLUMN (3.35+): Sequelize's removeColumn would rebuild the table and, with
    // foreign keys on, cascade-delete everything that points at a studio.
    for (const column of ['unit_system', 'cup_unit', 'budget_per_serving_minor']) await q.sequelize.query(`ALTER TABLE studios DROP COLUMN ${column}`, { transaction })
  },
}

export default migration
