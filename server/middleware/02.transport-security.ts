// HTTP Strict Transport Security (RFC 6797) only where the site is served over TLS: when the
// configured site URL (NUXT_PUBLIC_SITE_URL) is https. A studio LAN runs plain http, and a browser
// ignores the header on plain http anyway (RFC 6797 §8.1). Not includeSubDomains: other hosts of the
// studio's domain may still be plain http. DEVELOPERS.md, "Security headers".
const HSTS = 'max-age=15552000'

export default defineEventHandler((event) => {
  const siteUrl = String(useRuntimeConfig(event).public.siteUrl || '')
  if (siteUrl.toLowerCase().startsWith('https://')) setResponseHeader(event, 'Strict-Transport-Security', HSTS)
})
