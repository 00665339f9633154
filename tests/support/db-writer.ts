// A process that writes to a Hobline database as fast as it can, printing the number of each
// committed transaction; tests kill it with SIGKILL mid-write and then inspect the file.
import { openDatabase } from '../../server/db/connection'
import { migrate } from '../../server/db/migrator'
import { initModels, Studio } from '../../server/db/models'

const path = process.argv[2]!
const sequelize = await openDatabase(path)
initModels(sequelize)
await migrate(sequelize)
const start = await Studio.count()
const tag = `${process.pid}-${Date.now()}`
for (let i = start; ; i++) {
  await sequelize.transaction(async (transaction) => {
    await Studio.create({ name: `Kitchen ${i}`, slug: `kitchen-${tag}-${i}` }, { transaction })
    await Studio.update({ name: `Kitchen ${i} (renamed)` }, { where: { slug: `kitchen-${tag}-${i}` }, transaction })
  })
  process.stdout.write(`${i + 1}\n`)
}
