import { eq } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { memberships, sessions, teams, users } from '../db/schema'

export interface NewAccount {
  email: string
  name: string
  passwordHash: string
}

export function findUserByEmail(db: Queryable, email: string) {
  return db.select().from(users).where(eq(users.email, email)).get()
}

export function findUserById(db: Queryable, userId: number) {
  return db.select().from(users).where(eq(users.id, userId)).get()
}

/** A team with one admin. Call inside a transaction. */
export function createTeamWithAdmin(
  db: Queryable,
  name: string,
  adminUserId: number,
  nowMs: number,
): number {
  const team = db
    .insert(teams)
    .values({ name, createdAtMs: nowMs, updatedAtMs: nowMs })
    .returning({ id: teams.id })
    .get()
  db.insert(memberships)
    .values({ teamId: team.id, userId: adminUserId, role: 'admin', createdAtMs: nowMs })
    .run()
  return team.id
}

/** The user and their personal team, both or neither (hash the password before calling). */
export function createAccount(db: Queryable, account: NewAccount, nowMs: number): number {
  return db.transaction((tx) => {
    const user = tx
      .insert(users)
      .values({ ...account, createdAtMs: nowMs, updatedAtMs: nowMs })
      .returning({ id: users.id })
      .get()
    createTeamWithAdmin(tx, personalTeamName(account.name), user.id, nowMs)
    return user.id
  })
}

export function personalTeamName(personName: string): string {
  return `${personName}'s own team`.slice(0, 80)
}

/** Sets a new password hash and ends every session of the account, together. */
export function replacePassword(
  db: Queryable,
  userId: number,
  passwordHash: string,
  nowMs: number,
): void {
  db.transaction((tx) => {
    tx.update(users).set({ passwordHash, updatedAtMs: nowMs }).where(eq(users.id, userId)).run()
    tx.delete(sessions).where(eq(sessions.userId, userId)).run()
  })
}
