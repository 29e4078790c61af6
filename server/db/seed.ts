import { count } from 'drizzle-orm'
import { hashPassword } from '../auth/passwords'
import type { DatabaseHandle } from './client'
import type { Queryable } from './queryable'
import { memberships, teams, users } from './schema'
import { seedDemoPlans } from './seed-plans'
import { seedDemoEvents } from './seed-events'
import { seedDemoResources } from './seed-resources'
import type { TeamRole } from '../../shared/schemas/teams'

// The demo sign-ins of docs/api.md. Invented team names and reserved .example addresses (RFC 2606).
export const demoPassword = 'loudhour-demo-2026'

interface DemoUserSpec {
  key: 'alderAdmin' | 'alderEditor' | 'alderViewer' | 'harborAdmin'
  email: string
  name: string
}

const demoUsers: DemoUserSpec[] = [
  { key: 'alderAdmin', email: 'admin@alder-creek.example', name: 'Rowan Alder (admin)' },
  { key: 'alderEditor', email: 'editor@alder-creek.example', name: 'Sam Creek (editor)' },
  { key: 'alderViewer', email: 'viewer@alder-creek.example', name: 'Jo Market (viewer)' },
  { key: 'harborAdmin', email: 'admin@harbor-lane.example', name: 'Kit Harbor (admin)' },
]

const demoTeams: {
  key: 'alder' | 'harbor'
  name: string
  members: [DemoUserSpec['key'], TeamRole][]
}[] = [
  {
    key: 'alder',
    name: 'Alder Creek Market Crew',
    members: [
      ['alderAdmin', 'admin'],
      ['alderEditor', 'editor'],
      ['alderViewer', 'viewer'],
    ],
  },
  { key: 'harbor', name: 'Harbor Lane Buskers', members: [['harborAdmin', 'admin']] },
]

/** What later seed steps can build on: the ids of the demo teams and users. */
export interface DemoAccounts {
  teamIds: Record<(typeof demoTeams)[number]['key'], number>
  userIds: Record<DemoUserSpec['key'], number>
  nowMs: number
}

/**
 * Seed steps that run after the accounts, in the same transaction. Rigs, plans and parts add
 * theirs here, e.g. `(tx, demo) => tx.insert(rigs).values({ teamId: demo.teamIds.alder, ... })`.
 * Steps must be synchronous (better-sqlite3 transactions commit at the first await).
 */
export type DemoSeedStep = (tx: Queryable, demo: DemoAccounts) => void
export const demoSeedSteps: DemoSeedStep[] = [seedDemoResources, seedDemoPlans, seedDemoEvents]

export interface DemoSignIn {
  email: string
  password: string
  teams: string
}

/** The sign-ins to print at start. */
export function demoSignIns(): DemoSignIn[] {
  return demoUsers.map((user) => ({
    email: user.email,
    password: demoPassword,
    teams: demoTeams
      .flatMap((team) =>
        team.members
          .filter(([key]) => key === user.key)
          .map(([, role]) => `${team.name} (${role})`),
      )
      .join(', '),
  }))
}

/**
 * Fills an empty database with the demo teams and users, all or nothing. Returns false when there
 * were users already (the seed runs on the first start only). The demo password skips the
 * strength check on purpose: it is published, and sign-up would refuse it.
 */
export async function seedDemo({ db }: DatabaseHandle, nowMs: number): Promise<boolean> {
  const isEmpty = () => (db.select({ users: count() }).from(users).get()?.users ?? 0) === 0
  if (!isEmpty()) return false
  // Hashing is slow and async, so it happens before the (synchronous) transaction.
  const hashedUsers = await Promise.all(
    demoUsers.map(async (user) => ({ ...user, passwordHash: await hashPassword(demoPassword) })),
  )
  return db.transaction((tx) => {
    if (!isEmpty()) return false
    const userIds = {} as DemoAccounts['userIds']
    for (const { key, ...user } of hashedUsers) {
      const row = tx
        .insert(users)
        // Seeded confirmed: the demo addresses receive no mail, and the demo must send some.
        .values({ ...user, emailVerifiedAtMs: nowMs, createdAtMs: nowMs, updatedAtMs: nowMs })
        .returning({ id: users.id })
        .get()
      userIds[key] = row.id
    }
    const teamIds = {} as DemoAccounts['teamIds']
    for (const team of demoTeams) {
      const row = tx
        .insert(teams)
        .values({ name: team.name, createdAtMs: nowMs, updatedAtMs: nowMs })
        .returning({ id: teams.id })
        .get()
      teamIds[team.key] = row.id
      for (const [userKey, role] of team.members) {
        tx.insert(memberships)
          .values({ teamId: row.id, userId: userIds[userKey], role, createdAtMs: nowMs })
          .run()
      }
    }
    for (const step of demoSeedSteps) step(tx, { teamIds, userIds, nowMs })
    return true
  })
}
