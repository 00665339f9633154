// Every model, initialised once on the process's Sequelize instance, with their associations.
import type { Sequelize } from 'sequelize'
import { Episode, EpisodeSegment, initEpisodeModels } from './episode'
import { Invite, Membership, PasswordReset, User, initAccountModels } from './account'
import { Mail, initMailModel } from './mail'
import { Price, Recipe, RecipeIngredient, RecipeStep, initRecipeModels } from './recipe'
import { JoinCode, Shoot, ShootEvent, initShootEventModel, initShootModels } from './shoot'
import { Studio, initStudio } from './studio'

export {
  Episode, EpisodeSegment, Invite, JoinCode, Mail, Membership, PasswordReset, Price, ShootEvent, Recipe, RecipeIngredient, RecipeStep, Shoot, Studio, User,
}

export function initModels(sequelize: Sequelize) {
  initStudio(sequelize)
  initAccountModels(sequelize)
  initShootModels(sequelize)
  initShootEventModel(sequelize)
  initMailModel(sequelize)
  initRecipeModels(sequelize)
  initEpisodeModels(sequelize)

  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' })
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' })
  Studio.hasMany(Membership, { foreignKey: 'studioId', as: 'memberships' })
  Membership.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' })
  Invite.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' })
  JoinCode.belongsTo(Shoot, { foreignKey: 'shootId', as: 'shoot' })
  Mail.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' })
}
