// The process's one database, reached from route handlers. The Nitro plugin `database` starts it;
// Nitro does not wait for async plugins, so handlers await `useDb()` and the health route reports
// "migrating" until it is ready.
import type { Sequelize } from 'sequelize'
import type { MigrationState } from '../db/migrator'
import { DomainError } from '../../shared/utils/domain-error'

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
  if (!handle) throw new DomainError('unavailable', 'The database is not started yet. Try again in a moment.')
  try {
    return await handle.ready
  } catch {
    throw new DomainError('unavailable', 'The database could not start; the server log says why.')
  }
}
