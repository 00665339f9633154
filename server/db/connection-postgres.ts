// Opens Hobline's database on a PostgreSQL server through Sequelize's own postgres dialect, for
// more than one app process (DEVELOPERS.md, "Running on more than one machine"). connection.ts
// calls it when the address is a postgres:// URL; the transaction context (useCLS) set there
// applies here too.
import pg from 'pg'
import { Sequelize } from 'sequelize'

// BIGINT columns (milliseconds since 1970, counts) come back as numbers, as SQLite gives them:
// every value the app keeps there is far below 2^53.
pg.types.setTypeParser(pg.types.builtins.INT8, (value: string) => Number(value))

/** The pool's size per app process (NUXT_DATABASE_POOL_MAX, default 10). */
export function poolMax(): number {
  const n = Number(process.env.NUXT_DATABASE_POOL_MAX)
  return Number.isInteger(n) && n > 0 ? n : 10
}

/**
 * One Sequelize instance on one PostgreSQL database. Transactions are READ COMMITTED (the server's
 * default) and run side by side: rows that must not change under a transaction are read with
 * SELECT … FOR UPDATE (the shoot store, server/shoot/store-postgres.ts) or checked by version.
 */
export async function openServerDatabase(url: string): Promise<Sequelize> {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    // Passed explicitly so the server bundler keeps the module.
    dialectModule: pg,
    logging: false,
    define: { underscored: true },
    pool: { max: poolMax(), min: 0, idle: 10_000, acquire: 30_000 },
  })
  await sequelize.authenticate()
  return sequelize
}
