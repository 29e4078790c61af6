import { and, desc, eq, gt, isNull, or } from 'drizzle-orm'
import { createLinkToken, hashLinkToken } from '../auth/link-tokens'
import type { Queryable } from '../db/queryable'
import { users } from '../db/schema'
import type { eventShareLinks } from '../db/schema-events'
import type { shareLinks } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import {
  SHARE_LINK_MAX_DAYS,
  type CreatedShareLink,
  type ShareLinkBody,
  type ShareLinkView,
} from '../../shared/card/schemas'

// Read-only links to a card (a plan's, an event's). The token is made and hashed as invitation
// and reset tokens are (256 random bits, SHA-256 stored); the address exists only in the answer
// that creates it.

/** A table of links: the same columns, and the owner's id in a column of its own. */
export type LinkTable = typeof shareLinks | typeof eventShareLinks
export interface LinkRow {
  id: number
  tokenHash: string
  label: string
  createdByUserId: number | null
  createdAtMs: number
  expiresAtMs: number | null
  revokedAtMs: number | null
}

const dayMs = 24 * 60 * 60 * 1000

/**
 * When a link stops working unless told otherwise: once the day after the event has ended
 * everywhere (midnight at UTC−12, the last time zone to leave a date, is 12:00 UTC two days
 * after the date), so a crew in any time zone can open it through the event and the day after
 * (our default).
 */
export function dayAfterEventEndsMs(eventDate: string): number {
  const [year = 1970, month = 1, day = 1] = eventDate.split('-').map(Number)
  return Date.UTC(year, month - 1, day + 2, 12)
}

// Ours: a link to a day that is past lasts a week, time to read the card after the event.
const PAST_EVENT_LINK_DAYS = 7

function expiryMs(body: ShareLinkBody, nowMs: number, eventDate: string): number | null {
  if (body.expiresAt === null) return null
  if (body.expiresAt === undefined) {
    const afterEvent = dayAfterEventEndsMs(eventDate)
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

function viewOf(row: LinkRow, createdBy: ShareLinkView['createdBy']): ShareLinkView {
  return {
    id: row.id,
    label: row.label,
    createdAt: new Date(row.createdAtMs).toISOString(),
    createdBy,
    expiresAt: row.expiresAtMs === null ? null : new Date(row.expiresAtMs).toISOString(),
  }
}

export interface LinkScope {
  tx: Queryable
  ownerId: number
  userId: number
  nowMs: number
  publicUrl: string
  /** The day the card is for (YYYY-MM-DD): a link lasts until the day after it by default. */
  eventDate: string
}

export interface LinkStore<Row extends LinkRow> {
  create(scope: LinkScope, body: ShareLinkBody): CreatedShareLink
  /** The owner's links that still work, newest first. */
  live(db: Queryable, ownerId: number, nowMs: number): ShareLinkView[]
  /** Stops a link of this owner at once; false when there is no such live link. */
  revoke(db: Queryable, ownerId: number, linkId: number, nowMs: number): boolean
  /** The live link a token opens, or undefined (unknown, revoked and expired look the same). */
  findLive(db: Queryable, token: string, nowMs: number): Row | undefined
}

/**
 * The links of one table. Drizzle's builders do not take a union of tables; both link tables
 * have the columns of `shareLinks`, with `ownerKey` naming the owner's column.
 */
export function linkStore<Table extends LinkTable>(
  linkTable: Table,
  ownerKey: 'planId' | 'eventId',
  urlOf: (publicUrl: string, token: string) => string,
): LinkStore<Table['$inferSelect']> {
  const table = linkTable as unknown as typeof shareLinks
  const owner = (linkTable as unknown as Record<string, typeof shareLinks.planId>)[ownerKey]!
  type Row = Table['$inferSelect']
  const isLive = (nowMs: number) =>
    and(isNull(table.revokedAtMs), or(isNull(table.expiresAtMs), gt(table.expiresAtMs, nowMs)))

  return {
    create(scope, body) {
      const { token, tokenHash } = createLinkToken()
      const row = scope.tx
        .insert(table)
        .values({
          [ownerKey]: scope.ownerId,
          tokenHash,
          label: body.label ?? '',
          createdByUserId: scope.userId,
          createdAtMs: scope.nowMs,
          expiresAtMs: expiryMs(body, scope.nowMs, scope.eventDate),
        } as typeof table.$inferInsert)
        .returning()
        .get()
      const creator = scope.tx
        .select({ id: users.id, name: users.name })
        .from(users)
        .where(eq(users.id, scope.userId))
        .get()
      return { ...viewOf(row, creator ?? null), url: urlOf(scope.publicUrl, token) }
    },
    live(db, ownerId, nowMs) {
      return db
        .select({ link: table, creatorId: users.id, creatorName: users.name })
        .from(table)
        .leftJoin(users, eq(users.id, table.createdByUserId))
        .where(and(eq(owner, ownerId), isLive(nowMs)))
        .orderBy(desc(table.createdAtMs), desc(table.id))
        .all()
        .map(({ link, creatorId, creatorName }) =>
          viewOf(
            link,
            creatorId === null || creatorName === null
              ? null
              : { id: creatorId, name: creatorName },
          ),
        )
    },
    revoke(db, ownerId, linkId, nowMs) {
      const revoked = db
        .update(table)
        .set({ revokedAtMs: nowMs })
        .where(and(eq(table.id, linkId), eq(owner, ownerId), isNull(table.revokedAtMs)))
        .returning({ id: table.id })
        .all()
      return revoked.length > 0
    },
    findLive(db, token, nowMs) {
      return db
        .select()
        .from(table)
        .where(and(eq(table.tokenHash, hashLinkToken(token)), isLive(nowMs)))
        .get() as Row | undefined
    },
  }
}
