// The one mapping of SQLite failures to refusals (server/db/db-errors.ts), on errors as node-sqlite3,
// Sequelize and h3 shape them. Result codes: https://www.sqlite.org/rescode.html.
import { describe, expect, it } from 'vitest'
import { DATABASE_BUSY_MESSAGE, DISK_FULL_MESSAGE, DISK_WRITE_MESSAGE, databaseRefusal, sqliteCodeOf } from '../../server/db/db-errors'
import { isDomainError } from '../../shared/utils/domain-error'
import { httpStatusOf } from '../../server/utils/errors'
import { wordsProblem } from '../support/refusal-words'

/** An error as node-sqlite3 makes it: `code` the primary result code's name, `errno` its number. */
const sqliteError = (code: string, errno: number, text: string) => Object.assign(new Error(`${code}: ${text}`), { code, errno })

describe('databaseRefusal', () => {
  it('maps SQLITE_BUSY (5) and SQLITE_LOCKED (6) to "busy", 503 with a retry', () => {
    for (const e of [sqliteError('SQLITE_BUSY', 5, 'database is locked'), sqliteError('SQLITE_LOCKED', 6, 'database table is locked')]) {
      const r = databaseRefusal(e)!
      expect(isDomainError(r)).toBe(true)
      expect(r.body()).toEqual({ code: 'busy', message: DATABASE_BUSY_MESSAGE })
      expect(r.data).toEqual({ retryAfterSeconds: 2 })
      expect(httpStatusOf(r.code)).toBe(503)
    }
  })

  it('maps SQLITE_FULL (13) and SQLITE_IOERR (10) to "storage", 507 Insufficient Storage (RFC 4918 §11.5)', () => {
    expect(databaseRefusal(sqliteError('SQLITE_FULL', 13, 'database or disk is full'))!.body()).toEqual({ code: 'storage', message: DISK_FULL_MESSAGE })
    expect(databaseRefusal(sqliteError('SQLITE_IOERR', 10, 'disk I/O error'))!.body()).toEqual({ code: 'storage', message: DISK_WRITE_MESSAGE })
    expect(httpStatusOf('storage')).toBe(507)
  })

  it('finds the code inside Sequelize\'s and h3\'s wrappers', () => {
    const raw = sqliteError('SQLITE_BUSY', 5, 'database is locked')
    const sequelize = Object.assign(new Error(raw.message), { name: 'SequelizeTimeoutError', parent: raw, original: raw })
    const h3 = Object.assign(new Error(raw.message), { statusCode: 500, cause: sequelize })
    expect(sqliteCodeOf(h3)).toBe('SQLITE_BUSY')
    expect(databaseRefusal(h3)!.code).toBe('busy')
  })

  it('leaves every other error to the caller (a bug is logged and hidden, not named a database fault)', () => {
    for (const e of [new Error('boom'), sqliteError('SQLITE_CONSTRAINT', 19, 'UNIQUE constraint failed'), null, undefined, 'SQLITE_BUSY', { code: 42 }]) {
      expect(databaseRefusal(e)).toBeNull()
    }
  })
})

describe('the database refusals\' words', () => {
  it('read as a person\'s words (tests/support/refusal-words.ts): no SQLite code, no identifier', () => {
    for (const message of [DATABASE_BUSY_MESSAGE, DISK_FULL_MESSAGE, DISK_WRITE_MESSAGE]) expect(wordsProblem(message)).toBeNull()
  })
})
