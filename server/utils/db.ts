// The process's one database, reached from route handlers. The Nitro plugin `database` starts it;
// Nitro does not wait for async plugins, so handlers await `useDb()` and the health route reports
// "migrating" until it is ready.
import type { Sequelize } from 'sequelize'
import type { MigrationState } from '../db/migrator'

export type DatabaseStatus = 'starting' | 'migrating' | 'ready' | 'failed'

export interface DatabaseHandle {
  status: DatabaseStatus
  path: string
  sequelize?: Sequelize
  migrations?: MigrationState
  error?: string
  ready: Promise<Sequelize>
}

let handle: DatabaseHandle | undefined

export function setDatabaseHandle(next: DatabaseHandle) {
  handle = next
}

export function getDatabaseHandle(): DatabaseHandle | undefined {
  return handle
}

/** The Sequelize instance, once migrations have run; a 503 while starting or if start-up failed. */
export async function useDb(): Promise<Sequelize> {
  if (!handle) throw createError({ statusCode: 503, statusMessage: 'The database is not started yet. Try again in a moment.' })
  try {
    return await handle.ready
  } catch {
    throw createError({ statusCode: 503, statusMessage: 'The database could not start; the server log says why.' })
  }
}
