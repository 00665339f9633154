// npm run db:seed — migrate, then add the demo studio if the database has no studio yet.
import { startDatabase } from '../server/db'
import { demoStudio } from '../server/db/demo'
import { createStorage } from 'unstorage'
import { photoConfigFromEnv, photoDriver, setPhotoStorage, storeDemoPhoto } from '../server/utils/photos'
import { databaseName, databasePath } from './env'

// The same photo store the server mounts (a folder by default, or the configured S3 bucket).
setPhotoStorage(createStorage({ driver: photoDriver(photoConfigFromEnv()).driver }))

const { sequelize, seeded } = await startDatabase(databasePath, true, undefined, storeDemoPhoto)
console.log(seeded ? `${databaseName}: demo studio "${demoStudio.name}" added` : `${databaseName}: already has a studio, nothing added`)
await sequelize.close()
