import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A recipe's public page: it exists only while the recipe is published. */
export class RecipePage extends Model<InferAttributes<RecipePage>, InferCreationAttributes<RecipePage>> {
  declare recipeId: number
  /** The page's address under /r/: random and unguessable, or chosen by the producer. */
  declare slug: string
  /** The episode whose video and chapters the page shows; null for none. */
  declare episodeId: number | null
  declare publishedByName: string
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initRecipePageModel(sequelize: Sequelize) {
  RecipePage.init({
    recipeId: { type: DataTypes.INTEGER, primaryKey: true }, slug: DataTypes.STRING(64), episodeId: DataTypes.INTEGER,
    publishedByName: DataTypes.STRING(120), createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE,
  }, { sequelize, tableName: 'recipe_pages', underscored: true })
}
