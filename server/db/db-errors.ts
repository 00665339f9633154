// The one mapping of SQLite's failures to the one error shape: a database held busy by another
// program, a disk that is full, a file that cannot be written. Each becomes a DomainError whose
// message says that nothing was saved and what to do; anything else is left to the caller (a bug,
// logged and hidden). Result codes: https://www.sqlite.org/rescode.html. node-sqlite3 puts the
// primary code's name in `code` (SQLITE_BUSY, …); Sequelize wraps that error in `parent`/`original`,
// h3 in `cause`. Plain Node: the shoot handlers and the HTTP error handler both use it.
import { DomainError } from '../../shared/utils/domain-error'

export const DATABASE_BUSY_MESSAGE = 'The database is busy with another program, so nothing was saved. Try again in a moment.'
export const DISK_FULL_MESSAGE = 'The server’s disk is full, so nothing was saved. Free some space on the server (or ask whoever runs it), then try again.'
export const DISK_WRITE_MESSAGE = 'The server could not write to its disk (it may be full), so nothing was saved. Check the server’s disk, then try again.'

/** The SQLite result code an error carries, looked for through the wrappers (up to 4 deep). */
export function sqliteCodeOf(error: unknown): string | null {
  let e: unknown = error
  for (let depth = 0; depth < 5 && e && typeof e === 'object'; depth++) {
    const code = (e as { code?: unknown }).code
    if (typeof code === 'string' && code.startsWith('SQLITE_')) return code
    const next = e as { parent?: unknown; original?: unknown; cause?: unknown }
    e = next.parent ?? next.original ?? next.cause
  }
  return null
}

/** The refusal for a database failure a person can act on, or null for any other error. */
export function databaseRefusal(error: unknown): DomainError | null {
  const code = sqliteCodeOf(error)
  if (!code) return null
  // SQLITE_BUSY (5): another connection holds the lock past the busy timeout; SQLITE_LOCKED (6): within one connection.
  if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
    return new DomainError('busy', DATABASE_BUSY_MESSAGE, { data: { retryAfterSeconds: 2 } })
  }
  // SQLITE_FULL (13): the disk is full (or max_page_count reached).
  if (code.startsWith('SQLITE_FULL')) return new DomainError('storage', DISK_FULL_MESSAGE)
  // SQLITE_IOERR (10): the operating system refused a write (EFBIG past a file-size limit, EIO …).
  if (code.startsWith('SQLITE_IOERR')) return new DomainError('storage', DISK_WRITE_MESSAGE)
  return null
}
