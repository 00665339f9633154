import { DEFAULT_KITCHEN, type KitchenProfile } from '../../../shared/utils/plan-types'
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

export class Studio extends Model<InferAttributes<Studio>, InferCreationAttributes<Studio>> {
  declare id: CreationOptional<number>
  declare name: string
  declare slug: string
  declare locale: CreationOptional<string>
  declare currency: CreationOptional<string>
  /** IANA time zone the studio's times are written in ("Europe/London"); UTC until chosen. */
  declare timeZone: CreationOptional<string>
  /** Budget target per serving in minor units of the currency; null for none. */
  declare budgetPerServingMinor: CreationOptional<number | null>
  /** 'cup' (US, 236.6 mL) or 'metric-cup' (250 mL) for recipes that say "cup". */
  declare cupUnit: CreationOptional<string>
  /** What a bare "pint", "quart", "gallon", "fl oz" means: 'us' or 'imperial'; null follows the locale (en-GB: imperial). */
  declare fluidMeasure: CreationOptional<string | null>
  /** The unit system shoots and views default to: 'metric' or 'us'. */
  declare unitSystem: CreationOptional<string>
  /** The kitchen the cook plan runs against. */
  declare kitchen: CreationOptional<KitchenProfile>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initStudio(sequelize: Sequelize) {
  Studio.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      locale: { type: DataTypes.STRING(35), allowNull: false, defaultValue: 'en-GB' },
      currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'GBP' },
      timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
      budgetPerServingMinor: DataTypes.INTEGER,
      cupUnit: { type: DataTypes.STRING(12), defaultValue: 'cup' },
      unitSystem: { type: DataTypes.STRING(8), defaultValue: 'metric' },
      fluidMeasure: { type: DataTypes.STRING(8), allowNull: true },
      kitchen: {
        type: DataTypes.TEXT,
        get(this: Studio) {
          const raw = this.getDataValue('kitchen') as unknown as string | null
          return raw ? JSON.parse(raw) : { ...DEFAULT_KITCHEN }
        },
        set(this: Studio, value: unknown) {
          this.setDataValue('kitchen', JSON.stringify(value) as never)
        },
      },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'studios', underscored: true },
  )
}
