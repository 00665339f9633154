// Direct, read-only looks at a database file, independent of the app's own connection code.
import sqlite3 from 'sqlite3'

export function queryFile<T = Record<string, unknown>>(path: string, sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(path, sqlite3.OPEN_READWRITE, (err) => {
      if (err) return reject(err)
      db.all(sql, (error, rows) => {
        db.close()
        if (error) reject(error)
        else resolve(rows as T[])
      })
    })
  })
}

export async function integrityCheck(path: string): Promise<string> {
  const rows = await queryFile<{ integrity_check: string }>(path, 'PRAGMA integrity_check')
  return rows.map((r) => r.integrity_check).join('; ')
}

/**
 * Another program holding the file's write lock: `BEGIN EXCLUSIVE` on a connection of this process
 * (not the server's), until release(). In WAL mode EXCLUSIVE is IMMEDIATE: readers go on, every other
 * writer waits (https://www.sqlite.org/lang_transaction.html).
 */
export function holdWriteLock(path: string): Promise<{ release: () => Promise<void> }> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(path, sqlite3.OPEN_READWRITE, (err) => {
      if (err) return reject(err)
      db.exec('BEGIN EXCLUSIVE', (error) => {
        if (error) return reject(error)
        resolve({
          release: () => new Promise<void>((done, fail) => db.exec('COMMIT', (e) => (e ? fail(e) : db.close(() => done())))),
        })
      })
    })
  })
}
