import nodemailer, { type Transporter } from 'nodemailer'
import type { Clock } from '../clock'
import { startFakeSmtp, type FakeSmtpServer } from './fake-smtp'
import type { MailMessage } from './message'
import { createOperatorCopy, type OperatorCopyOptions } from './operator-copy'
import { captureHeader, Outbox } from './outbox'

/** A message, or the work that decides whether there is one (undefined: nothing to send). */
export type BackgroundMail = MailMessage | (() => Promise<MailMessage | undefined>)

export interface Mailer {
  /** Sends now and resolves once the SMTP server has accepted the message. */
  send(message: MailMessage): Promise<void>
  /**
   * Sends without making the caller wait, so an answer takes as long whether or not a message
   * went out (password reset must not reveal which addresses have accounts). Given a function,
   * runs it after the caller has answered too: the lookups and hashing that differ between a known
   * and an unknown address happen there, and its failures are logged, never thrown.
   */
  sendInBackground(mail: BackgroundMail): void
  /** Resolves when every background send (and its work) has finished (tests, shutdown). */
  settled(): Promise<void>
  /** The built-in catcher, or undefined when mail goes to a real SMTP_URL. */
  outbox: Outbox | undefined
  /** Starts the built-in SMTP server now instead of at the first message; returns its port. */
  start(): Promise<number | undefined>
  close(): Promise<void>
}

export interface MailerOptions {
  smtpUrl: string | undefined
  from: string
  clock: Clock
  log: (error: unknown) => void
  /** With the built-in catcher: also write each message to `.eml` files and the console. */
  operatorCopy?: OperatorCopyOptions
}

export function createMailer(options: MailerOptions): Mailer {
  const copy = options.operatorCopy ? createOperatorCopy(options.operatorCopy) : undefined
  const outbox = options.smtpUrl
    ? undefined
    : new Outbox(options.clock, (caught) => {
        try {
          copy?.(caught)
        } catch (error) {
          options.log(error)
        }
      })
  let fakeServer: Promise<FakeSmtpServer> | undefined
  let transport: Promise<Transporter> | undefined
  const inFlight = new Set<Promise<void>>()

  function getFakeServer(catcher: Outbox): Promise<FakeSmtpServer> {
    fakeServer ??= startFakeSmtp((raw, recipients) => catcher.receive(raw, recipients))
    return fakeServer
  }

  function getTransport(): Promise<Transporter> {
    transport ??= options.smtpUrl
      ? Promise.resolve(nodemailer.createTransport(options.smtpUrl))
      : getFakeServer(outbox as Outbox).then(({ port }) =>
          nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true }),
        )
    return transport
  }

  async function send(message: MailMessage): Promise<void> {
    const captureId = outbox?.expect(message)
    try {
      await (
        await getTransport()
      ).sendMail({
        from: options.from,
        to: message.to,
        subject: message.subject,
        text: message.text,
        html: message.html,
        headers: captureId ? { [captureHeader]: captureId } : {},
      })
    } finally {
      if (captureId) outbox?.forget(captureId)
    }
  }

  return {
    send,
    sendInBackground(mail) {
      const sending = (async () => {
        // A macrotask first, so even synchronous work in `mail` runs after the answer has gone.
        await new Promise((resolve) => setImmediate(resolve))
        const message = typeof mail === 'function' ? await mail() : mail
        if (message) await send(message)
      })().catch(options.log)
      inFlight.add(sending)
      void sending.finally(() => inFlight.delete(sending))
    },
    async settled() {
      await Promise.all([...inFlight])
    },
    outbox,
    async start() {
      if (!outbox) return undefined
      return (await getFakeServer(outbox)).port
    },
    async close() {
      await Promise.all([...inFlight])
      ;(await transport)?.close()
      await (await fakeServer)?.close()
    },
  }
}
