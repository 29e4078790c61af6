import { Router } from 'express'
import type { AccountsContext } from '../auth/context'
import { accessoriesRouter } from './accessories'
import { amplifiersRouter } from './amplifiers'
import { dischargeLogsRouter } from './discharge-logs'
import { packsRouter } from './packs'
import { plansRouter } from './plans'
import { rigsRouter } from './rigs'
import { speakersRouter } from './speakers'
import { cardEmailsRouter } from './card-emails'
import { planCardRouter } from './plan-card'
import { shareLinksRouter } from './share-links'
import { eventShareLinksRouter } from './event-share-links'
import { eventsRouter } from './events'

/** The team's parts library and saved rigs, mounted at `/api/v1/teams/:teamId`. */
export function teamResourcesRouter(context: AccountsContext): Router {
  const router = Router({ mergeParams: true })
  router.use('/packs/:packId/discharge-logs', dischargeLogsRouter(context))
  router.use('/packs', packsRouter(context))
  router.use('/amplifiers', amplifiersRouter(context))
  router.use('/speakers', speakersRouter(context))
  router.use('/accessories', accessoriesRouter(context))
  router.use('/rigs', rigsRouter(context))
  router.use('/plans/:planId/share-links', shareLinksRouter(context))
  router.use('/plans/:planId/card-emails', cardEmailsRouter(context))
  router.use('/plans/:planId/card', planCardRouter(context))
  router.use('/plans', plansRouter(context))
  router.use('/events/:eventId/share-links', eventShareLinksRouter(context))
  router.use('/events', eventsRouter(context))
  return router
}
