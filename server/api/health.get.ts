// Public on purpose: a load balancer or the demo script asks it before anyone signs in.
// It says whether the database is up and migrated, never what is in it.
import { basename } from 'node:path'
import { readPragmas } from '../db/connection'
import { migrationState } from '../db/migrator'

export default defineEventHandler(async (event) => {
  const handle = getDatabaseHandle()
  if (!handle || handle.status !== 'ready' || !handle.sequelize) {
    setResponseStatus(event, 503)
    return {
      status: handle?.status ?? 'starting',
      database: { file: handle ? basename(handle.path) : null, error: handle?.error ?? null },
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
