import { and, eq, gt, isNull } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { invitations, memberships, teams, users } from '../db/schema'
import { ApiError } from '../http/errors'
import { createLinkToken, hashLinkToken, invalidLinkToken } from '../auth/link-tokens'
import type {
  InvitationPreview,
  InvitationView,
  TeamView,
} from '../../shared/schemas/account-responses'
import type { InvitationCreateInput } from '../../shared/schemas/teams'

// Seven days: long enough to reach a crew member who only checks mail between events.
export const invitationLifetimeMs = 7 * 24 * 60 * 60 * 1000

function pending(nowMs: number) {
  return and(isNull(invitations.acceptedAtMs), gt(invitations.expiresAtMs, nowMs))
}

function toView(row: typeof invitations.$inferSelect): InvitationView {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    createdAt: new Date(row.createdAtMs).toISOString(),
    expiresAt: new Date(row.expiresAtMs).toISOString(),
  }
}

export function listPendingInvitations(
  db: Queryable,
  teamId: number,
  nowMs: number,
): InvitationView[] {
  return db
    .select()
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), pending(nowMs)))
    .orderBy(invitations.createdAtMs)
    .all()
    .map(toView)
}

/** Records an invitation, replacing any pending one for the same address; returns the link token. */
export function createInvitation(
  db: Queryable,
  teamId: number,
  invitedByUserId: number,
  input: InvitationCreateInput,
  nowMs: number,
): { invitation: InvitationView; token: string } {
  return db.transaction((tx) => {
    const alreadyMember = tx
      .select({ userId: users.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, teamId), eq(users.email, input.email)))
      .get()
    if (alreadyMember) {
      const message = 'This person is in the team already'
      throw new ApiError(409, 'already-member', `email: ${message}`, [{ path: 'email', message }])
    }
    tx.delete(invitations)
      .where(
        and(
          eq(invitations.teamId, teamId),
          eq(invitations.email, input.email),
          isNull(invitations.acceptedAtMs),
        ),
      )
      .run()
    const { token, tokenHash } = createLinkToken()
    const row = tx
      .insert(invitations)
      .values({
        teamId,
        email: input.email,
        role: input.role,
        tokenHash,
        invitedByUserId,
        createdAtMs: nowMs,
        expiresAtMs: nowMs + invitationLifetimeMs,
      })
      .returning()
      .get()
    return { invitation: toView(row), token }
  })
}

export function deleteInvitation(db: Queryable, teamId: number, invitationId: number): boolean {
  const result = db
    .delete(invitations)
    .where(
      and(
        eq(invitations.id, invitationId),
        eq(invitations.teamId, teamId),
        isNull(invitations.acceptedAtMs),
      ),
    )
    .run()
  return result.changes === 1
}

function findPending(db: Queryable, token: string, nowMs: number) {
  return db
    .select({ invitation: invitations, teamName: teams.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .where(and(eq(invitations.tokenHash, hashLinkToken(token)), pending(nowMs)))
    .get()
}

export function previewInvitation(db: Queryable, token: string, nowMs: number): InvitationPreview {
  const found = findPending(db, token, nowMs)
  if (!found) throw invalidLinkToken('invitation')
  return {
    teamName: found.teamName,
    email: found.invitation.email,
    role: found.invitation.role,
    expiresAt: new Date(found.invitation.expiresAtMs).toISOString(),
  }
}

/**
 * Spends the invitation and adds the user to the team, together. The user must be signed in
 * with the invited address: a forwarded link cannot bring someone else in.
 */
export function acceptInvitation(
  db: Queryable,
  token: string,
  user: { id: number; email: string },
  nowMs: number,
): TeamView {
  return db.transaction((tx) => {
    const found = findPending(tx, token, nowMs)
    if (!found) throw invalidLinkToken('invitation')
    const { invitation } = found
    if (invitation.email !== user.email) {
      throw new ApiError(
        403,
        'wrong-account',
        `This invitation is for ${invitation.email}; sign in with that address to accept it.`,
      )
    }
    tx.update(invitations)
      .set({ acceptedAtMs: nowMs, acceptedByUserId: user.id })
      .where(eq(invitations.id, invitation.id))
      .run()
    // Someone already in the team keeps the role they have.
    tx.insert(memberships)
      .values({
        teamId: invitation.teamId,
        userId: user.id,
        role: invitation.role,
        createdAtMs: nowMs,
      })
      .onConflictDoNothing()
      .run()
    const membership = tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.teamId, invitation.teamId), eq(memberships.userId, user.id)))
      .get()
    return {
      id: invitation.teamId,
      name: found.teamName,
      role: membership?.role ?? invitation.role,
    }
  })
}
