// What a producer may send to the publish kit: the recording and the video's address
// (PATCH /api/episodes/:id/publish), and a recipe page's address (PUT …/publish/recipes/:recipeId).
import { z } from 'zod'
import { typed } from './input-words'

const SHOOT = 'choose one of the episode\'s recordings, or none.'
const VIDEO = 'write the finished video\'s full address, starting with https://, or leave it empty.'
const SLUG = 'use 3 to 64 lower-case letters, digits and single hyphens, such as "smoky-bean-stew", or leave it empty for a random address.'

export const publishTakeSchema = z.object({
  shootId: z.number({ error: typed(SHOOT) }).int(SHOOT).positive(SHOOT).nullable().optional(),
  videoUrl: z.string({ error: typed(VIDEO) }).trim().max(500, 'write at most 500 characters.')
    .refine((v) => v === '' || /^https?:\/\/[^\s]+$/i.test(v), VIDEO)
    .transform((v) => v === '' ? null : v).nullable().optional(),
})

export const publishRecipeSchema = z.object({
  slug: z.string({ error: typed(SLUG) }).trim().toLowerCase()
    .refine((v) => v === '' || (v.length >= 3 && v.length <= 64 && /^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(v)), SLUG)
    .transform((v) => v === '' ? null : v).nullable().optional(),
})
