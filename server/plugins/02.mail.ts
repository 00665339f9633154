// Mail: without a configured SMTP server, start the local catcher on loopback once the database is
// ready (it files every mail it receives in the `mails` table), and close it with the server.
import { startMailCatcher } from '../mail/catcher'
import { closeTransports } from '../mail/send'
import { setMailCatcher } from '../utils/mail'

export default defineNitroPlugin((nitroApp) => {
  const config = useRuntimeConfig()
  if (config.mail.smtpUrl) {
    setMailCatcher(undefined)
    let host = 'the configured server'
    try {
      host = new URL(String(config.mail.smtpUrl)).host
    } catch {
      // Not a URL: the log names it as written.
    }
    console.info(`[hobline] mail goes out through SMTP at ${host}`)
    nitroApp.hooks.hook('close', () => closeTransports())
    return
  }

  const catcher = useDb().then(() => startMailCatcher({ port: Number(config.mail.catcherPort) || 0 }))
  catcher.then(
    ({ host, port }) => console.info(`[hobline] no SMTP server configured: mail catcher listening on ${host}:${port}; the outbox page shows what it keeps`),
    (error: Error) => console.error('[hobline] mail catcher failed to start:', error.message),
  )
  setMailCatcher(catcher)

  nitroApp.hooks.hook('close', async () => {
    closeTransports()
    const started = await catcher.catch(() => undefined)
    await started?.close()
  })
})
