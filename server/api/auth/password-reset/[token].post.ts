// Public: the token in the e-mailed link is the proof. Works once, until it expires.
export default defineEventHandler(async (event) => {
  const token = getRouterParam(event, 'token') ?? ''
  const { password } = await validateBody(event, resetBodySchema)
  const user = await resetPassword(token, password)
  return { user, message: 'Password changed. Sign in with the new one.' }
})
