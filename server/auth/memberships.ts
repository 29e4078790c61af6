import { and, eq } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { memberships, teams } from '../db/schema'
import { teamRoles, type TeamRole } from '../../shared/schemas/teams'
import type { TeamView } from '../../shared/schemas/account-responses'

/** admin ⊃ editor ⊃ viewer: true when `role` may do what `minimum` may. */
export function roleAtLeast(role: TeamRole, minimum: TeamRole): boolean {
  return teamRoles.indexOf(role) >= teamRoles.indexOf(minimum)
}

export function roleOf(db: Queryable, teamId: number, userId: number): TeamRole | undefined {
  return db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .get()?.role
}

export function teamsOf(db: Queryable, userId: number): TeamView[] {
  return db
    .select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(teams.name, teams.id)
    .all()
}

/** The teams in which the user is an admin. */
export function adminTeamIds(db: Queryable, userId: number): number[] {
  return db
    .select({ teamId: memberships.teamId })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.role, 'admin')))
    .all()
    .map((row) => row.teamId)
}
