import { SMTPServer } from 'smtp-server'

export interface FakeSmtpServer {
  port: number
  close(): Promise<void>
}

// Well above the largest message the app sends (a plan card with its table).
const maxMessageBytes = 2 * 1024 * 1024

/**
 * A local SMTP server on loopback for when no SMTP_URL is set: the app sends mail over a real
 * SMTP conversation and the messages land in memory instead of in anyone's inbox.
 */
export function startFakeSmtp(
  onMessage: (rawMessage: string, recipients: string[]) => void,
): Promise<FakeSmtpServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxMessageBytes,
    logger: false,
    banner: 'Loudhour local mail catcher',
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (chunk: Buffer) => chunks.push(chunk))
      stream.on('end', () => {
        onMessage(
          Buffer.concat(chunks).toString('utf8'),
          session.envelope.rcptTo.map((recipient) => recipient.address),
        )
        callback()
      })
    },
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(0, '127.0.0.1', () => {
      const address = server.server.address()
      const port = typeof address === 'object' && address ? address.port : 0
      resolve({ port, close: () => new Promise((done) => server.close(() => done())) })
    })
  })
}
