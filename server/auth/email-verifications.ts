import { and, eq, gt, isNull } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { emailVerifications, users } from '../db/schema'
import { emailVerificationLifetimeHours } from '../mail/templates'
import { createLinkToken, hashLinkToken } from './link-tokens'

// Longer than a reset link (it opens no account, it only confirms an address): two days reach
// someone who signed up at an event and reads mail the day after.
export const emailVerificationLifetimeMs = emailVerificationLifetimeHours * 60 * 60 * 1000

export function isEmailVerified(db: Queryable, userId: number): boolean {
  const row = db
    .select({ at: users.emailVerifiedAtMs })
    .from(users)
    .where(eq(users.id, userId))
    .get()
  return row?.at != null
}

export function issueEmailVerification(db: Queryable, userId: number, nowMs: number): string {
  const { token, tokenHash } = createLinkToken()
  db.insert(emailVerifications)
    .values({
      userId,
      tokenHash,
      createdAtMs: nowMs,
      expiresAtMs: nowMs + emailVerificationLifetimeMs,
    })
    .run()
  return token
}

/**
 * Spends a live confirmation token and marks its account's address confirmed, together; spends
 * the account's other outstanding ones too. The user id, or undefined for an unknown, spent or
 * expired token.
 */
export function confirmEmailVerification(
  db: Queryable,
  token: string,
  nowMs: number,
): number | undefined {
  return db.transaction((tx) => {
    const found = tx
      .select({ id: emailVerifications.id, userId: emailVerifications.userId })
      .from(emailVerifications)
      .where(
        and(
          eq(emailVerifications.tokenHash, hashLinkToken(token)),
          isNull(emailVerifications.usedAtMs),
          gt(emailVerifications.expiresAtMs, nowMs),
        ),
      )
      .get()
    if (!found) return undefined
    tx.update(emailVerifications)
      .set({ usedAtMs: nowMs })
      .where(and(eq(emailVerifications.userId, found.userId), isNull(emailVerifications.usedAtMs)))
      .run()
    markEmailVerified(tx, found.userId, nowMs)
    return found.userId
  })
}

/** Keeps the first confirmation time when the address was confirmed before. */
export function markEmailVerified(db: Queryable, userId: number, nowMs: number): void {
  db.update(users)
    .set({ emailVerifiedAtMs: nowMs })
    .where(and(eq(users.id, userId), isNull(users.emailVerifiedAtMs)))
    .run()
}
