// A stored photo, or with ?size=thumb its thumbnail. The studio in the address decides who may see
// it: any member who may read that studio's recipes. The type comes from what was stored, never
// from the request, and browsers are told not to guess another.
import { z } from 'zod'

const query = z.object({ size: z.enum(['full', 'thumb'], { error: 'ask for thumb, or leave it out for the full photo.' }).optional() })

export default defineEventHandler(async (event) => {
  const { key, studioId } = parsePhotoKey(getRouterParam(event, 'key'))
  await authorize(event, { studioId }, 'recipe.read')
  const { size } = validateQuery(event, query)
  const photo = await readPhoto(key, size)
  setResponseHeaders(event, {
    'content-type': photo.type,
    'content-length': photo.bytes.length,
    'cache-control': 'private, max-age=86400',
    'x-content-type-options': 'nosniff',
  })
  return photo.bytes
})
