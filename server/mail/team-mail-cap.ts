import { and, asc, count, eq, gt, lte } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { teamMailSends } from '../db/schema'
import { ApiError } from '../http/errors'

export const dayMs = 24 * 60 * 60 * 1000

/**
 * Reserves `messages` of the team's mail allowance for the last 24 hours (a rolling day), or
 * throws 429 with Retry-After saying when enough of it is free again. Reserved before sending, so
 * two requests at once cannot both slip under the cap; a failed send still counts (the attempt
 * reached the mail server, or tried to).
 */
export function reserveTeamMail(
  db: Queryable,
  input: { teamId: number; messages: number; dailyLimit: number; nowMs: number },
): void {
  const { teamId, messages, dailyLimit, nowMs } = input
  db.transaction((tx) => {
    // Rows older than a day count for nothing any more.
    tx.delete(teamMailSends)
      .where(and(eq(teamMailSends.teamId, teamId), lte(teamMailSends.sentAtMs, nowMs - dayMs)))
      .run()
    const sentToday =
      tx
        .select({ n: count() })
        .from(teamMailSends)
        .where(and(eq(teamMailSends.teamId, teamId), gt(teamMailSends.sentAtMs, nowMs - dayMs)))
        .get()?.n ?? 0
    if (sentToday + messages > dailyLimit) {
      throw capReached(tx, { teamId, messages, dailyLimit, nowMs, sentToday })
    }
    tx.insert(teamMailSends)
      .values(Array.from({ length: messages }, () => ({ teamId, sentAtMs: nowMs })))
      .run()
  })
}

function capReached(
  db: Queryable,
  input: { teamId: number; messages: number; dailyLimit: number; nowMs: number; sentToday: number },
): ApiError {
  const { teamId, messages, dailyLimit, nowMs, sentToday } = input
  // The wait until enough of today's messages are a day old to make room for this request: the
  // time of the one that, once gone, leaves room. A request over the whole cap waits a full day.
  const mustExpire = sentToday + messages - dailyLimit
  const freeingRow = db
    .select({ at: teamMailSends.sentAtMs })
    .from(teamMailSends)
    .where(eq(teamMailSends.teamId, teamId))
    .orderBy(asc(teamMailSends.sentAtMs))
    .limit(1)
    .offset(mustExpire - 1)
    .get()
  const freeAtMs = messages > dailyLimit || !freeingRow ? nowMs + dayMs : freeingRow.at + dayMs
  const retryAfterS = Math.max(1, Math.ceil((freeAtMs - nowMs) / 1000))
  const left = Math.max(0, dailyLimit - sentToday)
  return new ApiError(
    429,
    'team-mail-cap',
    `This team may send ${dailyLimit} messages a day and has ${left} left for now; this needs ${messages}. Try again later.`,
    undefined,
    { 'Retry-After': String(retryAfterS) },
  )
}
