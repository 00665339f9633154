// More than one app process (DEVELOPERS.md, "Running on more than one machine"): on a server
// database every process reads the live shoots again every few seconds, so a timer started on a
// process that has gone still rings (server/shoot/live-watch.ts); Redis's connections close with
// the server. One process on a SQLite file needs neither.
import { isServerDatabase } from '../db/dialect'
import { reloadEveryMs, watchLiveShoots } from '../shoot/live-watch'

export default defineNitroPlugin((nitroApp) => {
  const serverDatabase = isServerDatabase(getDatabaseHandle()?.path ?? '')
  const watch = serverDatabase ? watchLiveShoots(useShoot().handlers.engine, reloadEveryMs(useRuntimeConfig().shootReloadMs)) : null
  nitroApp.hooks.hook('close', async () => {
    watch?.stop()
    const presence = useShoot().presence as { stop?: () => Promise<void> }
    await presence.stop?.()
    await closeRedis()
  })
})
