import { basename } from 'node:path'
import { resolveDatabasePath } from '../db/connection'
import { shouldSeed, startDatabase } from '../db'
import { setDatabaseHandle, type DatabaseHandle } from '../utils/db'

export default defineNitroPlugin((nitroApp) => {
  const config = useRuntimeConfig()
  const path = resolveDatabasePath(config.databasePath)
  const handle = { status: 'migrating', path } as DatabaseHandle
  handle.ready = startDatabase(path, shouldSeed(config.databaseSeed, import.meta.dev), hashPassword, storeDemoPhoto)
    .then(({ sequelize, migrations, seeded }) => {
      Object.assign(handle, { status: 'ready', sequelize, migrations })
      console.info(`[hobline] database ${basename(path)} ready: ${migrations.applied.length} migrations applied${seeded ? ', demo studio seeded' : ''}`)
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

  nitroApp.hooks.hook('close', async () => {
    await handle.sequelize?.close()
  })
})
