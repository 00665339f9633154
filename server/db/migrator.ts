// Schema changes by migrations (umzug). Each migration and the row that records it run in one SQLite
// transaction, so a process killed half-way leaves either the old schema or the new one, never a mix.
import { QueryTypes, type QueryInterface, type Sequelize, type Transaction } from 'sequelize'
import { Umzug, type UmzugStorage } from 'umzug'
import { withMigrationLock } from './dialect'
import { migrations, type Migration } from './migrations'

const TABLE = 'hobline_migrations'

export interface MigrationState {
  applied: string[]
  pending: string[]
}

function storage(sequelize: Sequelize): UmzugStorage {
  return {
    // The row is written inside the migration's own transaction (see `run` below).
    async logMigration() {},
    async unlogMigration({ name }) {
      await sequelize.query(`DELETE FROM ${TABLE} WHERE name = ?`, { replacements: [name] })
    },
    async executed() {
      await ensureTable(sequelize)
      const rows = await sequelize.query(`SELECT name FROM ${TABLE} ORDER BY name`, { type: QueryTypes.SELECT })
      return (rows as { name: string }[]).map((r) => r.name)
    },
  }
}

async function ensureTable(sequelize: Sequelize) {
  await sequelize.query(
    `CREATE TABLE IF NOT EXISTS ${TABLE} (name TEXT PRIMARY KEY, applied_at TEXT NOT NULL)`,
  )
}

function run(sequelize: Sequelize, migration: Migration, direction: 'up' | 'down') {
  return sequelize.transaction(async (transaction: Transaction) => {
    const queryInterface: QueryInterface = sequelize.getQueryInterface()
    await migration[direction]({ queryInterface, sequelize, transaction })
    if (direction === 'up') {
      await sequelize.query(`INSERT INTO ${TABLE} (name, applied_at) VALUES (?, ?)`, {
        replacements: [migration.name, new Date().toISOString()],
        transaction,
      })
    }
  })
}

export function createMigrator(sequelize: Sequelize, list: Migration[] = migrations) {
  return new Umzug({
    migrations: list.map((m) => ({
      name: m.name,
      up: () => run(sequelize, m, 'up'),
      down: () => run(sequelize, m, 'down'),
    })),
    context: sequelize,
    storage: storage(sequelize),
    logger: undefined,
  })
}

export async function migrationState(sequelize: Sequelize): Promise<MigrationState> {
  const umzug = createMigrator(sequelize)
  const [applied, pending] = await Promise.all([umzug.executed(), umzug.pending()])
  return { applied: applied.map((m) => m.name), pending: pending.map((m) => m.name) }
}

export async function migrate(sequelize: Sequelize): Promise<MigrationState> {
  await withMigrationLock(sequelize, () => createMigrator(sequelize).up())
  return migrationState(sequelize)
}
