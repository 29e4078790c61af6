import { and, desc, eq, gt, isNull, or } from 'drizzle-orm'
import { createLinkToken, hashLinkToken } from '../auth/link-tokens'
import type { Queryable } from '../db/queryable'
import { users } from '../db/schema'
import { eventShareLinks } from '../db/schema-events'
import { expiryMs, viewOf } from '../card/share-links'
import type { CreatedShareLink, ShareLinkBody, ShareLinkView } from '../../shared/card/schemas'

// Read-only links to an event's card, made and kept as a plan's are (card/share-links.ts): 256
// random bits, only the SHA-256 stored, the address shown once.

type EventShareLinkRow = typeof eventShareLinks.$inferSelect

function isLive(nowMs: number) {
  return and(
    isNull(eventShareLinks.revokedAtMs),
    or(isNull(eventShareLinks.expiresAtMs), gt(eventShareLinks.expiresAtMs, nowMs)),
  )
}

/** The client page of a shared event card, under PUBLIC_URL. */
export function sharedEventCardUrl(publicUrl: string, token: string): string {
  return `${publicUrl}/shared/events/${token}`
}

export interface EventShareLinkScope {
  tx: Queryable
  eventId: number
  userId: number
  nowMs: number
  publicUrl: string
}

export function createEventShareLink(
  scope: EventShareLinkScope,
  body: ShareLinkBody,
): CreatedShareLink {
  const { token, tokenHash } = createLinkToken()
  const row = scope.tx
    .insert(eventShareLinks)
    .values({
      eventId: scope.eventId,
      tokenHash,
      label: body.label ?? '',
      createdByUserId: scope.userId,
      createdAtMs: scope.nowMs,
      expiresAtMs: expiryMs(body, scope.nowMs),
    })
    .returning()
    .get()
  const creator = scope.tx
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(eq(users.id, scope.userId))
    .get()
  return { ...viewOf(row, creator ?? null), url: sharedEventCardUrl(scope.publicUrl, token) }
}

export function liveEventShareLinks(
  db: Queryable,
  eventId: number,
  nowMs: number,
): ShareLinkView[] {
  return db
    .select({ link: eventShareLinks, creatorId: users.id, creatorName: users.name })
    .from(eventShareLinks)
    .leftJoin(users, eq(users.id, eventShareLinks.createdByUserId))
    .where(and(eq(eventShareLinks.eventId, eventId), isLive(nowMs)))
    .orderBy(desc(eventShareLinks.createdAtMs), desc(eventShareLinks.id))
    .all()
    .map(({ link, creatorId, creatorName }) =>
      viewOf(
        link,
        creatorId === null || creatorName === null ? null : { id: creatorId, name: creatorName },
      ),
    )
}

export function revokeEventShareLink(
  db: Queryable,
  eventId: number,
  linkId: number,
  nowMs: number,
): boolean {
  return (
    db
      .update(eventShareLinks)
      .set({ revokedAtMs: nowMs })
      .where(
        and(
          eq(eventShareLinks.id, linkId),
          eq(eventShareLinks.eventId, eventId),
          isNull(eventShareLinks.revokedAtMs),
        ),
      )
      .returning({ id: eventShareLinks.id })
      .all().length > 0
  )
}

export function findLiveEventShareLink(
  db: Queryable,
  token: string,
  nowMs: number,
): EventShareLinkRow | undefined {
  return db
    .select()
    .from(eventShareLinks)
    .where(and(eq(eventShareLinks.tokenHash, hashLinkToken(token)), isLive(nowMs)))
    .get()
}
