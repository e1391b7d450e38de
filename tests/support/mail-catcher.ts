import { SMTPServer } from 'smtp-server'
import { simpleParser, type ParsedMail } from 'mailparser'

/** A real SMTP server in the test process that keeps every message it receives. */
export class MailCatcher {
  readonly messages: ParsedMail[] = []
  private server?: SMTPServer

  constructor(readonly port: number) {}

  async start() {
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData: (stream, _session, callback) => {
        simpleParser(stream).then((mail) => {
          this.messages.push(mail)
          callback()
        }, callback)
      },
    })
    await new Promise<void>((resolve, reject) => {
      this.server!.once('error', reject)
      this.server!.listen(this.port, '127.0.0.1', () => resolve())
    })
  }

  async stop() {
    const server = this.server
    this.server = undefined
    if (server) await new Promise<void>(resolve => server.close(() => resolve()))
  }

  to(address: string) {
    return this.messages.filter(mail => [mail.to].flat().some(to => to?.value.some(entry => entry.address === address)))
  }

  /** Waits for a message to `address` whose subject matches, and returns it. */
  async waitFor(address: string, subject: RegExp = /./, timeoutMs = 10_000): Promise<ParsedMail> {
    const deadline = Date.now() + timeoutMs
    while (Date.now() < deadline) {
      const found = this.to(address).find(mail => subject.test(mail.subject ?? ''))
      if (found) return found
      await new Promise(resolve => setTimeout(resolve, 50))
    }
    throw new Error(`No e-mail to ${address} matching ${subject} within ${timeoutMs} ms (got ${this.messages.length} in all)`)
  }
}

export function linkIn(mail: ParsedMail, pattern: RegExp): string {
  const match = (mail.text ?? '').match(pattern)
  if (!match) throw new Error(`No link matching ${pattern} in: ${mail.text}`)
  return match[0]
}
