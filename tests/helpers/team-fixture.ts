import { hashPassword } from '../../server/auth/passwords'
import { sessionCookie } from '../../server/auth/session-cookie'
import { createSessionStore } from '../../server/auth/sessions'
import { issuePasswordReset } from '../../server/auth/password-resets'
import { memberships, teams, users } from '../../server/db/schema'
import { createInvitation } from '../../server/teams/invitations'
import type { TeamRole } from '../../shared/schemas/teams'
import { strongPassword } from './accounts'
import { seedDischargeLog } from './discharge-fixture'
import { seedPlanFixture } from './plan-fixture'
import { seedResourceFixture } from './resource-fixture'
import { seedShareLinkFixture } from './share-link-fixture'
import { createTestApp, testSessionSecret, type TestApp, type TestAppOptions } from './test-app'

export const signedInActors = ['viewer', 'editor', 'admin', 'other-team-admin'] as const
export type SignedInActor = (typeof signedInActors)[number]
export type Actor = 'anonymous' | SignedInActor

export interface TeamFixture {
  testApp: TestApp
  /** Cookie header per signed-in actor. */
  cookies: Record<SignedInActor, string>
  emails: Record<SignedInActor | 'target' | 'invitee', string>
  /** Values for the `:name` placeholders of matrix paths and bodies. */
  placeholders: Record<string, string>
}

let sharedHash: Promise<string> | undefined

/**
 * One team with a viewer, an editor, an admin and a second viewer to act on ("target"); a second
 * team with its own admin; a pending invitation and a reset link. Written straight into the
 * database (one argon2 hash shared by every user) so a fresh fixture per request stays cheap.
 */
export async function createTeamFixture(
  overrides: Record<string, string> = {},
  options: TestAppOptions = {},
): Promise<TeamFixture> {
  sharedHash ??= hashPassword(strongPassword)
  const passwordHash = await sharedHash
  const testApp = createTestApp(overrides, options)
  const { db } = testApp.database
  const nowMs = Date.now()
  const emails = {
    viewer: 'viewer@crew.example',
    editor: 'editor@crew.example',
    admin: 'admin@crew.example',
    'other-team-admin': 'admin@other-crew.example',
    target: 'target@crew.example',
    invitee: 'invitee@elsewhere.example',
  }
  const userId = (email: string, name: string) =>
    db
      .insert(users)
      .values({ email, name, passwordHash, createdAtMs: nowMs, updatedAtMs: nowMs })
      .returning()
      .get().id
  const ids = Object.fromEntries(
    Object.entries(emails).map(([key, email]) => [key, userId(email, key)]),
  ) as Record<keyof typeof emails, number>
  const team = (name: string) =>
    db.insert(teams).values({ name, createdAtMs: nowMs, updatedAtMs: nowMs }).returning().get().id
  const teamId = team('Crew')
  const otherTeamId = team('Other crew')
  const member = (team: number, user: number, role: TeamRole) =>
    db.insert(memberships).values({ teamId: team, userId: user, role, createdAtMs: nowMs }).run()
  member(teamId, ids.viewer, 'viewer')
  member(teamId, ids.editor, 'editor')
  member(teamId, ids.admin, 'admin')
  member(teamId, ids.target, 'viewer')
  member(otherTeamId, ids['other-team-admin'], 'admin')

  const store = createSessionStore(db, testSessionSecret, () => new Date())
  const cookieName = sessionCookie(testApp.env.PUBLIC_URL).name
  const cookies = {} as Record<SignedInActor, string>
  for (const actor of signedInActors) {
    cookies[actor] = `${cookieName}=${(await store.start(ids[actor])).token}`
  }
  const resourceIds = seedResourceFixture(db, teamId, ids.admin, nowMs)
  const logIds = seedDischargeLog(
    db,
    { teamId, packId: Number(resourceIds.packId), userId: ids.admin },
    nowMs,
  )
  const planIds = seedPlanFixture(db, teamId, ids.admin, nowMs)
  const invitation = createInvitation(
    db,
    teamId,
    ids.admin,
    { email: emails.invitee, role: 'viewer' },
    nowMs,
  )
  return {
    testApp,
    cookies,
    emails,
    placeholders: {
      teamId: String(teamId),
      userId: String(ids.target),
      invitationId: String(invitation.invitation.id),
      invitationToken: invitation.token,
      resetToken: issuePasswordReset(db, ids.target, nowMs),
      ...resourceIds,
      ...logIds,
      ...planIds,
      ...seedShareLinkFixture(db, Number(planIds.planId), ids.admin, nowMs),
    },
  }
}

/**
 * Replaces `:name` in a path, and whole-string `:name` values in a body, from the fixture; a
 * whole-string `#name` value becomes the placeholder as a number (ids in bodies, e.g. `rigId`).
 */
export function fillPlaceholders<T>(template: T, placeholders: Record<string, string>): T {
  const fill = (text: string) =>
    text.replace(/:([A-Za-z]+)/g, (whole, name: string) => placeholders[name] ?? whole)
  const numbered = typeof template === 'string' ? /^#([A-Za-z]+)$/.exec(template) : null
  if (numbered?.[1] && placeholders[numbered[1]] !== undefined) {
    return Number(placeholders[numbered[1]]) as T
  }
  if (typeof template === 'string') return fill(template) as T
  if (Array.isArray(template)) {
    return template.map((value) => fillPlaceholders(value, placeholders)) as T
  }
  if (template && typeof template === 'object') {
    return Object.fromEntries(
      Object.entries(template).map(([key, value]) => [key, fillPlaceholders(value, placeholders)]),
    ) as T
  }
  return template
}
