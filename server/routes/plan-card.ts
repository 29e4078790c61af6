import { Router } from 'express'
import { planIdParam } from '../http/params'
import { requireTeamRole, teamMembership } from '../auth/require'
import type { ResourceContext } from '../resources/resource-definition'
import { planCard, requireTeamPlan } from '../card/plan-card'
import type { PlanCardResponse } from '../../shared/card/schemas'

/** `GET /api/v1/teams/:teamId/plans/:planId/card` (viewer): the plan's runtime card, as now. */
export function planCardRouter(context: ResourceContext): Router {
  const { db } = context
  const router = Router({ mergeParams: true })
  router.get('/', requireTeamRole('viewer'), (req, res) => {
    const plan = requireTeamPlan(db, teamMembership(req).teamId, planIdParam(req))
    const answer: PlanCardResponse = { card: planCard(db, plan) }
    res.json(answer)
  })
  return router
}
