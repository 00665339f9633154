import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

// JSON text columns: parsed on read, serialised on write.
export const json = (name: string, fallback: unknown) => ({
  type: DataTypes.TEXT,
  get(this: Model) {
    const raw = this.getDataValue(name) as string | null
    return raw ? JSON.parse(raw) : fallback
  },
  set(this: Model, value: unknown) {
    this.setDataValue(name, JSON.stringify(value ?? fallback))
  },
})

export class Price extends Model<InferAttributes<Price>, InferCreationAttributes<Price>> {
  declare id: CreationOptional<number>
  declare studioId: number
  declare item: string
  declare packageSize: number
  declare packageUnit: string
  declare priceMinor: number
  declare currency: string
  declare shop: string | null
  declare boughtOn: string | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class Recipe extends Model<InferAttributes<Recipe>, InferCreationAttributes<Recipe>> {
  declare id: CreationOptional<number>
  declare studioId: number
  declare title: string
  declare summary: string | null
  declare servings: number
  declare yieldText: string | null
  declare tags: string[]
  declare notes: string | null
  declare times: { prep: number | null; cook: number | null; total: number | null }
  declare photo: CreationOptional<string | null>
  declare version: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class RecipeIngredient extends Model<InferAttributes<RecipeIngredient>, InferCreationAttributes<RecipeIngredient>> {
  declare id: CreationOptional<number>
  declare recipeId: number
  declare position: number
  declare key: string
  declare min: number | null
  declare max: number | null
  declare unit: string | null
  declare item: string
  declare prep: string | null
  declare optional: boolean
  declare toTaste: boolean
  declare group: string | null
  declare allergens: { eu: string[]; us: string[] }
  /** 'suggested', 'checked' or 'none-declared' (shared/utils/allergens.ts). */
  declare allergenState: CreationOptional<string>
  declare allergensCheckedBy: CreationOptional<string | null>
  declare allergensCheckedAt: CreationOptional<Date | null>
  declare priceId: number | null
  /** The equivalent stated beside the unit: { min, max, unit }, or null. */
  declare stated: CreationOptional<{ min: number; max: number; unit: string } | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export class RecipeStep extends Model<InferAttributes<RecipeStep>, InferCreationAttributes<RecipeStep>> {
  declare id: CreationOptional<number>
  declare recipeId: number
  declare position: number
  /** A short name for timers and cues ("Pasta water"), at most 40 characters; null for none. */
  declare name: string | null
  declare text: string
  declare script: string[]
  declare handsOn: boolean
  declare durationMin: number | null
  declare durationMax: number | null
  declare station: string | null
  declare after: number[]
  /** Links richer than "after": [{ step: position, kind: 'start-start' | 'finish-together', lag: seconds }]. */
  declare links: { step: number; kind: 'start-start' | 'finish-together'; lag: number }[]
  declare cameraShot: string | null
  declare cameraNote: string | null
  declare cautions: string[]
  declare group: string | null
  /** Fields read from the step text by an import and not yet confirmed: 'duration', 'handsOn', 'station'. */
  declare readFromText: CreationOptional<string[]>
  declare photo: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE }

export function initRecipeModels(sequelize: Sequelize) {
  Price.init(
    {
      id, studioId: DataTypes.INTEGER, item: DataTypes.STRING(120), packageSize: DataTypes.FLOAT, packageUnit: DataTypes.STRING(16),
      priceMinor: DataTypes.INTEGER, currency: DataTypes.STRING(3), shop: DataTypes.STRING(120), boughtOn: DataTypes.DATEONLY, ...stamps,
    },
    { sequelize, tableName: 'prices', underscored: true },
  )
  Recipe.init(
    {
      id, studioId: DataTypes.INTEGER, title: DataTypes.STRING(160), summary: DataTypes.TEXT, servings: DataTypes.FLOAT, yieldText: DataTypes.STRING(120),
      tags: json('tags', []), notes: DataTypes.TEXT, times: json('times', { prep: null, cook: null, total: null }), photo: DataTypes.STRING(200),
      version: { type: DataTypes.INTEGER, defaultValue: 1 }, ...stamps,
    },
    { sequelize, tableName: 'recipes', underscored: true },
  )
  RecipeIngredient.init(
    {
      id, recipeId: DataTypes.INTEGER, position: DataTypes.INTEGER, key: DataTypes.STRING(40),
      min: DataTypes.FLOAT, max: DataTypes.FLOAT, unit: DataTypes.STRING(16),
      item: DataTypes.STRING(200), prep: DataTypes.STRING(200), optional: DataTypes.BOOLEAN, toTaste: DataTypes.BOOLEAN, group: DataTypes.STRING(120),
      allergens: json('allergens', { eu: [], us: [] }), priceId: DataTypes.INTEGER, stated: json('stated', null),
      allergenState: { type: DataTypes.STRING(16), defaultValue: 'suggested' }, allergensCheckedBy: DataTypes.STRING(120), allergensCheckedAt: DataTypes.DATE,
      ...stamps,
    },
    { sequelize, tableName: 'recipe_ingredients', underscored: true },
  )
  RecipeStep.init(
    {
      id, recipeId: DataTypes.INTEGER, position: DataTypes.INTEGER, name: DataTypes.STRING(40), text: DataTypes.TEXT, script: json('script', []), handsOn: DataTypes.BOOLEAN,
      durationMin: DataTypes.INTEGER, durationMax: DataTypes.INTEGER, station: DataTypes.STRING(12), after: json('after', []), links: json('links', []),
      cameraShot: DataTypes.STRING(200), cameraNote: DataTypes.STRING(500), cautions: json('cautions', []), group: DataTypes.STRING(120), readFromText: json('readFromText', []), photo: DataTypes.STRING(200), ...stamps,
    },
    { sequelize, tableName: 'recipe_steps', underscored: true },
  )
  Recipe.hasMany(RecipeIngredient, { foreignKey: 'recipeId', as: 'ingredients' })
  Recipe.hasMany(RecipeStep, { foreignKey: 'recipeId', as: 'steps' })
}
