// One committed write transaction on Hobline's connection settings (WAL, synchronous NORMAL, IMMEDIATE
// transactions) against plain sqlite3 with SQLite's defaults (rollback journal, synchronous FULL), both
// measured here in the same run on the same disk.
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import sqlite3 from 'sqlite3'
import { openDatabase } from '../server/db/connection'
import { percentile, type Benchmark } from './types'

const ROUNDS = 300

function run(db: sqlite3.Database, sql: string, params: unknown[] = []) {
  return new Promise<void>((resolve, reject) => db.run(sql, params, (err) => (err ? reject(err) : resolve())))
}

async function bareCommits(path: string): Promise<number[]> {
  const db = new sqlite3.Database(path)
  await run(db, 'CREATE TABLE t (id INTEGER PRIMARY KEY, v TEXT)')
  const times: number[] = []
  for (let i = 0; i < ROUNDS; i++) {
    const t0 = performance.now()
    await run(db, 'BEGIN IMMEDIATE')
    await run(db, 'INSERT INTO t (v) VALUES (?)', [`row ${i}`])
    await run(db, 'COMMIT')
    times.push(performance.now() - t0)
  }
  await new Promise((r) => db.close(r))
  return times
}

async function hoblineCommits(path: string): Promise<number[]> {
  const sequelize = await openDatabase(path)
  await sequelize.query('CREATE TABLE t (id INTEGER PRIMARY KEY, v TEXT)')
  const times: number[] = []
  for (let i = 0; i < ROUNDS; i++) {
    const t0 = performance.now()
    await sequelize.transaction(async (transaction) => {
      await sequelize.query('INSERT INTO t (v) VALUES (?)', { replacements: [`row ${i}`], transaction })
    })
    times.push(performance.now() - t0)
  }
  await sequelize.close()
  return times
}

export const databaseCommit: Benchmark = {
  name: 'database: one write transaction, p50',
  async run() {
    const dir = mkdtempSync(join(tmpdir(), 'hobline-bench-'))
    const baseline = percentile(await bareCommits(join(dir, 'bare.sqlite')), 50)
    const figure = percentile(await hoblineCommits(join(dir, 'hobline.sqlite')), 50)
    return { figure, unit: 'ms', baseline, bound: 5, ratioBound: 2.5, note: `${ROUNDS} commits; baseline: bare sqlite3, SQLite defaults; Sequelize opens a connection per transaction` }
  },
}
