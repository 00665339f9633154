// WAL checkpoints off the shoot commands' path. SQLite's automatic checkpoint runs inside the COMMIT
// that takes the write-ahead log past 1,000 pages (https://www.sqlite.org/wal.html#ckpt), with an
// fsync of the database file, and every command queued behind that commit waits for the disk. The
// shoot store's connection turns it off (PRAGMA wal_autocheckpoint = 0) and this second connection
// copies the log back every `everyMs` with a PASSIVE checkpoint, which waits for no reader or writer
// (https://www.sqlite.org/c3ref/wal_checkpoint_v2.html). Measured by `npm run soak` (DEVELOPERS.md).
import sqlite3 from 'sqlite3'

export interface Checkpoints {
  stop(): Promise<void>
}

export function startCheckpoints(path: string, everyMs = 2000): Checkpoints {
  const conn = new sqlite3.Database(path, sqlite3.OPEN_READWRITE)
  let running = false
  const timer = setInterval(() => {
    if (running) return
    running = true
    // A checkpoint that fails (the file busy, the disk full) is tried again at the next turn; the
    // log keeps every commit meanwhile.
    conn.exec('PRAGMA wal_checkpoint(PASSIVE)', () => (running = false))
  }, everyMs)
  timer.unref()
  return {
    stop() {
      clearInterval(timer)
      return new Promise<void>((resolve) => conn.close(() => resolve()))
    },
  }
}
