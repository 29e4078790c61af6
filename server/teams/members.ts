import { and, count, eq } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { memberships, users } from '../db/schema'
import { ApiError } from '../http/errors'
import type { MemberView } from '../../shared/schemas/account-responses'
import type { TeamRole } from '../../shared/schemas/teams'

export function listMembers(db: Queryable, teamId: number): MemberView[] {
  return db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      role: memberships.role,
      joinedAtMs: memberships.createdAtMs,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(users.name, users.id)
    .all()
    .map(({ joinedAtMs, ...member }) => ({
      ...member,
      joinedAt: new Date(joinedAtMs).toISOString(),
    }))
}

function memberRow(db: Queryable, teamId: number, userId: number) {
  return db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .get()
}

function memberNotFound(): ApiError {
  return new ApiError(404, 'member-not-found', 'This person is not a member of the team.')
}

// A team without an admin could never be managed again, so the last one stays.
function assertNotLastAdmin(
  db: Queryable,
  teamId: number,
  currentRole: TeamRole,
  action: string,
): void {
  if (currentRole !== 'admin') return
  const admins = db
    .select({ admins: count() })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'admin')))
    .get()
  if ((admins?.admins ?? 0) <= 1) {
    throw new ApiError(
      409,
      'last-admin',
      `The team's only admin cannot ${action}; make someone else admin first.`,
    )
  }
}

export function changeMemberRole(
  db: Queryable,
  teamId: number,
  userId: number,
  role: TeamRole,
): MemberView {
  return db.transaction((tx) => {
    const current = memberRow(tx, teamId, userId)
    if (!current) throw memberNotFound()
    if (role !== 'admin') assertNotLastAdmin(tx, teamId, current.role, 'be given a lower role')
    tx.update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
      .run()
    const member = listMembers(tx, teamId).find((candidate) => candidate.userId === userId)
    if (!member) throw memberNotFound()
    return member
  })
}

export function removeMember(db: Queryable, teamId: number, userId: number): void {
  db.transaction((tx) => {
    const current = memberRow(tx, teamId, userId)
    if (!current) throw memberNotFound()
    assertNotLastAdmin(tx, teamId, current.role, 'leave or be removed')
    tx.delete(memberships)
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
      .run()
  })
}
