import { and, eq, gt, isNull } from 'drizzle-orm'
import type { AppDatabase } from '../db/client'
import { passwordResets, users } from '../db/schema'
import { replacePassword } from './accounts'
import { markEmailVerified } from './email-verifications'
import { createLinkToken, hashLinkToken } from './link-tokens'

// OWASP Forgot Password Cheat Sheet: short-lived, single-use tokens. Thirty minutes covers a
// slow mail server and a distracted reader.
export const passwordResetLifetimeMs = 30 * 60 * 1000

export function issuePasswordReset(db: AppDatabase, userId: number, nowMs: number): string {
  const { token, tokenHash } = createLinkToken()
  db.insert(passwordResets)
    .values({ userId, tokenHash, createdAtMs: nowMs, expiresAtMs: nowMs + passwordResetLifetimeMs })
    .run()
  return token
}

/** The account a live, unused reset token belongs to. */
export function findPendingReset(db: AppDatabase, token: string, nowMs: number) {
  return db
    .select({ resetId: passwordResets.id, userId: users.id, email: users.email, name: users.name })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(
      and(
        eq(passwordResets.tokenHash, hashLinkToken(token)),
        isNull(passwordResets.usedAtMs),
        gt(passwordResets.expiresAtMs, nowMs),
      ),
    )
    .get()
}

/**
 * Sets the new password, spends every outstanding reset of the account, ends all its sessions
 * and counts the address as confirmed, in one transaction. False when the token was spent meanwhile (a double submit).
 */
export function completePasswordReset(
  db: AppDatabase,
  reset: { resetId: number; userId: number },
  passwordHash: string,
  nowMs: number,
): boolean {
  return db.transaction((tx) => {
    const spent = tx
      .update(passwordResets)
      .set({ usedAtMs: nowMs })
      .where(and(eq(passwordResets.id, reset.resetId), isNull(passwordResets.usedAtMs)))
      .run()
    if (spent.changes !== 1) return false
    tx.update(passwordResets)
      .set({ usedAtMs: nowMs })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAtMs)))
      .run()
    replacePassword(tx, reset.userId, passwordHash, nowMs)
    // The link came through the account's mailbox: that confirms the address as well.
    markEmailVerified(tx, reset.userId, nowMs)
    return true
  })
}
