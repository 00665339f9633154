// Photos: mount the `photos` store at start-up from runtime config, so a deployment chooses it by
// environment without a rebuild: an S3-compatible bucket when NUXT_PHOTOS_S3_* are set, otherwise
// a folder (NUXT_PHOTOS_DIR, default .data/photos) that needs no service at all.
import { photoDriver, setDemoPhotoSource, setPhotoStorage, type PhotoStorageConfig } from '../utils/photos'

export default defineNitroPlugin((nitroApp) => {
  // The built server has no source tree: the demo photos travel inside the bundle, in a chunk of their own.
  setDemoPhotoSource(async (name) => (await import('../db/demo-photos/bundled')).bundledDemoPhotos[name])
  const config = useRuntimeConfig().photos as PhotoStorageConfig
  try {
    const { driver, where } = photoDriver(config)
    useStorage().mount('photos', driver)
    setPhotoStorage(useStorage('photos'))
    console.info(`[hobline] photos are kept in the ${where}`)
  } catch (error) {
    // Recipes keep working; photo routes answer 503 with the reason.
    const reason = (error as Error).message
    setPhotoStorage(undefined, reason)
    console.error(`[hobline] photo storage not started: ${reason}`)
  }
  nitroApp.hooks.hook('close', async () => {
    await useStorage().unmount('photos', true).catch(() => {})
  })
})
