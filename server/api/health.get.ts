// Public on purpose: a load balancer or the demo script asks it before anyone signs in.
// It says whether the database is up and migrated, never what is in it, and never an internal
// error's text (the server log has that).
import { readPragmas } from '../db/connection'
import { migrationState } from '../db/migrator'
import { databaseLabel, isServerDatabase } from '../db/dialect'

// The SQLite file's name, or the server database's host, port and name (never its password).
const where = (path: string) => (isServerDatabase(path) ? { server: databaseLabel(path) } : { file: databaseLabel(path) })

export default defineEventHandler(async (event) => {
  const handle = getDatabaseHandle()
  if (!handle || handle.status !== 'ready' || !handle.sequelize) {
    setResponseStatus(event, 503)
    return {
      status: handle?.status ?? 'starting',
      database: handle ? where(handle.path) : { file: null },
      ...(handle?.status === 'failed' ? { message: 'The database did not start. The reason is in the server log.' } : {}),
    }
  }
  const [pragmas, migrations] = await Promise.all([readPragmas(handle.sequelize), migrationState(handle.sequelize)])
  const migrated = migrations.pending.length === 0
  if (!migrated) setResponseStatus(event, 503)
  return {
    status: migrated ? 'ok' : 'migrating',
    database: { ...where(handle.path), ...pragmas },
    migrations: { ...migrations, migrated },
  }
})
