// The latest mail the server sent to an address, read from the SMTP catcher's table (reset mail has no studio outbox).
import { queryFile } from './sqlite'

export async function latestMailText(databasePath: string, email: string): Promise<string> {
  for (let i = 0; i < 60; i++) {
    const rows = await queryFile<{ text: string }>(databasePath, `SELECT text FROM mails WHERE "to" LIKE '%${email.replace(/'/g, "''")}%' ORDER BY id DESC LIMIT 1`)
    if (rows[0]) return rows[0].text
    await new Promise((r) => setTimeout(r, 50))
  }
  throw new Error(`no mail to ${email}`)
}
