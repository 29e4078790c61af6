import type { Response } from 'express'
import type { MeResponse } from '../../shared/schemas/account-responses'
import { findUserById } from './accounts'
import type { AccountsContext } from './context'
import { teamsOf } from './memberships'

/** The `GET /auth/me` answer, also returned by sign-up, sign-in and profile changes. */
export function meResponse(context: AccountsContext, userId: number): MeResponse {
  const user = findUserById(context.db, userId)
  if (!user) throw new Error(`User ${userId} vanished while answering`)
  return {
    user: { id: user.id, email: user.email, name: user.name },
    teams: teamsOf(context.db, userId),
    devOutbox: context.mail.outbox !== undefined,
    emailVerified: user.emailVerifiedAtMs !== null,
  }
}

/** Starts a session for the user and hands its cookie to the browser. */
export async function signIn(
  context: AccountsContext,
  res: Response,
  userId: number,
): Promise<void> {
  const session = await context.sessions.start(userId)
  context.cookie.set(res, session.token, session.expiresAt)
}
