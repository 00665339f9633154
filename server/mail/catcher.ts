// The local SMTP catcher: when no SMTP server is configured, Hobline's mail goes to this server on
// loopback instead of out into the world, and lands in the `mails` table (the studio's outbox page).
// It speaks real SMTP, so what the outbox shows is what a mail server would have received.
// Plain Node: no Nitro auto-imports here, so the tests start it on their own database.
import type { AddressInfo } from 'node:net'
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser'
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server'
import { Mail, Studio } from '../db/models'

/** Headers the sender sets so the catcher can file a mail; see server/mail/send.ts. */
export const STUDIO_HEADER = 'X-Hobline-Studio'
export const KIND_HEADER = 'X-Hobline-Kind'

/** Larger messages are refused with SMTP 552 (Hobline's own mails are a few kilobytes). */
export const CATCHER_MAX_BYTES = 2 * 1024 * 1024

export interface MailCatcherOptions {
  /** 0 (the default) lets the system pick a free port; read the bound one from `port`. */
  port?: number
  maxBytes?: number
}

export interface MailCatcher {
  host: string
  /** The port the catcher is bound to. */
  port: number
  close: () => Promise<void>
}

/** An SMTP reply error: smtp-server sends `responseCode` and the message to the client. */
function smtpError(responseCode: number, message: string): Error {
  return Object.assign(new Error(message), { responseCode })
}

function addresses(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return ''
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ')
}

function header(parsed: ParsedMail, name: string): string | undefined {
  // mailparser keys its header map in lower case.
  const value = parsed.headers.get(name.toLowerCase())
  return typeof value === 'string' ? value.trim() : undefined
}

/** The studio named by the header, if it is a number and that studio exists; otherwise none. */
async function studioFor(parsed: ParsedMail): Promise<number | null> {
  const raw = header(parsed, STUDIO_HEADER)
  if (!raw || !/^\d{1,15}$/.test(raw)) return null
  const studio = await Studio.findByPk(Number(raw), { attributes: ['id'] })
  return studio ? studio.id : null
}

export async function storeParsedMail(parsed: ParsedMail, session: SMTPServerSession): Promise<Mail> {
  const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ')
  const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : ''
  return Mail.create({
    studioId: await studioFor(parsed),
    kind: (header(parsed, KIND_HEADER) || 'other').slice(0, 40),
    messageId: parsed.messageId ?? null,
    from: addresses(parsed.from) || envelopeFrom,
    to: addresses(parsed.to) || envelopeTo,
    subject: parsed.subject ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    text: parsed.text ?? null,
    receivedAt: new Date(),
  })
}

export function startMailCatcher(options: MailCatcherOptions = {}): Promise<MailCatcher> {
  const host = '127.0.0.1'
  const maxBytes = options.maxBytes ?? CATCHER_MAX_BYTES
  const server = new SMTPServer({
    name: 'hobline-catcher.localhost',
    banner: 'Hobline mail catcher: mail stays on this machine',
    // Loopback only and nothing leaves the machine: no login and no TLS.
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: maxBytes,
    rejectOversized: true,
    logger: false,
    onData(stream: SMTPServerDataStream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          // The server answers 552 itself (rejectOversized); this keeps the message out of the table.
          if (stream.sizeExceeded) return callback(smtpError(552, `Message too large: at most ${maxBytes} bytes`))
          await storeParsedMail(parsed, session)
          callback(null, 'Kept in the outbox')
        })
        .catch((error: Error) => {
          // Drain whatever the parser left, so the connection can answer.
          stream.resume()
          if (stream.sizeExceeded) return callback(smtpError(552, `Message too large: at most ${maxBytes} bytes`))
          console.error('[hobline] mail catcher could not keep a message:', error)
          callback(smtpError(451, 'The message could not be kept; try again later'))
        })
    },
  })
  server.on('error', (error) => console.error('[hobline] mail catcher:', error))

  return new Promise((resolve, reject) => {
    const onError = (error: Error) => reject(error)
    server.server.once('error', onError)
    server.listen(options.port ?? 0, host, () => {
      server.server.off('error', onError)
      const { port } = server.server.address() as AddressInfo
      resolve({
        host,
        port,
        close: () => new Promise<void>((done) => server.close(() => done())),
      })
    })
  })
}
