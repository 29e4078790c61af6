import type { MailMessage } from '../mail/message'
import { dateWords } from '../../shared/card/format'
import type { RuntimeCard } from '../../shared/card/model'
import { cardHtml } from './render-html'
import { cardText } from './render-text'

/** One crew member's copy of a plan's card, with the read-only link to it. */
export function cardMail(input: {
  to: string
  teamId: number
  senderName: string
  card: RuntimeCard
  shareUrl: string
  /** When the link stops working (ISO 8601, UTC), or null while it lasts until revoked. */
  linkExpiresAt: string | null
}): MailMessage {
  const { card, shareUrl } = input
  const until = input.linkExpiresAt
    ? `until ${dateWords(input.linkExpiresAt.slice(0, 10))}, ${input.linkExpiresAt.slice(11, 16)} UTC`
    : 'until the team revokes it'
  const intro = `${input.senderName} sent you the runtime card for "${card.title}" from Loudhour. Its link works ${until}.`
  return {
    to: input.to,
    // The team's admins may read it in the local mail catcher: it holds nothing they cannot see.
    sentByTeamId: input.teamId,
    // No names: the plan's is whatever an editor typed, so it stays in the body (escaped there),
    // out of the line a mail program shows first and a phisher would write. The date is the app's
    // own words for a validated calendar date.
    subject: card.dateLabel ? `Loudhour runtime card, ${card.dateLabel}` : 'Loudhour runtime card',
    text: cardText(card, shareUrl, intro),
    html: cardHtml(card, shareUrl, intro),
  }
}
