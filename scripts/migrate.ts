// npm run db:migrate — apply pending migrations to NUXT_DATABASE_URL, else NUXT_DATABASE_PATH (default .data/hobline.sqlite).
import { openDatabase } from '../server/db/connection'
import { migrate } from '../server/db/migrator'
import { databaseName, databasePath } from './env'

const sequelize = await openDatabase(databasePath)
const state = await migrate(sequelize)
console.log(`${databaseName}: ${state.applied.length} migrations applied, ${state.pending.length} pending`)
for (const name of state.applied) console.log(`  ✓ ${name}`)
await sequelize.close()
