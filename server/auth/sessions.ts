import { randomBytes } from 'node:crypto'
import { and, eq, ne } from 'drizzle-orm'
import type { AppDatabase } from '../db/client'
import { sessions, users } from '../db/schema'
import type { Clock } from '../clock'
import { sessionAbsoluteMs, sessionIdleMs, sessionTouchIntervalMs } from './session-policy'
import { sessionKey, signSessionToken, verifySessionToken } from './session-token'

export interface SessionUser {
  id: number
  email: string
  name: string
}

export interface ActiveSession {
  sessionId: string
  user: SessionUser
}

export interface IssuedSession {
  token: string
  expiresAt: Date
}

export interface SessionStore {
  /** Records a new session and returns its signed token. Call outside a transaction. */
  start(userId: number): Promise<IssuedSession>
  /** The live session behind a cookie value, or undefined (ended, idle too long, or forged). */
  resolve(token: string): Promise<ActiveSession | undefined>
  end(sessionId: string): void
  /** Ends every session of a user, or every one but `keepSessionId`. */
  endAllForUser(userId: number, keepSessionId?: string): void
}

export function createSessionStore(db: AppDatabase, secret: string, clock: Clock): SessionStore {
  const key = sessionKey(secret)
  return {
    async start(userId) {
      const now = clock()
      const expiresAt = new Date(now.getTime() + sessionAbsoluteMs)
      const sessionId = randomBytes(24).toString('base64url')
      db.insert(sessions)
        .values({
          id: sessionId,
          userId,
          createdAtMs: now.getTime(),
          lastSeenAtMs: now.getTime(),
          expiresAtMs: expiresAt.getTime(),
        })
        .run()
      return {
        token: await signSessionToken(key, { userId, sessionId }, now, expiresAt),
        expiresAt,
      }
    },

    async resolve(token) {
      const now = clock()
      const claims = await verifySessionToken(key, token, now)
      if (!claims) return undefined
      const row = db
        .select({
          sessionId: sessions.id,
          lastSeenAtMs: sessions.lastSeenAtMs,
          expiresAtMs: sessions.expiresAtMs,
          user: { id: users.id, email: users.email, name: users.name },
        })
        .from(sessions)
        .innerJoin(users, eq(users.id, sessions.userId))
        .where(and(eq(sessions.id, claims.sessionId), eq(sessions.userId, claims.userId)))
        .get()
      if (!row) return undefined
      const nowMs = now.getTime()
      if (nowMs >= row.expiresAtMs || nowMs - row.lastSeenAtMs >= sessionIdleMs) {
        db.delete(sessions).where(eq(sessions.id, row.sessionId)).run()
        return undefined
      }
      if (nowMs - row.lastSeenAtMs >= sessionTouchIntervalMs) {
        db.update(sessions).set({ lastSeenAtMs: nowMs }).where(eq(sessions.id, row.sessionId)).run()
      }
      return { sessionId: row.sessionId, user: row.user }
    },

    end(sessionId) {
      db.delete(sessions).where(eq(sessions.id, sessionId)).run()
    },

    endAllForUser(userId, keepSessionId) {
      db.delete(sessions)
        .where(
          keepSessionId === undefined
            ? eq(sessions.userId, userId)
            : and(eq(sessions.userId, userId), ne(sessions.id, keepSessionId)),
        )
        .run()
    },
  }
}
