// The installable screens (@vite-pwa/nuxt, Workbox's generateSW): the web app manifest and the
// service worker. The worker precaches the app shell (the built scripts and styles, the font, the
// alarm sounds, the icons). Answers of the API and socket.io always go to the network and are never
// kept (NetworkOnly), so no screen is handed an old answer as a fresh one. The pages a tablet or phone
// runs on set (the prompter, the cue screen, the control desk, the join and trust pages) are taken
// from the network first and kept, so an installed screen reopened while the laptop is unreachable
// still opens: it shows the last state it had under the "reconnecting" banner (ShootConnectionBanner),
// and takes the server's state again when the laptop is back. Nothing else is kept.
import type { ModuleOptions } from '@vite-pwa/nuxt'
import { palette } from './shared/utils/palette'

export const pwa: ModuleOptions = {
  // Registered by plugins/service-worker.client.ts (three lines, not workbox-window: the prompter's
  // bundle stays small, and a new version never reloads a screen in the middle of a shoot; it takes
  // over at the next navigation).
  injectRegister: false,
  registerWebManifestInRouteRules: true,
  manifest: {
    name: 'Hobline',
    short_name: 'Hobline',
    description: 'The run-of-show for cooking on camera: prompter, cue screen and control desk.',
    id: '/join',
    start_url: '/join',
    scope: '/',
    display: 'fullscreen',
    display_override: ['fullscreen', 'standalone'],
    orientation: 'any',
    background_color: palette.set.night,
    theme_color: palette.set.night,
    icons: [
      { src: '/icons/hobline-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/hobline-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/hobline-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  },
  workbox: {
    // A new worker takes over at once and controls the open pages (the next navigation is served by it).
    skipWaiting: true,
    clientsClaim: true,
    // A server-rendered app has no index.html to fall back to.
    navigateFallback: null,
    globPatterns: ['_nuxt/**/*.{js,css,woff2,woff}', 'sounds/*.wav', 'icons/*.png', 'favicon.svg'],
    // One file: the worker imports no other script (the page's CSP would have to name it).
    inlineWorkboxRuntime: true,
    cleanupOutdatedCaches: true,
    // The matchers are copied into the worker as text: they can use nothing from this file.
    runtimeCaching: [
      { urlPattern: ({ url, sameOrigin }) => sameOrigin && /^\/(api|socket\.io)\//.test(url.pathname), handler: 'NetworkOnly' },
      {
        urlPattern: ({ request, url, sameOrigin }) => sameOrigin && request.mode === 'navigate'
          && /^\/(shoots\/\d+\/(prompter|cue|desk)|join|on-set)$/.test(url.pathname),
        handler: 'NetworkFirst',
        options: {
          cacheName: 'hobline-on-set-pages',
          // A laptop gone from the Wi-Fi does not refuse, it is silent: wait this long, then open the kept page.
          networkTimeoutSeconds: 4,
          expiration: { maxEntries: 20 },
          cacheableResponse: { statuses: [200] },
        },
      },
    ],
  },
  client: { registerPlugin: false, installPrompt: false, periodicSyncForUpdates: 0 },
  devOptions: { enabled: false },
}
