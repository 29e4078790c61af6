import { Router } from 'express'
import { isEmailVerified } from '../auth/email-verifications'
import { adminTeamIds } from '../auth/memberships'
import { requireUser, signedInUser } from '../auth/require'
import type { AppDatabase } from '../db/client'
import type { Outbox } from '../mail/outbox'

/**
 * `/api/v1/dev/outbox`: the built-in mail catcher, mounted only while it is in use (no SMTP_URL).
 * Admins see the mail their teams sent; everyone sees the mail to their own confirmed address. A
 * link that opens an account reaches its addressee alone (see MailMessage.sentByTeamId); the
 * operator reads everything on the console and in the `.eml` files.
 */
export function outboxRouter(db: AppDatabase, outbox: Outbox): Router {
  const router = Router()
  router.get('/', requireUser, (req, res) => {
    const { user } = signedInUser(req)
    const messages = outbox.listFor({
      adminTeamIds: adminTeamIds(db, user.id),
      verifiedEmail: isEmailVerified(db, user.id) ? user.email : undefined,
    })
    res.json({ messages })
  })
  return router
}
