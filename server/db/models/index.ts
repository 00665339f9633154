// Every model, initialised once on the process's Sequelize instance.
import type { Sequelize } from 'sequelize'
import { Studio, initStudio } from './studio'

export { Studio }

export function initModels(sequelize: Sequelize) {
  initStudio(sequelize)
}
