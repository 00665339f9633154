// Registers the service worker that @vite-pwa/nuxt builds (/sw.js, pwa.config.ts) once the app is
// ready. Browsers offer service workers only on a secure address (https or localhost): on plain http
// there is nothing to register, and the shoot screens say so (ScreenInsecureNotice).
export default defineNuxtPlugin(() => {
  if (!('serviceWorker' in navigator)) return
  onNuxtReady(() => {
    navigator.serviceWorker.register('/sw.js', { scope: '/' }).catch((error) => {
      console.warn('[hobline] the service worker did not register; this screen cannot be installed or reopened offline', error)
    })
  })
})
