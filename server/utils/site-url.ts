// What is wrong with a configured site URL (NUXT_PUBLIC_SITE_URL), or null when it will do.
export function siteUrlProblem(value: string): string | null {
  const fix = 'Set NUXT_PUBLIC_SITE_URL to the address people open Hobline at, e.g. NUXT_PUBLIC_SITE_URL=https://hobline.example.com'
  if (!value.trim()) return `NUXT_PUBLIC_SITE_URL is not set. ${fix}`
  let url: URL
  try {
    url = new URL(value)
  } catch {
    return `NUXT_PUBLIC_SITE_URL (${value.slice(0, 100)}) is not an absolute address. ${fix}`
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') return `NUXT_PUBLIC_SITE_URL must start with http:// or https://. ${fix}`
  return null
}
