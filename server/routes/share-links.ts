import { Router } from 'express'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import type { AccountsContext } from '../auth/context'
import { ApiError, parseInput } from '../http/errors'
import { planIdParam, rowIdParam } from '../http/params'
import { requireTeamPlan } from '../card/plan-card'
import { createShareLink, liveShareLinks, revokeShareLink } from '../card/share-links'
import { shareLinkBodySchema } from '../../shared/card/schemas'

/*
 * Read-only links to a plan's card, mounted at `/api/v1/teams/:teamId/plans/:planId/share-links`:
 *
 *   GET    /          viewer  → { items }: the links that still work, newest first (no tokens)
 *   POST   /          editor  { label?, expiresAt? } → 201 { id, url, ... }: the only time the url is shown;
 *                      without expiresAt the link lasts until the day after the plan's date, null is
 *                      until revoked
 *   DELETE /:linkId   editor  → 204; the link answers 404 from then on
 */

export function shareLinksRouter(
  context: Pick<AccountsContext, 'db' | 'clock' | 'publicUrl'>,
): Router {
  const { db, clock, publicUrl } = context
  const router = Router({ mergeParams: true })

  router.get('/', requireTeamRole('viewer'), (req, res) => {
    const plan = requireTeamPlan(db, teamMembership(req).teamId, planIdParam(req))
    res.json({ items: liveShareLinks(db, plan.id, clock().getTime()) })
  })

  router.post('/', requireTeamRole('editor'), (req, res) => {
    const body = parseInput(shareLinkBodySchema, req.body ?? {})
    const created = db.transaction((tx) => {
      const plan = requireTeamPlan(tx, teamMembership(req).teamId, planIdParam(req))
      const scope = {
        tx,
        planId: plan.id,
        planDate: plan.date,
        userId: signedInUser(req).user.id,
        nowMs: clock().getTime(),
        publicUrl,
      }
      return createShareLink(scope, body)
    })
    res.status(201).json(created)
  })

  router.delete('/:linkId', requireTeamRole('editor'), (req, res) => {
    const linkId = rowIdParam(req, 'linkId', 'No such share link on this plan.')
    const revoked = db.transaction((tx) => {
      const plan = requireTeamPlan(tx, teamMembership(req).teamId, planIdParam(req))
      return revokeShareLink(tx, plan.id, linkId, clock().getTime())
    })
    if (!revoked) throw new ApiError(404, 'not-found', 'No such share link on this plan.')
    res.status(204).end()
  })

  return router
}
