import type { Queryable } from '../../server/db/queryable'
import { insertOwnedItem } from '../../server/resources/resource-definition'
import { planDefinition } from '../../server/resources/plans'
import { eventDefinition } from '../../server/resources/events'
import { eventLinks } from '../../server/events/event-share-links'
import { eventBodySchema } from '../../shared/schemas/events'
import { planBodySchema } from '../../shared/schemas/plans'
import { planBody } from './plan-fixture'

// An event for API tests, on a plan of its own (the plan fixture's plan stays out of events, so
// its delete is a 204 in the matrix), with a live share link.

export const eventBody = {
  name: 'Sports day, both fields',
  date: '2026-06-13',
  pool: [],
  chargers: [],
} as const

export interface EventIds {
  eventId: string
  eventPlanId: string
  eventLinkId: string
  eventToken: string
}

export function seedEventFixture(
  db: Queryable,
  ids: { teamId: number; userId: number; planRigId: number },
  nowMs: number,
): EventIds {
  const scope = { tx: db, teamId: ids.teamId, userId: ids.userId, nowMs }
  const planId = insertOwnedItem(
    scope,
    planDefinition,
    planBodySchema.parse({ ...planBody, name: 'Sports day, far field', rigId: ids.planRigId }),
  )
  const eventId = insertOwnedItem(
    scope,
    eventDefinition,
    eventBodySchema.parse({ ...eventBody, planIds: [planId] }),
  )
  const link = eventLinks.create(
    {
      tx: db,
      ownerId: eventId,
      userId: ids.userId,
      nowMs,
      publicUrl: 'http://localhost:3999',
      eventDate: eventBody.date,
    },
    { label: 'Volunteers' },
  )
  return {
    eventId: String(eventId),
    eventPlanId: String(planId),
    eventLinkId: String(link.id),
    eventToken: link.url.split('/shared/events/')[1] ?? '',
  }
}
