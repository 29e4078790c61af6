import { randomUUID } from 'node:crypto'
import type { OutboxMessageView } from '../../shared/schemas/account-responses'
import type { Clock } from '../clock'
import type { MailMessage } from './message'

// The header that ties a message received over SMTP back to the one composed here, so the
// catcher needs no MIME parser (quoted-printable, multipart) and still shows only what arrived.
export const captureHeader = 'X-Loudhour-Capture'
// Enough for a working day of invitations and resets; older ones drop off.
const keptMessages = 200

/** The built-in mail catcher's memory: messages that really passed through the local SMTP server. */
export class Outbox {
  private readonly composed = new Map<string, MailMessage>()
  private readonly received: (OutboxMessageView & { shownToAdminsOf: number[] })[] = []

  constructor(private readonly clock: Clock) {}

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
    this.received.unshift({
      id,
      to: recipients.join(', '),
      subject: message.subject,
      text: message.text,
      html: message.html,
      date: this.clock().toISOString(),
      shownToAdminsOf: message.shownToAdminsOf,
    })
    this.received.length = Math.min(this.received.length, keptMessages)
  }

  /** Newest first: the messages an admin of any of `adminTeamIds` may read. */
  listFor(adminTeamIds: number[]): OutboxMessageView[] {
    const allowed = new Set(adminTeamIds)
    return this.received
      .filter((message) => message.shownToAdminsOf.some((teamId) => allowed.has(teamId)))
      .map(({ shownToAdminsOf: _scope, ...message }) => message)
  }
}
