// Pages that need a member: load the account once, send a signed-out visitor to sign in and back.
export default defineNuxtRouteMiddleware(async (to) => {
  const account = useAccountStore()
  if (!account.loaded) await account.load()
  if (!account.signedIn) return navigateTo({ path: '/signin', query: { next: to.fullPath } })
})
