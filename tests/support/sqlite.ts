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
