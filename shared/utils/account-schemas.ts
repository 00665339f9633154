// Request bodies for accounts, crew and join codes; the server validates with these, and the forms
// can check the same rules before sending. Messages are instructions: the refusal puts the form's
// label in front ("E-mail address: write an e-mail address such as name@example.com.").
import { z } from 'zod'
import { DEVICE_ROLES, STUDIO_ROLES } from './roles'
import { PASSWORD_MAX } from './password-policy'
import { typed } from './input-words'

const email = z
  .string({ error: typed('write an e-mail address such as name@example.com.') })
  .trim()
  .toLowerCase()
  .max(254, 'write at most 254 characters: an e-mail address is no longer.')
  .pipe(z.email({ error: 'write an e-mail address such as name@example.com.' }))

const name = z.string({ error: typed('write your name as text.') }).trim().min(1, 'write your name.').max(80, 'write at most 80 characters.')
const password = z.string({ error: typed('write the password as text.') }).min(1, 'write a password.').max(PASSWORD_MAX, `write at most ${PASSWORD_MAX} characters.`)
const studioRole = z.enum(STUDIO_ROLES, { error: `choose one of: ${STUDIO_ROLES.join(', ')}.` })

export const signupBodySchema = z.object({
  name,
  email,
  password,
  studioName: z.string({ error: typed('write the studio name as text.') }).trim().min(1, 'write a name for the studio.').max(120, 'write at most 120 characters.'),
})

export const loginBodySchema = z.object({ email, password })

export const inviteBodySchema = z.object({ email, role: studioRole })

const PACE = 'write a reading pace from 80 to 260 words a minute, or leave it empty for the usual 150.'
/** A crew member's change: a new role, a reading pace on camera (words a minute; null for the default), or both. */
export const memberBodySchema = z.object({
  role: studioRole.optional(),
  readingWpm: z.number({ error: typed(PACE) }).int(PACE).min(80, PACE).max(260, PACE).nullable().optional(),
}).refine((b) => b.role !== undefined || b.readingWpm !== undefined, { message: 'send a new role or a reading pace.', path: ['role'] })

export const acceptInviteBodySchema = z.object({
  name: name.optional(),
  password,
})

export const resetRequestBodySchema = z.object({ email })
export const resetBodySchema = z.object({ password })

const MINUTES = 'write a whole number of minutes from 1 to 240, such as 60.'

/** The desk words a join code's role as "Device for". */
export const JOIN_CODE_LABELS = { role: 'Device for' }

export const joinCodeBodySchema = z.object({
  role: z.enum(DEVICE_ROLES, { error: `choose ${DEVICE_ROLES.join(' or ')}: a join code is for one kind of device.` }),
  minutes: z.number({ error: MINUTES }).int(MINUTES).min(1, MINUTES).max(240, MINUTES).optional(),
})

export const joinBodySchema = z.object({
  code: z.string({ error: typed('write the join code shown on the control desk.') }).trim().min(1, 'write the join code shown on the control desk.')
    .max(32, 'write the 6 letters and digits of the code shown on the control desk.'),
})

const STUDIO = 'choose one of your studios from the list (a whole number such as 12).'
export const switchStudioBodySchema = z.object({ studioId: z.number({ error: typed(STUDIO) }).int(STUDIO).positive(STUDIO) })
