// Open, migrate and (optionally) seed: what the server plugin and the scripts share.
import type { Sequelize } from 'sequelize'
import { openDatabase } from './connection'
import { migrate, type MigrationState } from './migrator'
import { initModels } from './models'
import { isEmpty, seedDemo, type DemoPhotoStore, type PasswordHasher } from './seed'
import { hashPasswordOutsideNitro } from './password'

export type SeedPolicy = 'auto' | 'always' | 'never'

export interface StartedDatabase {
  sequelize: Sequelize
  migrations: MigrationState
  seeded: boolean
}

export function shouldSeed(policy: string, dev: boolean): boolean {
  if (policy === 'never') return false
  if (policy === 'always') return true
  return dev
}

export async function startDatabase(
  path: string,
  seed: boolean,
  hashPassword: PasswordHasher = hashPasswordOutsideNitro,
  storePhoto?: DemoPhotoStore,
): Promise<StartedDatabase> {
  const sequelize = await openDatabase(path)
  initModels(sequelize)
  const migrations = await migrate(sequelize)
  let seeded = false
  if (seed && (await isEmpty())) seeded = (await seedDemo(sequelize, hashPassword, storePhoto)).seeded
  return { sequelize, migrations, seeded }
}
