// Shoots come from the live shoot engine; until a test has that, it makes the row directly.
import { queryFile } from './sqlite'

export async function insertShoot(databasePath: string, studioId: number, title: string): Promise<number> {
  await queryFile(databasePath, `INSERT INTO shoots (studio_id, title, mode, status, created_at, updated_at) VALUES (${studioId}, '${title.replace(/'/g, "''")}', 'rehearsal', 'ready', datetime('now'), datetime('now'))`)
  const [row] = await queryFile<{ id: number }>(databasePath, 'SELECT MAX(id) AS id FROM shoots')
  return row!.id
}
