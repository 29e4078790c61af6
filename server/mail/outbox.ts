import { randomUUID } from 'node:crypto'
import type { OutboxMessageView } from '../../shared/schemas/account-responses'
import type { Clock } from '../clock'
import type { MailMessage } from './message'
import type { CaughtMail } from './operator-copy'

// The header that ties a message received over SMTP back to the one composed here, so the
// catcher needs no MIME parser (quoted-printable, multipart) and still shows only what arrived.
export const captureHeader = 'X-Loudhour-Capture'
// Enough for a working day of invitations and resets; older ones drop off.
const keptMessages = 200

interface HeldMessage extends OutboxMessageView {
  recipients: string[]
  sentByTeamId: number | null
}

/** Who is asking to read the catcher: the teams they admin, and their own address if confirmed. */
export interface OutboxReader {
  adminTeamIds: number[]
  /** Undefined while the address is unconfirmed: whoever signed up with it may not own it. */
  verifiedEmail: string | undefined
}

/** The built-in mail catcher's memory: messages that really passed through the local SMTP server. */
export class Outbox {
  private readonly composed = new Map<string, MailMessage>()
  private readonly received: HeldMessage[] = []

  constructor(
    private readonly clock: Clock,
    /** Hands every caught message to the operator (console and `.eml` file); see operator-copy.ts. */
    private readonly copyToOperator: (mail: CaughtMail) => void = () => {},
  ) {}

  /** Registers a message about to be sent; returns the value for the capture header. */
  expect(message: MailMessage): string {
    const id = randomUUID()
    this.composed.set(id, message)
    return id
  }

  forget(id: string): void {
    this.composed.delete(id)
  }

  /** Called by the SMTP server with the raw message and the envelope's recipients. */
  receive(rawMessage: string, recipients: string[]): void {
    const headerEnd = rawMessage.search(/\r?\n\r?\n/)
    const headers = headerEnd === -1 ? rawMessage : rawMessage.slice(0, headerEnd)
    const match = new RegExp(`^${captureHeader}:\\s*(\\S+)\\s*$`, 'im').exec(headers)
    const id = match?.[1]
    const message = id === undefined ? undefined : this.composed.get(id)
    if (id === undefined || !message) return
    this.composed.delete(id)
    const receivedAt = this.clock()
    const held: HeldMessage = {
      id,
      to: recipients.join(', '),
      subject: message.subject,
      text: message.text,
      html: message.html,
      date: receivedAt.toISOString(),
      recipients: recipients.map((address) => address.toLowerCase()),
      sentByTeamId: message.sentByTeamId,
    }
    this.copyToOperator({ ...held, raw: rawMessage, receivedAt })
    this.received.unshift(held)
    this.received.length = Math.min(this.received.length, keptMessages)
  }

  /**
   * Newest first: what this reader may see. The mail of the teams they admin (invitations, cards),
   * and mail addressed to their own confirmed address; never someone else's reset link.
   */
  listFor(reader: OutboxReader): OutboxMessageView[] {
    const teams = new Set(reader.adminTeamIds)
    return this.received
      .filter(
        (message) =>
          (message.sentByTeamId !== null && teams.has(message.sentByTeamId)) ||
          (reader.verifiedEmail !== undefined && message.recipients.includes(reader.verifiedEmail)),
      )
      .map(({ recipients: _recipients, sentByTeamId: _team, ...message }) => message)
  }
}
