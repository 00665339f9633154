// The bundled text of server/workers/recipe-import.ts (nuxt.config.ts, nitro.virtual), for
// server/utils/import-reader.ts.
declare module '#recipe-import-worker' {
  const code: string
  export default code
}
