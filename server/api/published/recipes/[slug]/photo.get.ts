// A published recipe's photo, for anyone with the page's address (the studio's own photo route asks
// for sign-in); 404 once the page is taken down. ?size=thumb for the thumbnail.
import { z } from 'zod'

const query = z.object({ size: z.enum(['full', 'thumb'], { error: 'ask for thumb, or leave it out for the full photo.' }).optional() })

export default defineEventHandler(async (event) => {
  const key = await publishedPhotoKey(String(getRouterParam(event, 'slug') ?? '').toLowerCase())
  const { size } = validateQuery(event, query)
  const photo = await readPhoto(key, size)
  setResponseHeaders(event, {
    'content-type': photo.type,
    'content-length': photo.bytes.length,
    'cache-control': 'public, max-age=300',
    'x-content-type-options': 'nosniff',
  })
  return photo.bytes
})
