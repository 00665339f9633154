// The built server does not start without its public address (NUXT_PUBLIC_SITE_URL): links in
// invite and reset mail and the same-origin check are built from it, never from a request's Host
// header, which a client chooses. `nuxt dev` goes on without it.
import { siteUrlProblem } from '../utils/site-url'

export default defineNitroPlugin(() => {
  if (import.meta.dev || import.meta.prerender) return
  const problem = siteUrlProblem(String(useRuntimeConfig().public.siteUrl || ''))
  if (!problem) return
  console.error(`[hobline] not starting: ${problem}`)
  process.exit(1)
})
