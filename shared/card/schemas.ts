// Bodies and answers of the card routes (docs/api.md, "The team's parts, rigs and plans": share-links and
// card-emails; "Public": GET /api/v1/shared/:token).
import { z } from 'zod'
import { emailSchema } from '../schemas/auth'
import type { PersonRef } from '../schemas/resources'
import type { RuntimeCard } from './model'

export const SHARE_LINK_LABEL_MAX = 80
/** Ours: a season of events; a link meant to last longer can be made again. */
export const SHARE_LINK_MAX_DAYS = 366
/** Ours: a crew list, not a mailing list (each address gets its own message). */
export const CARD_EMAIL_RECIPIENTS_MAX = 20

const expiryMessage =
  'Expiry must be a date and time such as 2026-06-14T18:00:00Z, or null for a link that stays until revoked'

const expiresAtSchema = z
  .string({ error: expiryMessage })
  .pipe(z.iso.datetime({ offset: true, error: expiryMessage }))
  .nullable()
  .optional()

export const shareLinkBodySchema = z.object(
  {
    label: z
      .string({ error: 'Label must be text' })
      .trim()
      .max(SHARE_LINK_LABEL_MAX, {
        error: `Use at most ${SHARE_LINK_LABEL_MAX} characters for the label`,
      })
      .optional(),
    expiresAt: expiresAtSchema,
  },
  { error: 'A share link request must be a JSON object' },
)
export type ShareLinkBody = z.infer<typeof shareLinkBodySchema>

export const cardEmailBodySchema = z.object(
  {
    to: z
      .array(emailSchema, { error: 'To must be a list of e-mail addresses' })
      .min(1, { error: 'Enter at least one e-mail address' })
      .max(CARD_EMAIL_RECIPIENTS_MAX, {
        error: `Send to at most ${CARD_EMAIL_RECIPIENTS_MAX} addresses at a time`,
      })
      .refine((addresses) => new Set(addresses).size === addresses.length, {
        error: 'Each address may be listed once',
      }),
    expiresAt: expiresAtSchema,
  },
  { error: 'A card e-mail request must be a JSON object with a list of addresses in "to"' },
)
export type CardEmailBody = z.infer<typeof cardEmailBodySchema>

/** A share link as the plan's editors see it; the token itself is only in `url`, once. */
export interface ShareLinkView {
  id: number
  label: string
  createdAt: string
  createdBy: PersonRef | null
  /** Null: until revoked. */
  expiresAt: string | null
}

/** The answer to creating a link: the only time its address is shown. */
export interface CreatedShareLink extends ShareLinkView {
  url: string
}

export interface ShareLinkList {
  items: ShareLinkView[]
}

export interface PlanCardResponse {
  card: RuntimeCard
}

/** What anyone with the link sees: the card and when the link stops working, nothing else. */
export interface SharedCardResponse {
  card: RuntimeCard
  expiresAt: string | null
}

export interface CardEmailResponse {
  sent: string[]
  shareLink: CreatedShareLink
}
