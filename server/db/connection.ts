// Opens Hobline's SQLite database through Sequelize. Plain Node: no Nitro auto-imports here, so the
// migrate and seed scripts can use it too.
import { AsyncLocalStorage } from 'node:async_hooks'
import { mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import { QueryTypes, Sequelize, Transaction } from 'sequelize'
import sqlite3 from 'sqlite3'
import { isServerDatabase } from './dialect'
import { openServerDatabase } from './connection-postgres'
import { queueWrite } from './write-queue'

export const BUSY_TIMEOUT_MS = 5000

type Sqlite3Connection = sqlite3.Database & { hoblineConfigured?: boolean }

// Every query made inside `sequelize.transaction(async () => …)` joins that transaction without
// passing `{ transaction }` by hand: Sequelize 6 looks the transaction up in a "CLS namespace",
// provided here on Node's AsyncLocalStorage (get/set/run/bind is all Sequelize calls).
// Without it, a query outside the transaction would wait on the transaction's own write lock.
const transactionContext = new AsyncLocalStorage<Map<string, unknown>>()
Sequelize.useCLS({
  get: (key: string) => transactionContext.getStore()?.get(key),
  set: (key: string, value: unknown) => transactionContext.getStore()?.set(key, value),
  run: (fn: (context: Map<string, unknown>) => unknown) => {
    const context = new Map(transactionContext.getStore())
    return transactionContext.run(context, () => fn(context))
  },
  bind: <F>(fn: F) => fn,
} as unknown as Parameters<typeof Sequelize.useCLS>[0])

/** A file path made absolute; ':memory:' and a PostgreSQL URL (dialect.ts) stay as they are. */
export function resolveDatabasePath(path: string): string {
  return path === ':memory:' || isServerDatabase(path) ? path : resolve(path)
}

/**
 * One Sequelize instance on one SQLite file. WAL journal (readers never wait for the writer), foreign
 * keys on for every connection, a busy timeout so a second connection waits instead of failing, and
 * IMMEDIATE transactions so a transaction takes the write lock up front and cannot deadlock on upgrade.
 */
export async function openDatabase(path: string): Promise<Sequelize> {
  if (isServerDatabase(path)) return openServerDatabase(path)
  const storage = resolveDatabasePath(path)
  if (storage !== ':memory:') mkdirSync(dirname(storage), { recursive: true })
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    // Passed explicitly so the server bundler keeps the native module.
    dialectModule: sqlite3,
    storage,
    logging: false,
    transactionType: Transaction.TYPES.IMMEDIATE,
    // One try: the busy timeout already waits BUSY_TIMEOUT_MS for the lock (Sequelize's default of 5 tries
    // would hold a request 30 s before its refusal, server/db/db-errors.ts).
    retry: { max: 1 },
    define: { underscored: true },
  })
  // Sequelize's SQLite connection manager opens a new connection per transaction and runs no hooks,
  // so the busy timeout is set here on every connection it hands out.
  const manager = sequelize.connectionManager as unknown as {
    getConnection: (options?: object) => Promise<Sqlite3Connection>
  }
  const getConnection = manager.getConnection.bind(manager)
  manager.getConnection = async (options) => {
    const connection = await getConnection(options)
    if (!connection.hoblineConfigured) {
      connection.configure('busyTimeout', BUSY_TIMEOUT_MS)
      connection.hoblineConfigured = true
    }
    return connection
  }
  serialiseTransactions(sequelize)
  if (storage !== ':memory:') await sequelize.query('PRAGMA journal_mode = WAL')
  await sequelize.query('PRAGMA synchronous = NORMAL')
  return sequelize
}

export interface DatabasePragmas {
  journalMode: string
  foreignKeys: boolean
  busyTimeoutMs: number
}

export async function readPragmas(sequelize: Sequelize): Promise<DatabasePragmas | { dialect: 'postgres' }> {
  // A server database has no pragmas; the health route says which database it is.
  if (sequelize.getDialect() === 'postgres') return { dialect: 'postgres' }
  const one = async (pragma: string) => {
    const rows = await sequelize.query<Record<string, unknown>>(`PRAGMA ${pragma}`, { type: QueryTypes.SELECT })
    return Object.values(rows[0] ?? {})[0]
  }
  return {
    journalMode: String(await one('journal_mode')),
    foreignKeys: Number(await one('foreign_keys')) === 1,
    busyTimeoutMs: Number(await one('busy_timeout')),
  }
}

/**
 * One write transaction at a time in this process, in the queue the shoot store shares
 * (write-queue.ts says why). Do not start a transaction inside another.
 */
function serialiseTransactions(sequelize: Sequelize) {
  const begin = sequelize.transaction.bind(sequelize) as (...args: unknown[]) => Promise<unknown>
  ;(sequelize as unknown as { transaction: (...args: unknown[]) => Promise<unknown> }).transaction = (...args: unknown[]) => {
    // Only the managed form (with a callback) is queued; an unmanaged one is the caller's to end.
    if (typeof args[args.length - 1] !== 'function') return begin(...args)
    return queueWrite(() => begin(...args))
  }
}
