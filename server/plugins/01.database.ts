import { resolveDatabasePath } from '../db/connection'
import { databaseAddress, databaseLabel, isServerDatabase } from '../db/dialect'
import { shouldSeed, startDatabase } from '../db'
import { accessMayHaveChanged, keepAccessReads, mayChangeAccess } from '../utils/access-reads'
import { setDatabaseHandle, type DatabaseHandle } from '../utils/db'

export default defineNitroPlugin((nitroApp) => {
  const config = useRuntimeConfig()
  // NUXT_DATABASE_URL (a PostgreSQL server) when set, else the SQLite file NUXT_DATABASE_PATH.
  const path = resolveDatabasePath(databaseAddress(config))
  const handle = { status: 'migrating', path } as DatabaseHandle
  handle.ready = startDatabase(path, shouldSeed(config.databaseSeed, import.meta.dev), hashPassword, storeDemoPhoto)
    .then(({ sequelize, migrations, seeded }) => {
      Object.assign(handle, { status: 'ready', sequelize, migrations })
      console.info(`[hobline] database ${databaseLabel(path)} ready: ${migrations.applied.length} migrations applied${seeded ? ', demo studio seeded' : ''}`)
      return sequelize
    })
    .catch((error: Error) => {
      Object.assign(handle, { status: 'failed', error: error.message })
      console.error('[hobline] database failed to start:', error)
      throw error
    })
  // A failed start is reported by /api/health and by useDb(); keep the rejection from crashing the process.
  handle.ready.catch(() => {})
  setDatabaseHandle(handle)

  // The guard's reads are kept in memory only on the embedded database (access-reads.ts says why), and
  // emptied when a request that may change them starts and again when it is answered.
  keepAccessReads(!isServerDatabase(path))
  const changing = (event: { method: string; path: string }) => {
    if (mayChangeAccess(event.method, event.path)) accessMayHaveChanged()
  }
  nitroApp.hooks.hook('request', changing)
  nitroApp.hooks.hook('afterResponse', changing)
  nitroApp.hooks.hook('error', (_error, { event }) => event && changing(event))

  nitroApp.hooks.hook('close', async () => {
    await handle.sequelize?.close()
  })
})
