// Every model, initialised once on the process's Sequelize instance, with their associations.
import type { Sequelize } from 'sequelize'
import { CallSheet, CallSheetSend, initCallSheetModels } from './call-sheet'
import { Episode, EpisodeSegment, initEpisodeModels } from './episode'
import { Invite, Membership, PasswordReset, User, initAccountModels } from './account'
import { Mail, initMailModel } from './mail'
import { Price, Recipe, RecipeIngredient, RecipeStep, initRecipeModels } from './recipe'
import { JoinCode, initJoinCodeModel } from './join-code'
import { RecipePage, initRecipePageModel } from './recipe-page'
import { Studio, initStudio } from './studio'

export { CallSheet, CallSheetSend, RecipePage }
export { Episode, EpisodeSegment, Invite, JoinCode, Mail, Membership, PasswordReset, Price, Recipe, RecipeIngredient, RecipeStep, Studio, User }

export function initModels(sequelize: Sequelize) {
  initStudio(sequelize)
  initAccountModels(sequelize)
  initJoinCodeModel(sequelize)
  initMailModel(sequelize)
  initRecipeModels(sequelize)
  initEpisodeModels(sequelize)
  initCallSheetModels(sequelize)
  initRecipePageModel(sequelize)

  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' })
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' })
  Studio.hasMany(Membership, { foreignKey: 'studioId', as: 'memberships' })
  Membership.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' })
  Invite.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' })
  Mail.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' })
}
