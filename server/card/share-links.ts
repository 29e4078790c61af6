import { and, desc, eq, gt, isNull, or } from 'drizzle-orm'
import { createLinkToken, hashLinkToken } from '../auth/link-tokens'
import type { Queryable } from '../db/queryable'
import { users } from '../db/schema'
import { shareLinks } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import {
  SHARE_LINK_MAX_DAYS,
  type CreatedShareLink,
  type ShareLinkBody,
  type ShareLinkView,
} from '../../shared/card/schemas'

// Read-only links to a plan's card. The token is made and hashed as invitation and reset tokens
// are (256 random bits, SHA-256 stored); the address exists only in the answer that creates it.

type ShareLinkRow = typeof shareLinks.$inferSelect

const dayMs = 24 * 60 * 60 * 1000

/** A link that is neither revoked nor past its expiry at `nowMs`. */
function isLive(nowMs: number) {
  return and(
    isNull(shareLinks.revokedAtMs),
    or(isNull(shareLinks.expiresAtMs), gt(shareLinks.expiresAtMs, nowMs)),
  )
}

/** The client page of a shared card, under PUBLIC_URL (path prefix kept, as in mail links). */
export function sharedCardUrl(publicUrl: string, token: string): string {
  return `${publicUrl}/shared/${token}`
}

/**
 * When a plan's link stops working unless told otherwise: once the day after the event has ended
 * everywhere (midnight at UTC−12, the last time zone to leave a date, is 12:00 UTC), so a crew in
 * any time zone can open it through the event and the day after (our default).
 */
export function dayAfterEventEndsMs(planDate: string): number {
  const [year = 1970, month = 1, day = 1] = planDate.split('-').map(Number)
  return Date.UTC(year, month - 1, day + 2, 12)
}

// Ours: a link to a plan whose day is past lasts a week, time to read the card after the event.
const PAST_EVENT_LINK_DAYS = 7

function expiryMs(body: ShareLinkBody, nowMs: number, planDate: string): number | null {
  if (body.expiresAt === null) return null
  if (body.expiresAt === undefined) {
    const afterEvent = dayAfterEventEndsMs(planDate)
    if (afterEvent <= nowMs) return nowMs + PAST_EVENT_LINK_DAYS * dayMs
    return Math.min(afterEvent, nowMs + SHARE_LINK_MAX_DAYS * dayMs)
  }
  const atMs = Date.parse(body.expiresAt)
  const refuse = (message: string) =>
    new ApiError(400, 'invalid-input', `The request body is not valid. expiresAt: ${message}`, [
      { path: 'expiresAt', message },
    ])
  if (atMs <= nowMs) throw refuse('Expiry must be in the future')
  if (atMs > nowMs + SHARE_LINK_MAX_DAYS * dayMs) {
    throw refuse(`Expiry must be at most ${SHARE_LINK_MAX_DAYS} days from now`)
  }
  return atMs
}

function viewOf(row: ShareLinkRow, createdBy: ShareLinkView['createdBy']): ShareLinkView {
  return {
    id: row.id,
    label: row.label,
    createdAt: new Date(row.createdAtMs).toISOString(),
    createdBy,
    expiresAt: row.expiresAtMs === null ? null : new Date(row.expiresAtMs).toISOString(),
  }
}

export interface ShareLinkScope {
  tx: Queryable
  planId: number
  /** The plan's event date (YYYY-MM-DD): a link without an expiry given lasts until after it. */
  planDate: string
  userId: number
  nowMs: number
  publicUrl: string
}

export function createShareLink(scope: ShareLinkScope, body: ShareLinkBody): CreatedShareLink {
  const { token, tokenHash } = createLinkToken()
  const row = scope.tx
    .insert(shareLinks)
    .values({
      planId: scope.planId,
      tokenHash,
      label: body.label ?? '',
      createdByUserId: scope.userId,
      createdAtMs: scope.nowMs,
      expiresAtMs: expiryMs(body, scope.nowMs, scope.planDate),
    })
    .returning()
    .get()
  const creator = scope.tx
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(eq(users.id, scope.userId))
    .get()
  return { ...viewOf(row, creator ?? null), url: sharedCardUrl(scope.publicUrl, token) }
}

/** The plan's links that still work, newest first. */
export function liveShareLinks(db: Queryable, planId: number, nowMs: number): ShareLinkView[] {
  return db
    .select({ link: shareLinks, creatorId: users.id, creatorName: users.name })
    .from(shareLinks)
    .leftJoin(users, eq(users.id, shareLinks.createdByUserId))
    .where(and(eq(shareLinks.planId, planId), isLive(nowMs)))
    .orderBy(desc(shareLinks.createdAtMs), desc(shareLinks.id))
    .all()
    .map(({ link, creatorId, creatorName }) =>
      viewOf(
        link,
        creatorId === null || creatorName === null ? null : { id: creatorId, name: creatorName },
      ),
    )
}

/** Stops a link of this plan at once; false when there is no such live link. */
export function revokeShareLink(
  db: Queryable,
  planId: number,
  linkId: number,
  nowMs: number,
): boolean {
  const revoked = db
    .update(shareLinks)
    .set({ revokedAtMs: nowMs })
    .where(
      and(eq(shareLinks.id, linkId), eq(shareLinks.planId, planId), isNull(shareLinks.revokedAtMs)),
    )
    .returning({ id: shareLinks.id })
    .all()
  return revoked.length > 0
}

/** The live link a token opens, or undefined (unknown, revoked and expired look the same). */
export function findLiveShareLink(
  db: Queryable,
  token: string,
  nowMs: number,
): ShareLinkRow | undefined {
  return db
    .select()
    .from(shareLinks)
    .where(and(eq(shareLinks.tokenHash, hashLinkToken(token)), isLive(nowMs)))
    .get()
}
