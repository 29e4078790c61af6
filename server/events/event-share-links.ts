import { eventShareLinks } from '../db/schema-events'
import { linkStore } from '../card/link-store'

// Read-only links to an event's card, kept as a plan's are (card/link-store.ts).

/** The client page of a shared event card, under PUBLIC_URL. */
export function sharedEventCardUrl(publicUrl: string, token: string): string {
  return `${publicUrl}/shared/events/${token}`
}

export const eventLinks = linkStore(eventShareLinks, 'eventId', sharedEventCardUrl)
