import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// Episodes as a run order of segments (a recipe segment for now; intro, sponsor read and the
// rest come with the episode builder), the kitchen profile the cook plan runs against, and step
// links richer than "after": start-with (with a lag) and finish-together (with a lead).
const migration: Migration = {
  name: '0006-episodes',
  async up({ queryInterface: q, transaction }) {
    await q.addColumn('studios', 'kitchen', { type: DataTypes.TEXT, allowNull: false, defaultValue: '{"hands":1,"burners":4,"ovens":1,"racksPerOven":1,"parallelRecipes":true}' }, { transaction })
    await q.addColumn('recipe_steps', 'links', { type: DataTypes.TEXT, allowNull: false, defaultValue: '[]' }, { transaction })
    await q.createTable('episodes', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      studio_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      title: { type: DataTypes.STRING(160), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.addIndex('episodes', ['studio_id'], { transaction })
    await q.createTable('episode_segments', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      episode_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'episodes', key: 'id' }, onDelete: 'CASCADE' },
      position: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'recipe' },
      recipe_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
      title: { type: DataTypes.STRING(160), allowNull: true },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.addIndex('episode_segments', ['episode_id', 'position'], { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('episode_segments', { transaction })
    await q.dropTable('episodes', { transaction })
    await q.sequelize.query('ALTER TABLE recipe_steps DROP COLUMN links', { transaction })
    await q.sequelize.query('ALTER TABLE studios DROP COLUMN kitchen', { transaction })
  },
}

export default migration
