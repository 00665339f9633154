// The ordered list of migrations. The built server cannot glob files, so every migration is imported
// here by name. Add new ones at the end; never edit one that has shipped.
import type { QueryInterface, Sequelize, Transaction } from 'sequelize'
import m0001 from './0001-studios'

export interface MigrationContext {
  queryInterface: QueryInterface
  sequelize: Sequelize
  /** Pass this to every query: the migration and its record commit together. */
  transaction: Transaction
}

export interface Migration {
  name: string
  up: (ctx: MigrationContext) => Promise<void>
  down: (ctx: MigrationContext) => Promise<void>
}

export const migrations: Migration[] = [m0001]
