import type { SharedEventCardResponse } from '@shared/schemas/events'
import type {
  EventAnswer,
  EventBody,
  EventItem,
  EventListItem,
  EventPreviewBody,
} from '@shared/schemas/events'
import { apiRequest } from './http'
import { resourceApi } from './resources'

/**
 * The team's events: `/api/v1/teams/:teamId/events`, served like every team resource; the list's
 * rows hold the stored summary and no answer.
 */
export const eventsApi = resourceApi<EventItem, EventBody, EventListItem>('events')

/** The answer for an unsaved event, while the crew edits; nothing is written. */
export const previewEvent = (teamId: number, body: EventPreviewBody) =>
  apiRequest<EventAnswer>(`/v1/teams/${teamId}/events/preview`, {
    method: 'POST',
    body,
    writesNothing: true,
  })

/** Signed out or in alike; a dead link answers 404. */
export const getSharedEventCard = (token: string) =>
  apiRequest<SharedEventCardResponse>(`/v1/shared/events/${encodeURIComponent(token)}`, {
    quietUnauthorized: true,
  })
