// The demo photos inside the built server (which has no source tree to read them from).
// Loaded with a dynamic import so they sit in a chunk of their own: the raw imports mark their
// chunk "ROLLUP_NO_REPLACE", and Nitro's import.meta rewrite must still run on its main chunk,
// whose static-file lookup depends on it.
import loafJpg from 'raw:./loaf.jpg'
import loafThumb from 'raw:./loaf.thumb.webp'
import panJpg from 'raw:./pan.jpg'
import panThumb from 'raw:./pan.thumb.webp'
import plateJpg from 'raw:./plate.jpg'
import plateThumb from 'raw:./plate.thumb.webp'

export const bundledDemoPhotos = {
  plate: { photo: plateJpg, thumb: plateThumb },
  pan: { photo: panJpg, thumb: panThumb },
  loaf: { photo: loafJpg, thumb: loafThumb },
}
