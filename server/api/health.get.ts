// Public on purpose: a load balancer or the demo script asks it before anyone signs in.
// It says whether the database is up and migrated, never what is in it, and never an internal
// error's text (the server log has that).
import { basename } from 'node:path'
import { readPragmas } from '../db/connection'
import { migrationState } from '../db/migrator'

export default defineEventHandler(async (event) => {
  const handle = getDatabaseHandle()
  if (!handle || handle.status !== 'ready' || !handle.sequelize) {
    setResponseStatus(event, 503)
    return {
      status: handle?.status ?? 'starting',
      database: { file: handle ? basename(handle.path) : null },
      ...(handle?.status === 'failed' ? { message: 'The database did not start. The reason is in the server log.' } : {}),
    }
  }
  const [pragmas, migrations] = await Promise.all([readPragmas(handle.sequelize), migrationState(handle.sequelize)])
  const migrated = migrations.pending.length === 0
  if (!migrated) setResponseStatus(event, 503)
  return {
    status: migrated ? 'ok' : 'migrating',
    database: { file: basename(handle.path), ...pragmas },
    migrations: { ...migrations, migrated },
  }
})
