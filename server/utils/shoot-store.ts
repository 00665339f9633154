// The shoot engine's own SQLite connection. A shoot command is one small transaction (read the
// shoot, write it back, log the command); Sequelize would open and close a connection for each,
// which costs more than the work. This one connection stays open, and the engine runs one
// transaction on it at a time (see `serialised` in shoot-engine.ts).
import sqlite3 from 'sqlite3'
import { BUSY_TIMEOUT_MS } from '../db/connection'

let db: Promise<sqlite3.Database> | undefined

function open(path: string): Promise<sqlite3.Database> {
  return new Promise((resolve, reject) => {
    const conn = new sqlite3.Database(path, sqlite3.OPEN_READWRITE, (err) => {
      if (err) return reject(err)
      conn.configure('busyTimeout', BUSY_TIMEOUT_MS)
      // Per-connection settings, as connection.ts gives Sequelize's: foreign keys, and with WAL a
      // commit that is safe against a crashed process without an fsync each time.
      conn.exec('PRAGMA foreign_keys = ON; PRAGMA synchronous = NORMAL;', (e) => (e ? reject(e) : resolve(conn)))
    })
  })
}

export async function shootDb(): Promise<sqlite3.Database> {
  await useDb()
  db ??= open(getDatabaseHandle()!.path)
  return db
}

export function shootRun(conn: sqlite3.Database, sql: string, params: unknown[] = []): Promise<void> {
  return new Promise((resolve, reject) => conn.run(sql, params, (err) => (err ? reject(err) : resolve())))
}

export function shootGet<T>(conn: sqlite3.Database, sql: string, params: unknown[] = []): Promise<T | undefined> {
  return new Promise((resolve, reject) => conn.get(sql, params, (err, row) => (err ? reject(err) : resolve(row as T | undefined))))
}

/** BEGIN IMMEDIATE … COMMIT around `fn`, ROLLBACK when it throws. */
export async function shootTransaction<T>(fn: (conn: sqlite3.Database) => Promise<T>): Promise<T> {
  const conn = await shootDb()
  await shootRun(conn, 'BEGIN IMMEDIATE')
  try {
    const result = await fn(conn)
    await shootRun(conn, 'COMMIT')
    return result
  } catch (error) {
    await shootRun(conn, 'ROLLBACK').catch(() => {})
    throw error
  }
}

export async function closeShootDb() {
  const conn = await db
  db = undefined
  await new Promise<void>((resolve) => (conn ? conn.close(() => resolve()) : resolve()))
}
