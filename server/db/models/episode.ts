import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

export class Episode extends Model<InferAttributes<Episode>, InferCreationAttributes<Episode>> {
  declare id: CreationOptional<number>
  declare studioId: number
  declare title: string
  declare version: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class EpisodeSegment extends Model<InferAttributes<EpisodeSegment>, InferCreationAttributes<EpisodeSegment>> {
  declare id: CreationOptional<number>
  declare episodeId: number
  declare position: number
  declare kind: CreationOptional<string>
  declare recipeId: number | null
  declare title: string | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initEpisodeModels(sequelize: Sequelize) {
  const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
  Episode.init({ id, studioId: DataTypes.INTEGER, title: DataTypes.STRING(160), version: { type: DataTypes.INTEGER, defaultValue: 1 }, createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE }, { sequelize, tableName: 'episodes', underscored: true })
  EpisodeSegment.init(
    { id, episodeId: DataTypes.INTEGER, position: DataTypes.INTEGER, kind: { type: DataTypes.STRING(16), defaultValue: 'recipe' }, recipeId: DataTypes.INTEGER, title: DataTypes.STRING(160), createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE },
    { sequelize, tableName: 'episode_segments', underscored: true },
  )
  Episode.hasMany(EpisodeSegment, { foreignKey: 'episodeId', as: 'segments' })
}
