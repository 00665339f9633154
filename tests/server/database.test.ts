// The database layer on real SQLite files: connection settings, migrations, seeding, and what a
// SIGKILL in the middle of writing leaves behind.
import { spawn } from 'node:child_process'
import { resolve } from 'node:path'
import { DataTypes, QueryTypes } from 'sequelize'
import { afterEach, describe, expect, it } from 'vitest'
import { openDatabase, readPragmas } from '../../server/db/connection'
import { createMigrator, migrate, migrationState } from '../../server/db/migrator'
import { migrations, type Migration } from '../../server/db/migrations'
import { startDatabase } from '../../server/db'
import { seedDemo } from '../../server/db/seed'
import { tempDatabasePath, rootDir } from '../support/app'
import { integrityCheck, queryFile } from '../support/sqlite'

const open: { close: () => Promise<void> }[] = []
afterEach(async () => {
  await Promise.all(open.splice(0).map((s) => s.close()))
})

describe('connection', () => {
  it('uses WAL, foreign keys and a busy timeout, on the default connection and inside transactions', async () => {
    const sequelize = await openDatabase(tempDatabasePath('pragmas'))
    open.push(sequelize)
    expect(await readPragmas(sequelize)).toEqual({ journalMode: 'wal', foreignKeys: true, busyTimeoutMs: 5000 })
    await sequelize.transaction(async (transaction) => {
      const [fk] = await sequelize.query<{ foreign_keys: number }>('PRAGMA foreign_keys', { type: QueryTypes.SELECT, transaction })
      const [busy] = await sequelize.query<{ timeout: number }>('PRAGMA busy_timeout', { type: QueryTypes.SELECT, transaction })
      expect(fk?.foreign_keys).toBe(1)
      expect(busy?.timeout).toBe(5000)
    })
  })
})

describe('transactions', () => {
  it('carry every query made inside them without passing the transaction by hand, and roll back together', async () => {
    const sequelize = await openDatabase(tempDatabasePath('cls'))
    open.push(sequelize)
    await migrate(sequelize)
    const insert = (slug: string) => sequelize.query("INSERT INTO studios (name, slug, locale, currency, created_at, updated_at) VALUES ('K', ?, 'en-GB', 'GBP', datetime('now'), datetime('now'))", { replacements: [slug] })
    await sequelize.transaction(async () => {
      await insert('kept')
    })
    await expect(sequelize.transaction(async () => {
      await insert('rolled-back')
      throw new Error('undo')
    })).rejects.toThrow('undo')
    const rows = await sequelize.query<{ slug: string }>('SELECT slug FROM studios ORDER BY slug', { type: QueryTypes.SELECT })
    expect(rows.map((r) => r.slug)).toEqual(['kept'])
  })
})

describe('many transactions at once', () => {
  it('all commit, more of them than Node has threads to wait on locks with', async () => {
    const sequelize = await openDatabase(tempDatabasePath('many'))
    open.push(sequelize)
    await migrate(sequelize)
    const insert = (i: number) => sequelize.transaction(async () => {
      await sequelize.query("INSERT INTO studios (name, slug, locale, currency, created_at, updated_at) VALUES ('K', ?, 'en-GB', 'GBP', datetime('now'), datetime('now'))", { replacements: [`busy-${i}`] })
      await new Promise((r) => setTimeout(r, 5))
      await sequelize.query('SELECT COUNT(*) FROM studios')
    })
    await Promise.all(Array.from({ length: 24 }, (_, i) => insert(i)))
    const rows = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM studios WHERE slug LIKE 'busy-%'", { type: QueryTypes.SELECT })
    expect(rows[0]!.n).toBe(24)
  }, 30_000)
})

describe('migrations', () => {
  it('apply every migration once, and a second run applies nothing', async () => {
    const sequelize = await openDatabase(tempDatabasePath('migrate'))
    open.push(sequelize)
    const first = await migrate(sequelize)
    expect(first.applied).toEqual(migrations.map((m) => m.name))
    expect(first.pending).toEqual([])
    expect(await migrate(sequelize)).toEqual(first)
  })

  it('roll back all the way and forward again', async () => {
    const sequelize = await openDatabase(tempDatabasePath('down'))
    open.push(sequelize)
    await migrate(sequelize)
    await createMigrator(sequelize).down({ to: 0 })
    expect((await migrationState(sequelize)).applied).toEqual([])
    const tables = await sequelize.query<{ name: string }>("SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'studios'", { type: QueryTypes.SELECT })
    expect(tables).toEqual([])
    expect((await migrate(sequelize)).pending).toEqual([])
  })

  it('leave neither a half-made table nor a record when a migration fails', async () => {
    const sequelize = await openDatabase(tempDatabasePath('failing'))
    open.push(sequelize)
    const broken: Migration = {
      name: '9999-broken',
      async up({ queryInterface, transaction }) {
        await queryInterface.createTable('half_made', { id: { type: DataTypes.INTEGER, primaryKey: true } }, { transaction })
        throw new Error('deliberate failure after the first statement')
      },
      async down() {},
    }
    await expect(createMigrator(sequelize, [...migrations, broken]).up()).rejects.toThrow(/deliberate failure/)
    const state = await createMigrator(sequelize, [...migrations, broken]).executed()
    expect(state.map((m) => m.name)).toEqual(migrations.map((m) => m.name))
    const tables = await sequelize.query("SELECT name FROM sqlite_master WHERE name = 'half_made'", { type: QueryTypes.SELECT })
    expect(tables).toEqual([])
  })
})

describe('seeding', () => {
  it('adds the demo studio to an empty database, and only once', async () => {
    const { sequelize, seeded } = await startDatabase(tempDatabasePath('seed'), true)
    open.push(sequelize)
    expect(seeded).toBe(true)
    expect((await seedDemo(sequelize, async () => 'unused')).seeded).toBe(false)
    const rows = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM studios', { type: QueryTypes.SELECT })
    expect(rows[0]?.n).toBe(1)
    const crew = await sequelize.query<{ role: string }>('SELECT role FROM memberships ORDER BY role', { type: QueryTypes.SELECT })
    expect(crew.map((c) => c.role)).toEqual(['camera', 'host', 'producer', 'viewer'])
  })
})

describe('a writer killed with SIGKILL mid-write', () => {
  it('leaves a file that opens, passes integrity_check and keeps every committed transaction', async () => {
    const path = tempDatabasePath('kill')
    let committed = 0
    for (let round = 0; round < 4; round++) {
      const child = spawn(process.execPath, ['--import', 'tsx', resolve(rootDir, 'tests/support/db-writer.ts'), path], { stdio: ['ignore', 'pipe', 'inherit'], cwd: rootDir })
      const target = committed + 30 + round * 17
      const signal = await new Promise<NodeJS.Signals | null>((done) => {
        let buffered = ''
        child.stdout.on('data', (chunk: Buffer) => {
          const lines = (buffered + chunk.toString()).split('\n')
          buffered = lines.pop() ?? ''
          if (lines.length) committed = Number(lines[lines.length - 1])
          if (committed >= target && child.exitCode === null && !child.killed) {
            child.kill('SIGKILL')
          }
        })
        child.on('exit', (_code, sig) => done(sig))
      })
      expect(signal).toBe('SIGKILL')
      expect(await integrityCheck(path)).toBe('ok')
      const [row] = await queryFile<{ n: number }>(path, 'SELECT COUNT(*) AS n FROM studios')
      // Every commit the writer reported is there; at most the one in flight may be there too.
      expect(row!.n).toBeGreaterThanOrEqual(committed)
      expect(row!.n).toBeLessThanOrEqual(committed + 1)
      committed = row!.n
    }
  }, 120_000)
})
