// A published recipe's page, for anyone with its address (no sign-in); 404 when it is not published.
export default defineEventHandler(async (event) => {
  const slug = String(getRouterParam(event, 'slug') ?? '').toLowerCase()
  return publicRecipePage(slug, siteUrl(event))
})
