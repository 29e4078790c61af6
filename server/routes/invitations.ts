import { Router } from 'express'
import { invitationTokenSchema } from '../../shared/schemas/teams'
import type { AccountsContext } from '../auth/context'
import { requireUser, signedInUser } from '../auth/require'
import { parseInput } from '../http/errors'
import { securityEvent } from '../http/log'
import { acceptInvitation, previewInvitation } from '../teams/invitations'

/** The invitee's side of an invitation: `/api/v1/invitations`. */
export function invitationsRouter(context: AccountsContext): Router {
  const { db, clock } = context
  const router = Router()

  // POST, not GET, so the token stays out of URLs, logs and browser history; it changes nothing.
  router.post('/preview', (req, res) => {
    const { token } = parseInput(invitationTokenSchema, req.body)
    res.json({ invitation: previewInvitation(db, token, clock().getTime()) })
  })

  router.post('/accept', requireUser, (req, res) => {
    const { token } = parseInput(invitationTokenSchema, req.body)
    const team = acceptInvitation(db, token, signedInUser(req).user, clock().getTime())
    securityEvent(req, 'invitation-accepted', { teamId: team.id, role: team.role })
    res.json({ team })
  })

  return router
}
