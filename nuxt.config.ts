// Hobline: the run-of-show for cooking on camera.
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', '@vueuse/nuxt', 'nuxt-auth-utils'],
  css: ['~/assets/css/main.css'],
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts' },
  app: {
    head: {
      htmlAttrs: { lang: 'en' },
      title: 'Hobline',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Hobline turns recipes into a timed, shared script for a kitchen shoot.' },
        { name: 'theme-color', content: '#14181f' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    // Overridden by NUXT_DATABASE_PATH.
    databasePath: '.data/hobline.sqlite',
    // Overridden by NUXT_DATABASE_SEED: 'auto' seeds an empty database in dev, 'always' seeds an empty database anywhere, 'never' never.
    databaseSeed: 'auto',
    public: {
      appName: 'Hobline',
    },
  },
  nitro: {
    experimental: { websocket: true },
  },
  typescript: { strict: true },
})
