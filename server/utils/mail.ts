// Sending Hobline's mail from route handlers. With `runtimeConfig.mail.smtpUrl` set, mail goes out
// through that SMTP server; without it, to the local catcher that the `mail` plugin starts on
// loopback, which keeps every message in the studio's outbox.
import type { H3Event } from 'h3'
import type { MailCatcher } from '../mail/catcher'
import { deliverMail, type OutgoingMail } from '../mail/send'
import { DomainError } from '../../shared/utils/domain-error'

let catcher: Promise<MailCatcher> | undefined

/** Called by the `mail` plugin with the catcher it is starting. */
export function setMailCatcher(next: Promise<MailCatcher> | undefined) {
  catcher = next
}

export async function sendMail(message: OutgoingMail): Promise<{ messageId: string }> {
  const config = useRuntimeConfig()
  const smtpUrl = String(config.mail.smtpUrl || '')
  let target: string | { host: string; port: number }
  if (smtpUrl) {
    target = smtpUrl
  } else {
    if (!catcher) throw new DomainError('unavailable', 'Mail cannot be sent: no SMTP server is configured and the local catcher is not running.')
    try {
      const { host, port } = await catcher
      target = { host, port }
    } catch {
      throw new DomainError('unavailable', 'Mail cannot be sent: the local catcher could not start; the server log says why.')
    }
  }
  try {
    return await deliverMail(target, String(config.mail.from), message)
  } catch (error) {
    const code = (error as { responseCode?: number }).responseCode
    console.error(`[hobline] sending a ${message.kind} mail failed:`, (error as Error).message)
    throw new DomainError('upstream', `The mail server did not take the mail${code ? ` (SMTP ${code})` : ''}. Try sending it again in a moment.`)
  }
}

let warnedAboutOrigin = false

/**
 * The absolute base for links in mail, without a trailing slash: `runtimeConfig.public.siteUrl`, or
 * the origin this request came to. The request's Host header is the client's to choose, so a server
 * reached from the internet should set NUXT_PUBLIC_SITE_URL.
 */
export function siteUrl(event: H3Event): string {
  const configured = String(useRuntimeConfig(event).public.siteUrl || '')
  if (configured) return configured.replace(/\/+$/, '')
  if (!import.meta.dev && !warnedAboutOrigin) {
    warnedAboutOrigin = true
    console.warn('[hobline] NUXT_PUBLIC_SITE_URL is not set: links in mail use the address each request came to.')
  }
  return getRequestURL(event).origin
}
