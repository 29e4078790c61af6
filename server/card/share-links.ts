import type { Queryable } from '../db/queryable'
import { shareLinks } from '../db/schema-resources'
import type { CreatedShareLink, ShareLinkBody, ShareLinkView } from '../../shared/card/schemas'
import { linkStore } from './link-store'

// Read-only links to a plan's card (link-store.ts keeps them, as an event's).

type ShareLinkRow = typeof shareLinks.$inferSelect

/** The client page of a shared card, under PUBLIC_URL (path prefix kept, as in mail links). */
export function sharedCardUrl(publicUrl: string, token: string): string {
  return `${publicUrl}/shared/${token}`
}

const planLinks = linkStore(shareLinks, 'planId', sharedCardUrl)

export interface ShareLinkScope {
  tx: Queryable
  planId: number
  userId: number
  nowMs: number
  publicUrl: string
  planDate: string
}

export function createShareLink(scope: ShareLinkScope, body: ShareLinkBody): CreatedShareLink {
  return planLinks.create({ ...scope, ownerId: scope.planId, eventDate: scope.planDate }, body)
}

/** The plan's links that still work, newest first. */
export function liveShareLinks(db: Queryable, planId: number, nowMs: number): ShareLinkView[] {
  return planLinks.live(db, planId, nowMs)
}

/** Stops a link of this plan at once; false when there is no such live link. */
export function revokeShareLink(
  db: Queryable,
  planId: number,
  linkId: number,
  nowMs: number,
): boolean {
  return planLinks.revoke(db, planId, linkId, nowMs)
}

/** The live link a token opens, or undefined (unknown, revoked and expired look the same). */
export function findLiveShareLink(
  db: Queryable,
  token: string,
  nowMs: number,
): ShareLinkRow | undefined {
  return planLinks.findLive(db, token, nowMs)
}
