// One queue for every write transaction in this process: Sequelize's managed transactions
// (connection.ts) and the shoot store's (server/shoot/store.ts) alike. SQLite has one writer
// anyway, and sqlite3 waits for a lock inside Node's small thread pool: with more transactions
// waiting there than the pool has threads, the one holding the lock gets no thread to commit on,
// and every one of them stalls. Waiting here keeps the waiting in JavaScript.
// Never queue a job from inside another job: it would wait for itself.
let queue: Promise<unknown> = Promise.resolve()

/** Runs `fn` after every job queued before it; its result or error is the caller's. */
export function queueWrite<T>(fn: () => Promise<T>): Promise<T> {
  const next = queue.then(fn, fn)
  queue = next.catch(() => {})
  return next
}
