import { Router } from 'express'
import { eq } from 'drizzle-orm'
import { planIdParam } from '../http/params'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import type { AccountsContext } from '../auth/context'
import { shareLinks } from '../db/schema-resources'
import { ApiError, parseInput } from '../http/errors'
import { hourMs, throttle } from '../http/throttle'
import { cardMail } from '../card/card-mail'
import { planCard, requireTeamPlan } from '../card/plan-card'
import { createShareLink } from '../card/share-links'
import {
  CARD_EMAIL_RECIPIENTS_MAX,
  cardEmailBodySchema,
  type CardEmailResponse,
} from '../../shared/card/schemas'
import { reserveTeamMail } from '../mail/team-mail-cap'
import { requireVerifiedSender } from '../auth/verified-sender'

function recipientsLabel(addresses: string[]): string {
  const label = `E-mailed to ${addresses.join(', ')}`
  return label.length <= 80 ? label : `E-mailed to ${addresses.length} addresses`
}

/*
 * `POST /api/v1/teams/:teamId/plans/:planId/card-emails` (editor) `{ to: [email], expiresAt? }`:
 * makes one share link for this sending (listed on the plan, revocable) and mails each address
 * its own copy of the card, HTML with a text part, holding the link. Answers 201
 * `{ sent, shareLink }` once the mail server has accepted every message.
 */
export function cardEmailsRouter(
  context: Pick<AccountsContext, 'db' | 'clock' | 'publicUrl' | 'mail' | 'teamMailDailyLimit'>,
): Router {
  const { db, clock, publicUrl, mail } = context
  const router = Router({ mergeParams: true })
  router.post(
    '/',
    requireTeamRole('editor'),
    throttle({
      name: 'card_emails',
      windowMs: hourMs,
      // Ours: a few crews an hour; the recipient cap bounds each request.
      limit: 10,
      key: (req) => (req.auth ? String(req.auth.user.id) : undefined),
      message: `Too many card e-mails sent from this account in the last hour (each may go to up to ${CARD_EMAIL_RECIPIENTS_MAX} addresses). Wait a while and try again.`,
    }),
    requireVerifiedSender(db),
    async (req, res) => {
      const body = parseInput(cardEmailBodySchema, req.body)
      const { teamId } = teamMembership(req)
      const { user } = signedInUser(req)
      const { card, shareLink } = db.transaction((tx) => {
        const plan = requireTeamPlan(tx, teamId, planIdParam(req))
        // The card first: a plan without one gets no link made for nothing.
        const built = planCard(tx, plan)
        // Counted with the link: a refused request leaves neither behind.
        reserveTeamMail(tx, {
          teamId,
          messages: body.to.length,
          dailyLimit: context.teamMailDailyLimit,
          nowMs: clock().getTime(),
        })
        const scope = {
          tx,
          planId: plan.id,
          planDate: plan.date,
          userId: user.id,
          nowMs: clock().getTime(),
          publicUrl,
        }
        return {
          card: built,
          shareLink: createShareLink(scope, {
            label: recipientsLabel(body.to),
            expiresAt: body.expiresAt,
          }),
        }
      })
      const sent: string[] = []
      for (const to of body.to) {
        try {
          await mail.send(
            cardMail({
              to,
              teamId,
              senderName: user.name,
              card,
              shareUrl: shareLink.url,
              linkExpiresAt: shareLink.expiresAt,
            }),
          )
          sent.push(to)
        } catch {
          // Nobody received a link made for nobody: take it back. Otherwise it stays listed.
          if (sent.length === 0) db.delete(shareLinks).where(eq(shareLinks.id, shareLink.id)).run()
          const unsent = body.to.filter((address) => !sent.includes(address))
          throw new ApiError(
            502,
            'mail-failed',
            `The mail server did not accept the card for ${unsent.join(', ')}${sent.length > 0 ? `; it went to ${sent.join(', ')}` : ''}. Try again later.`,
          )
        }
      }
      const answer: CardEmailResponse = { sent, shareLink }
      res.status(201).json(answer)
    },
  )
  return router
}
