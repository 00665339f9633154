import { passwordResetMail } from '../../../mail/templates'

// Public. Always the same answer, so it cannot tell whether an address has an account. Limited per
// client address and per e-mail (NUXT_AUTH_RESET_PER_ADDRESS, NUXT_AUTH_RESET_PER_EMAIL).
export default defineEventHandler(async (event) => {
  const { email } = await validateBody(event, resetRequestBodySchema)
  await consumeAttempt(event, 'resetAddress', clientAddress(event))
  await consumeAttempt(event, 'resetEmail', email, email)
  const reset = await requestPasswordReset(email)
  if (reset) {
    const link = `${siteUrl(event)}/reset/${reset.token}`
    const mail = passwordResetMail({ name: reset.user.name, link, expiresAt: reset.expiresAt })
    await sendMail({ ...mail, to: reset.user.email, kind: 'password-reset' })
  }
  setResponseStatus(event, 202)
  return { sent: true, message: 'If that address has a Hobline account, a reset link is on its way. It works once, for one hour.' }
})
