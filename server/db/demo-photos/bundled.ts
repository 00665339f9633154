// The demo photos inside the built server (which has no source tree to read them from).
// Loaded with a dynamic import so they sit in a chunk of their own: the raw imports mark their
// chunk "ROLLUP_NO_REPLACE", and Nitro's import.meta rewrite must still run on its main chunk,
// whose static-file lookup depends on it.
import flatbreadsJpg from 'raw:./flatbreads.jpg'
import flatbreadsThumb from 'raw:./flatbreads.thumb.webp'
import squashJpg from 'raw:./squash.jpg'
import squashThumb from 'raw:./squash.thumb.webp'
import stewJpg from 'raw:./stew.jpg'
import stewThumb from 'raw:./stew.thumb.webp'
import type { DemoPhotoName } from '.'

export const bundledDemoPhotos: Record<DemoPhotoName, { photo: Uint8Array; thumb: Uint8Array }> = {
  stew: { photo: stewJpg, thumb: stewThumb },
  flatbreads: { photo: flatbreadsJpg, thumb: flatbreadsThumb },
  squash: { photo: squashJpg, thumb: squashThumb },
}
