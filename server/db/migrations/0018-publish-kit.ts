import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The publish kit: a recipe's public page (opt-in, one per recipe, at its own address: a random
// unguessable one or one the producer chose), the episode whose video it shows; and on the episode,
// the recording chosen for the chapters and where the finished video lives.
const migration: Migration = {
  name: '0018-publish-kit',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('recipe_pages', {
      recipe_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
      slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      episode_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'episodes', key: 'id' }, onDelete: 'SET NULL' },
      published_by_name: { type: DataTypes.STRING(120), allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    await q.addColumn('episodes', 'publish_shoot_id', {
      type: DataTypes.INTEGER, allowNull: true, references: { model: 'shoots', key: 'id' }, onDelete: 'SET NULL',
    }, { transaction })
    await q.addColumn('episodes', 'video_url', { type: DataTypes.STRING(500), allowNull: true }, { transaction })
  },
  async down({ queryInterface: q, transaction }) {
    for (const column of ['video_url', 'publish_shoot_id']) await q.sequelize.query(`ALTER TABLE episodes DROP COLUMN ${column}`, { transaction })
    await q.dropTable('recipe_pages', { transaction })
  },
}

export default migration
