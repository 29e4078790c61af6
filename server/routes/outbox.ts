import { Router } from 'express'
import { adminTeamIds } from '../auth/memberships'
import { requireUser, signedInUser } from '../auth/require'
import type { AppDatabase } from '../db/client'
import { ApiError } from '../http/errors'
import type { Outbox } from '../mail/outbox'

/**
 * `/api/v1/dev/outbox`: the built-in mail catcher, mounted only while it is in use (no SMTP_URL).
 * Admins see the messages meant for their teams' eyes (see MailMessage.shownToAdminsOf).
 */
export function outboxRouter(db: AppDatabase, outbox: Outbox): Router {
  const router = Router()
  router.get('/', requireUser, (req, res) => {
    const teamIds = adminTeamIds(db, signedInUser(req).user.id)
    if (teamIds.length === 0) {
      throw new ApiError(403, 'role-too-low', 'The mail catcher is for team admins.')
    }
    res.json({ messages: outbox.listFor(teamIds) })
  })
  return router
}
