// The bundled text of server/workers/recipe-import.ts (nuxt.config.ts, nitro.virtual).
declare module '#recipe-import-worker' {
  const code: string
  export default code
}
