import { Router } from 'express'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import { minuteMs, throttle } from '../http/throttle'
import { parseInput } from '../http/errors'
import { answerFor } from '../events/event-plans'
import { eventDefinition } from '../resources/events'
import type { ResourceContext } from '../resources/resource-definition'
import { teamResourceRouter } from './team-resource-router'
import { eventPreviewSchema } from '../../shared/schemas/events'

export function eventsRouter(context: ResourceContext): Router {
  const router = Router({ mergeParams: true })
  // The answer for an unsaved body, while the crew edits; nothing is written.
  // Each preview runs the engine for every plan, so one account may ask only so often.
  const previewThrottle = throttle({
    name: 'event_preview',
    windowMs: minuteMs,
    // Ours: a crew lead typing in the form asks a few times a minute.
    limit: 120,
    key: (req) => String(signedInUser(req).user.id),
    message: 'Too many event previews from this account. Wait a minute and try again.',
  })
  router.post('/preview', requireTeamRole('viewer'), previewThrottle, (req, res) => {
    const body = parseInput(eventPreviewSchema, req.body)
    res.json(answerFor(context.db, teamMembership(req).teamId, body))
  })
  // Reads are limited per account; ours: generous for people, a wall for a script. One event
  // read works its answer out again (it follows its plans and rigs); the list reads stored
  // summaries and runs no engine, so for the list the limit is only flood protection.
  const readThrottle = throttle({
    name: 'event_reads',
    windowMs: minuteMs,
    limit: 300,
    key: (req) => (req.auth ? String(req.auth.user.id) : undefined),
    message: 'Too many event reads from this account. Wait a minute and try again.',
  })
  router.use((req, res, next) => (req.method === 'GET' ? readThrottle(req, res, next) : next()))
  router.use(teamResourceRouter(context, eventDefinition))
  return router
}
