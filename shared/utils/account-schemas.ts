// Request bodies for accounts, crew and join codes; the server validates with these, and the forms
// can check the same rules before sending.
import { z } from 'zod'
import { DEVICE_ROLES, STUDIO_ROLES } from './roles'
import { PASSWORD_MAX } from './password-policy'

const email = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email({ error: 'Enter an e-mail address like name@example.com.' }))

const name = z.string({ error: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(80, 'Use at most 80 characters for the name.')
const password = z.string({ error: 'Enter a password.' }).min(1, 'Enter a password.').max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters for the password.`)
const studioRole = z.enum(STUDIO_ROLES, { error: `Choose a role: ${STUDIO_ROLES.join(', ')}.` })

export const signupBodySchema = z.object({
  name,
  email,
  password,
  studioName: z.string({ error: 'Enter a studio name.' }).trim().min(1, 'Enter a studio name.').max(120, 'Use at most 120 characters for the studio name.'),
})

export const loginBodySchema = z.object({ email, password })

export const inviteBodySchema = z.object({ email, role: studioRole })

export const roleBodySchema = z.object({ role: studioRole })

export const acceptInviteBodySchema = z.object({
  name: name.optional(),
  password,
})

export const resetRequestBodySchema = z.object({ email })
export const resetBodySchema = z.object({ password })

export const joinCodeBodySchema = z.object({
  role: z.enum(DEVICE_ROLES, { error: `A join code is for one role: ${DEVICE_ROLES.join(' or ')}.` }),
  minutes: z.number({ error: 'minutes must be a number.' }).int('minutes must be a whole number.').min(1, 'A join code lasts at least 1 minute.').max(240, 'A join code lasts at most 240 minutes.').optional(),
})

export const joinBodySchema = z.object({
  code: z.string({ error: 'Enter the join code shown on the control desk.' }).trim().min(1, 'Enter the join code shown on the control desk.').max(32, 'A join code has 6 letters and digits.'),
})

export const switchStudioBodySchema = z.object({ studioId: z.number({ error: 'studioId must be a number.' }).int().positive() })
