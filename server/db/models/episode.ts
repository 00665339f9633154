import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { ScriptPiece } from '../../../shared/utils/show-segments'
import { json } from './recipe'

export class Episode extends Model<InferAttributes<Episode>, InferCreationAttributes<Episode>> {
  declare id: CreationOptional<number>
  declare studioId: number
  declare title: string
  declare version: CreationOptional<number>
  /** The day of the shoot, YYYY-MM-DD in the studio's time zone; null until chosen. */
  declare shootDate: CreationOptional<string | null>
  /** Servings the recipes scale to on set; null: each recipe as written. */
  declare servings: CreationOptional<number | null>
  /** 'metric' or 'us'; null: the studio's units. */
  declare unitSystem: CreationOptional<string | null>
  /** The episode's budget per serving in minor units; null: the studio's. */
  declare budgetPerServingMinor: CreationOptional<number | null>
  declare targetSeconds: CreationOptional<number | null>
  /** The presenter (a user id), whose reading pace times the scripts. */
  declare hostId: CreationOptional<number | null>
  /** The recording whose take log gives the published chapters; null until chosen. */
  declare publishShootId: CreationOptional<number | null>
  /** Where the finished video lives (its public address); null until known. */
  declare videoUrl: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class EpisodeSegment extends Model<InferAttributes<EpisodeSegment>, InferCreationAttributes<EpisodeSegment>> {
  declare id: CreationOptional<number>
  declare episodeId: number
  /** The id the editor knows the segment by (and the shoot's run order, as `segment-<key>`). */
  declare segKey: string
  declare position: number
  declare kind: CreationOptional<string>
  declare recipeId: number | null
  declare title: string | null
  declare script: CreationOptional<ScriptPiece[]>
  /** A recipe segment's closing lines, read at its last step. */
  declare closing: CreationOptional<ScriptPiece[]>
  /** What the camera frames (segments without steps); null for the kind's usual shot. */
  declare shot: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initEpisodeModels(sequelize: Sequelize) {
  const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
  Episode.init({
    id, studioId: DataTypes.INTEGER, title: DataTypes.STRING(160), version: { type: DataTypes.INTEGER, defaultValue: 1 },
    shootDate: DataTypes.STRING(10), servings: DataTypes.INTEGER, unitSystem: DataTypes.STRING(8), budgetPerServingMinor: DataTypes.INTEGER,
    targetSeconds: DataTypes.INTEGER, hostId: DataTypes.INTEGER,
    publishShootId: DataTypes.INTEGER, videoUrl: DataTypes.STRING(500), createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE,
  }, { sequelize, tableName: 'episodes', underscored: true })
  EpisodeSegment.init(
    {
      id, episodeId: DataTypes.INTEGER, segKey: DataTypes.STRING(40), position: DataTypes.INTEGER, kind: { type: DataTypes.STRING(16), defaultValue: 'recipe' },
      recipeId: DataTypes.INTEGER, title: DataTypes.STRING(160), script: json('script', []), closing: json('closing', []), shot: DataTypes.STRING(200),
      createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'episode_segments', underscored: true },
  )
  Episode.hasMany(EpisodeSegment, { foreignKey: 'episodeId', as: 'segments' })
}
