// Photos: mount the `photos` store at start-up from runtime config, so a deployment chooses it by
// environment without a rebuild: an S3-compatible bucket when NUXT_PHOTOS_S3_* are set, otherwise
// a folder (NUXT_PHOTOS_DIR, default .data/photos) that needs no service at all.
import loafJpg from 'raw:../db/demo-photos/loaf.jpg'
import loafThumb from 'raw:../db/demo-photos/loaf.thumb.webp'
import panJpg from 'raw:../db/demo-photos/pan.jpg'
import panThumb from 'raw:../db/demo-photos/pan.thumb.webp'
import plateJpg from 'raw:../db/demo-photos/plate.jpg'
import plateThumb from 'raw:../db/demo-photos/plate.thumb.webp'
import { photoDriver, setDemoPhotoSource, setPhotoStorage, type PhotoStorageConfig } from '../utils/photos'

// The built server has no source tree to read the demo photos from: they travel inside the bundle.
const demoPhotos = {
  plate: { photo: plateJpg, thumb: plateThumb },
  pan: { photo: panJpg, thumb: panThumb },
  loaf: { photo: loafJpg, thumb: loafThumb },
}

export default defineNitroPlugin((nitroApp) => {
  setDemoPhotoSource(async (name) => demoPhotos[name])
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
