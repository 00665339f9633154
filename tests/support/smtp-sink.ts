// An SMTP server on loopback for a test file: the built app is pointed at it with NUXT_MAIL_SMTP_URL,
// and every message it takes is parsed whole (text, HTML and attachments) by mailparser.
import type { AddressInfo } from 'node:net'
import { simpleParser, type ParsedMail } from 'mailparser'
import { SMTPServer } from 'smtp-server'

export interface SmtpSink {
  url: string
  mails: { to: string[]; parsed: ParsedMail }[]
  /** Waits until at least `count` mails have arrived (10 s at most). */
  waitFor: (count: number) => Promise<void>
  close: () => Promise<void>
}

export async function startSmtpSink(): Promise<SmtpSink> {
  const mails: SmtpSink['mails'] = []
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream).then((parsed) => {
        mails.push({ to: session.envelope.rcptTo.map((r) => r.address), parsed })
        callback()
      }, callback)
    },
  })
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
  const { port } = server.server.address() as AddressInfo
  return {
    url: `smtp://127.0.0.1:${port}`,
    mails,
    async waitFor(count) {
      for (let i = 0; i < 200 && mails.length < count; i++) await new Promise((r) => setTimeout(r, 50))
      if (mails.length < count) throw new Error(`expected ${count} mails, got ${mails.length}`)
    },
    close: () => new Promise<void>((done) => server.close(() => done())),
  }
}
