import type { Queryable } from '../../server/db/queryable'
import { createShareLink } from '../../server/card/share-links'

/** A live share link of the fixture's plan: its id and token (the `:linkId`, `:token` placeholders). */
export function seedShareLinkFixture(
  db: Queryable,
  planId: number,
  userId: number,
  nowMs: number,
): { linkId: string; token: string } {
  const link = createShareLink(
    { tx: db, planId, planDate: '2026-06-13', userId, nowMs, publicUrl: 'http://localhost:3999' },
    { label: 'Volunteers' },
  )
  return { linkId: String(link.id), token: link.url.split('/shared/')[1] ?? '' }
}
