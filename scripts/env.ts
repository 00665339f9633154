// What the command-line scripts share with the server: the database from the same variables,
// NUXT_DATABASE_URL (a PostgreSQL server) when set, else the SQLite file NUXT_DATABASE_PATH.
import { databaseAddress, databaseLabel } from '../server/db/dialect'

export const databasePath = databaseAddress({
  databaseUrl: process.env.NUXT_DATABASE_URL,
  databasePath: process.env.NUXT_DATABASE_PATH || '.data/hobline.sqlite',
})
/** The database as the scripts print it: a file, or a server without its password. */
export const databaseName = databaseLabel(databasePath)
