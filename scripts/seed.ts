// npm run db:seed — migrate, then add the demo studio if the database has no studio yet.
import { startDatabase } from '../server/db'
import { demoStudio } from '../server/db/demo'
import { databasePath } from './env'

const { sequelize, seeded } = await startDatabase(databasePath, true)
console.log(seeded ? `${databasePath}: demo studio "${demoStudio.name}" added` : `${databasePath}: already has a studio, nothing added`)
await sequelize.close()
