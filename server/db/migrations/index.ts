// The ordered list of migrations. The built server cannot glob files, so every migration is imported
// here by name. Add new ones at the end; never edit one that has shipped.
import type { QueryInterface, Sequelize, Transaction } from 'sequelize'
import m0001 from './0001-studios'
import m0002 from './0002-accounts'
import m0003 from './0003-mail'
import m0004 from './0004-join-codes'
import m0005 from './0005-recipes'
import m0006 from './0006-episodes'
import m0007 from './0007-shoot-engine'
import m0008 from './0008-step-names'
import m0009 from './0009-session-version'
import m0010 from './0010-kitchen-facts'
import m0011 from './0011-read-from-text'
import m0012 from './0012-studio-time-zone'
import m0013 from './0013-episode-show'
import m0014 from './0014-shopping-checks'
import m0015 from './0015-call-sheets'
import m0017 from './0017-range-adoptions'
import m0018 from './0018-publish-kit'
import m0019 from './0019-event-patches'

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

export const migrations: Migration[] = [
  m0001, m0002, m0003, m0004, m0005, m0006, m0007, m0008, m0009, m0010, m0011, m0012, m0013, m0014, m0015, m0017, m0018, m0019,
]
