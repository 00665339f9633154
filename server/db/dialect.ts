// Which database the app runs on, and the few SQL words that differ between the two. Every dialect
// check of the app is here: SQLite on a file (the embedded default, NUXT_DATABASE_PATH) or PostgreSQL
// on a server (NUXT_DATABASE_URL=postgres://…, for more than one app process; DEVELOPERS.md,
// "Running on more than one machine"). Plain Node: the scripts and tests use it too.
import type { Sequelize } from 'sequelize'

export type DatabaseDialect = 'sqlite' | 'postgres'

/** Whether a database address names a PostgreSQL server (postgres:// or postgresql://). */
export function isServerDatabase(address: string): boolean {
  return /^postgres(ql)?:\/\//i.test(address)
}

/** The database the configuration names: the server URL when set, else the SQLite file. */
export function databaseAddress(config: { databaseUrl?: string; databasePath: string }): string {
  return config.databaseUrl?.trim() || config.databasePath
}

/** The address as a log line or the health route may show it: a file's name, a server without its password. */
export function databaseLabel(address: string): string {
  if (!isServerDatabase(address)) return address.split(/[\\/]/).pop() ?? address
  const url = new URL(address)
  return `${url.hostname}${url.port ? `:${url.port}` : ''}${url.pathname}`
}

export function dialectOf(sequelize: Sequelize): DatabaseDialect {
  return sequelize.getDialect() === 'postgres' ? 'postgres' : 'sqlite'
}

/** The larger of two values in one row: SQLite's two-argument MAX, PostgreSQL's GREATEST. */
export function greatest(sequelize: Sequelize, a: string, b: string): string {
  return `${dialectOf(sequelize) === 'postgres' ? 'GREATEST' : 'MAX'}(${a}, ${b})`
}

type PgConnection = { query: (sql: string) => Promise<unknown> }
type Connections = { getConnection: () => Promise<PgConnection>; releaseConnection: (c: PgConnection) => Promise<void> }

/** Any number: the key every app process's migration lock takes on PostgreSQL. */
const MIGRATION_LOCK = 4_146_210

/**
 * Runs `fn` (the migrations) while holding PostgreSQL's advisory lock for them, on a connection of its
 * own, so app processes starting together on an unmigrated database migrate one after another: the
 * later ones find nothing pending. On SQLite, one process owns the file: `fn` runs as it is.
 */
export async function withMigrationLock<T>(sequelize: Sequelize, fn: () => Promise<T>): Promise<T> {
  if (dialectOf(sequelize) !== 'postgres') return fn()
  const connections = sequelize.connectionManager as unknown as Connections
  const connection = await connections.getConnection()
  try {
    await connection.query(`SELECT pg_advisory_lock(${MIGRATION_LOCK})`)
    try {
      return await fn()
    } finally {
      await connection.query(`SELECT pg_advisory_unlock(${MIGRATION_LOCK})`)
    }
  } finally {
    await connections.releaseConnection(connection)
  }
}
