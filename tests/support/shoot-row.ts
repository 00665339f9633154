// A shoot row made directly in the database, with a real state of one empty segment, for tests
// that need a shoot but not an episode's recipes (join codes, the authorisation matrix).
import { createShootState } from '../../shared/utils/shoot'
import { queryFile } from './sqlite'

export async function insertShoot(databasePath: string, studioId: number, title: string): Promise<number> {
  const quoted = (text: string) => `'${text.replace(/'/g, "''")}'`
  await queryFile(databasePath, `INSERT INTO shoots (studio_id, title, mode, status, state, seq, created_at, updated_at) VALUES (${studioId}, ${quoted(title)}, 'rehearsal', 'ready', '{}', 0, datetime('now'), datetime('now'))`)
  const [row] = await queryFile<{ id: number }>(databasePath, 'SELECT MAX(id) AS id FROM shoots')
  const state = createShootState({ id: String(row!.id), mode: 'rehearsal', runOrder: [{ id: 'segment-test', title, stepIds: [] }] })
  await queryFile(databasePath, `UPDATE shoots SET state = ${quoted(JSON.stringify(state))} WHERE id = ${row!.id}`)
  return row!.id
}
